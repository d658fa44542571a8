import { and, desc, eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { analyses, user, vacuumTests } from "@/db/schema";
import { visibleTestsWhere, type Viewer } from "./visibility";

/** Every test the viewer may see that was run on one system, newest first, with its curve. */
export async function listTestsBySystem(db: Db, params: { viewer: Viewer; systemId: string; limit: number }) {
  return db
    .select({
      id: vacuumTests.id,
      title: vacuumTests.title,
      status: vacuumTests.status,
      verdict: vacuumTests.verdict,
      testedAt: vacuumTests.testedAt,
      isPractice: vacuumTests.isPractice,
      technicianName: user.name,
      isolationAt: analyses.isolationAt,
      endMicrons: sql<number | null>`(${analyses.result}->'decay'->>'endMicrons')::float8`,
      leakRateMicronsPerMinute: sql<number | null>`(${analyses.result}->'decay'->>'leakRateMicronsPerMinute')::float8`,
      meetsProfile: sql<boolean | null>`(${analyses.result}->>'meetsProfile')::boolean`,
      series: analyses.series,
    })
    .from(vacuumTests)
    .innerJoin(user, eq(user.id, vacuumTests.createdById))
    .leftJoin(analyses, and(eq(analyses.id, vacuumTests.currentAnalysisId), eq(analyses.organizationId, vacuumTests.organizationId)))
    .where(and(visibleTestsWhere(params.viewer), eq(vacuumTests.systemId, params.systemId)))
    .orderBy(desc(vacuumTests.testedAt), desc(vacuumTests.id))
    .limit(params.limit);
}
