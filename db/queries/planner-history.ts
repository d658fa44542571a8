import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { analyses, jobs, rigEvents, rigItems, rigs, sites, systems, testRigs, user, vacuumTests } from "@/db/schema";
import { visibleTestsWhere, type Viewer } from "./visibility";

/** One system of the shop, with its site, for the planner's picker. */
export async function listSystemsForPlannerByOrganization(db: Db, params: { organizationId: string }) {
  return db
    .select({
      id: systems.id,
      name: systems.name,
      siteName: sites.name,
      lineSetFeet: systems.lineSetFeet,
      liquidOd: systems.liquidOd,
      suctionOd: systems.suctionOd,
      indoorCoilLitres: systems.indoorCoilLitres,
      outdoorUnitLitres: systems.outdoorUnitLitres,
    })
    .from(systems)
    .innerJoin(sites, and(eq(sites.id, systems.siteId), eq(sites.organizationId, systems.organizationId)))
    .where(eq(systems.organizationId, params.organizationId))
    .orderBy(asc(sites.name), asc(systems.name));
}

/**
 * The vacuum tests on one system the viewer may see (practice tests left out), newest first, with
 * what the planner needs: the line set and volume recorded on the test, the job's reason, the rig,
 * the current analysis's pull-down phase, target and series.
 */
export async function listPullDownsBySystem(db: Db, params: { viewer: Viewer; systemId: string; limit: number }) {
  const org = params.viewer.organizationId;
  return db
    .select({
      id: vacuumTests.id,
      title: vacuumTests.title,
      testedAt: vacuumTests.testedAt,
      verdict: vacuumTests.verdict,
      technicianName: user.name,
      lineSetFeet: vacuumTests.lineSetFeet,
      liquidOd: vacuumTests.liquidOd,
      suctionOd: vacuumTests.suctionOd,
      volumeLitres: vacuumTests.volumeLitres,
      jobReason: jobs.reason,
      rigId: testRigs.rigId,
      rigName: rigs.name,
      targetMicrons: sql<number | null>`(${analyses.profile}->>'targetMicrons')::float8`,
      pulldownEndSeconds: sql<number | null>`(${analyses.result}->'phases'->'pulldown'->>'endSeconds')::float8`,
      series: analyses.series,
    })
    .from(vacuumTests)
    .innerJoin(user, eq(user.id, vacuumTests.createdById))
    .leftJoin(analyses, and(eq(analyses.id, vacuumTests.currentAnalysisId), eq(analyses.organizationId, org)))
    .leftJoin(jobs, and(eq(jobs.id, vacuumTests.jobId), eq(jobs.organizationId, org)))
    .leftJoin(testRigs, and(eq(testRigs.testId, vacuumTests.id), eq(testRigs.organizationId, org)))
    .leftJoin(rigs, and(eq(rigs.id, testRigs.rigId), eq(rigs.organizationId, org)))
    .where(and(visibleTestsWhere(params.viewer), eq(vacuumTests.systemId, params.systemId), eq(vacuumTests.isPractice, false)))
    .orderBy(desc(vacuumTests.testedAt), desc(vacuumTests.id))
    .limit(params.limit);
}

/** The equipment of some rigs and their blank-off tests (oldest first), for the planner's setup of each test. */
export async function listRigSetupsByIds(db: Db, params: { organizationId: string; rigIds: string[] }) {
  if (params.rigIds.length === 0) return { items: [], blankOffs: [] };
  const [items, blankOffs] = await Promise.all([
    db
      .select({ rigId: rigItems.rigId, id: rigItems.id, kind: rigItems.kind, freeAirCfm: rigItems.freeAirCfm, blankOffRatingMicrons: rigItems.blankOffRatingMicrons, insideDiameterIn: rigItems.insideDiameterIn, lengthFt: rigItems.lengthFt })
      .from(rigItems)
      .where(and(eq(rigItems.organizationId, params.organizationId), inArray(rigItems.rigId, params.rigIds))),
    db
      .select({ rigId: rigEvents.rigId, itemId: rigEvents.itemId, occurredOn: rigEvents.occurredOn, lowestMicrons: rigEvents.lowestMicrons })
      .from(rigEvents)
      .where(and(eq(rigEvents.organizationId, params.organizationId), inArray(rigEvents.rigId, params.rigIds), eq(rigEvents.kind, "blank_off")))
      .orderBy(asc(rigEvents.occurredOn)),
  ]);
  return { items, blankOffs };
}
