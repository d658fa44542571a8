/** Tests for the overlay: the viewer's visible ones among the requested ids, with their current analysis. */
import { and, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { analyses, user, vacuumTests } from "@/db/schema";
import { visibleTestsWhere, type Viewer } from "./visibility";

/** Visible tests among testIds (any order; others, unknown or from another organization are left out). */
export async function listOverlayTestsByIds(db: Db, params: { viewer: Viewer; testIds: string[] }) {
  if (params.testIds.length === 0) return [];
  return db
    .select({
      id: vacuumTests.id,
      title: vacuumTests.title,
      testedAt: vacuumTests.testedAt,
      isPractice: vacuumTests.isPractice,
      technicianName: user.name,
      result: analyses.result,
      series: analyses.series,
    })
    .from(vacuumTests)
    .innerJoin(user, eq(user.id, vacuumTests.createdById))
    .innerJoin(analyses, and(eq(analyses.id, vacuumTests.currentAnalysisId), eq(analyses.organizationId, vacuumTests.organizationId)))
    .where(and(visibleTestsWhere(params.viewer), inArray(vacuumTests.id, params.testIds)));
}
