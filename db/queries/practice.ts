/**
 * Practice calls: an apprentice's own reading of a practice test, recorded before the verdict
 * is shown, and comments on it. Every query is scoped by organization inside the query.
 */
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { analyses, practiceCalls, practiceComments, user, vacuumTests, type PracticeCall } from "@/db/schema";
import { visibleTestsWhere, type Viewer } from "./visibility";
import type { Verdict } from "@/db/vocabulary";

/** The practice flag of one test of the organization, or null when there is no such test. */
export async function getPracticeFlagByTest(db: Db, params: { organizationId: string; testId: string }) {
  const [row] = await db
    .select({ isPractice: vacuumTests.isPractice })
    .from(vacuumTests)
    .where(and(eq(vacuumTests.organizationId, params.organizationId), eq(vacuumTests.id, params.testId)))
    .limit(1);
  return row ?? null;
}

/**
 * Of the given tests, those that are practice tests the apprentice has not called yet
 * (their verdict must stay hidden from that apprentice).
 */
export async function listUncalledPracticeTestIdsByApprentice(db: Db, params: { organizationId: string; apprenticeId: string; testIds: string[] }): Promise<string[]> {
  if (params.testIds.length === 0) return [];
  const rows = await db
    .select({ id: vacuumTests.id })
    .from(vacuumTests)
    .where(
      and(
        eq(vacuumTests.organizationId, params.organizationId),
        inArray(vacuumTests.id, params.testIds),
        eq(vacuumTests.isPractice, true),
        sql`not exists (select 1 from ${practiceCalls} c where c.test_id = ${vacuumTests.id} and c.apprentice_id = ${params.apprenticeId} and c.organization_id = ${params.organizationId})`,
      ),
    );
  return rows.map((r) => r.id);
}

export async function getPracticeCallByTestAndApprentice(db: Db, params: { organizationId: string; testId: string; apprenticeId: string }) {
  const [row] = await db
    .select()
    .from(practiceCalls)
    .where(and(eq(practiceCalls.organizationId, params.organizationId), eq(practiceCalls.testId, params.testId), eq(practiceCalls.apprenticeId, params.apprenticeId)))
    .limit(1);
  return row ?? null;
}

export async function getPracticeCallById(db: Db, params: { organizationId: string; callId: string }) {
  const [row] = await db
    .select()
    .from(practiceCalls)
    .where(and(eq(practiceCalls.organizationId, params.organizationId), eq(practiceCalls.id, params.callId)))
    .limit(1);
  return row ?? null;
}

/** Record a call; returns null when this apprentice already called this test (first call stands). */
export async function insertPracticeCall(
  db: Db,
  params: { organizationId: string; testId: string; apprenticeId: string; call: PracticeCall; reason: string; analysisVerdict: Verdict; matched: boolean },
) {
  const [row] = await db.insert(practiceCalls).values(params).onConflictDoNothing().returning();
  return row ?? null;
}

/** Practice tests the viewer may see, newest first, with the viewer's own call if any. */
export async function listPracticeTestsByViewer(db: Db, params: { viewer: Viewer; limit: number }) {
  return db
    .select({
      id: vacuumTests.id,
      title: vacuumTests.title,
      testedAt: vacuumTests.testedAt,
      technicianId: vacuumTests.createdById,
      technicianName: user.name,
      callId: practiceCalls.id,
      call: practiceCalls.call,
      matched: practiceCalls.matched,
    })
    .from(vacuumTests)
    .innerJoin(user, eq(user.id, vacuumTests.createdById))
    .leftJoin(
      practiceCalls,
      and(eq(practiceCalls.testId, vacuumTests.id), eq(practiceCalls.apprenticeId, params.viewer.userId), eq(practiceCalls.organizationId, vacuumTests.organizationId)),
    )
    .where(and(visibleTestsWhere(params.viewer), eq(vacuumTests.isPractice, true)))
    .orderBy(desc(vacuumTests.testedAt), desc(vacuumTests.id))
    .limit(params.limit);
}

/** Calls of the organization (optionally one apprentice's), newest first, with names. */
export async function listPracticeCallsByOrganization(db: Db, params: { organizationId: string; apprenticeId?: string; limit: number }) {
  const conds = [eq(practiceCalls.organizationId, params.organizationId)];
  if (params.apprenticeId) conds.push(eq(practiceCalls.apprenticeId, params.apprenticeId));
  return db
    .select({
      call: practiceCalls,
      apprenticeName: user.name,
      testTitle: vacuumTests.title,
      analysisVerdictNow: analyses.verdict,
    })
    .from(practiceCalls)
    .innerJoin(user, eq(user.id, practiceCalls.apprenticeId))
    .innerJoin(vacuumTests, and(eq(vacuumTests.id, practiceCalls.testId), eq(vacuumTests.organizationId, practiceCalls.organizationId)))
    .leftJoin(analyses, and(eq(analyses.id, vacuumTests.currentAnalysisId), eq(analyses.organizationId, vacuumTests.organizationId)))
    .where(and(...conds))
    .orderBy(desc(practiceCalls.createdAt), desc(practiceCalls.id))
    .limit(params.limit);
}

export async function insertPracticeComment(db: Db, params: { organizationId: string; callId: string; authorId: string; body: string }) {
  const [row] = await db.insert(practiceComments).values(params).returning();
  return row;
}

export async function listPracticeCommentsByCalls(db: Db, params: { organizationId: string; callIds: string[] }) {
  if (params.callIds.length === 0) return [];
  return db
    .select({ comment: practiceComments, authorName: user.name })
    .from(practiceComments)
    .innerJoin(user, eq(user.id, practiceComments.authorId))
    .where(and(eq(practiceComments.organizationId, params.organizationId), inArray(practiceComments.callId, params.callIds)))
    .orderBy(asc(practiceComments.createdAt));
}
