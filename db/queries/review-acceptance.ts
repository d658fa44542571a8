/**
 * What the sign-off rule reads of a test's current analysis: the curve's verdict and whether the
 * profile was met. Read inside the review transaction, after the test row is locked, so a
 * re-analysis cannot slip between the check and the sign-off.
 */
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { analyses, testEvents, user, vacuumTests, type TestEventKind } from "@/db/schema";

export async function getSignOffFactsByTest(db: Db, params: { organizationId: string; testId: string }): Promise<{ verdict: string | null; meetsProfile: boolean | null }> {
  const [row] = await db
    .select({
      verdict: sql<string | null>`coalesce(${analyses.verdict}, ${vacuumTests.verdict})`,
      meetsProfile: sql<boolean | null>`(${analyses.result}->>'meetsProfile')::boolean`,
    })
    .from(vacuumTests)
    .leftJoin(analyses, and(eq(analyses.id, vacuumTests.currentAnalysisId), eq(analyses.organizationId, vacuumTests.organizationId)))
    .where(and(eq(vacuumTests.organizationId, params.organizationId), eq(vacuumTests.id, params.testId)));
  return row ?? { verdict: null, meetsProfile: null };
}

/** The newest event of one of these kinds on a test, with who made it (null: none). */
export async function getLatestReviewEventByTest(db: Db, params: { organizationId: string; testId: string; kinds: TestEventKind[] }) {
  const [row] = await db
    .select({ kind: testEvents.kind, at: testEvents.createdAt, note: testEvents.note, actorName: user.name })
    .from(testEvents)
    .leftJoin(user, eq(user.id, testEvents.actorId))
    .where(and(eq(testEvents.organizationId, params.organizationId), eq(testEvents.testId, params.testId), inArray(testEvents.kind, params.kinds)))
    .orderBy(desc(testEvents.createdAt))
    .limit(1);
  return row ?? null;
}
