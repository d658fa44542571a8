/** A system's history: every visible test on it, newest first, each with a small curve to overlay. */
import type { Db } from "@/db/client";
import { getSiteById, getSystemById } from "@/db/queries/records";
import { listTestsBySystem } from "@/db/queries/system-history";
import type { Viewer } from "@/db/queries/visibility";
import { sparklineOf } from "@/lib/review/sparkline";

/** Points per overlaid curve: enough for the shape, small enough for dozens of tests. */
const OVERLAY_POINTS = 160;

export async function systemHistoryOf(db: Db, params: { viewer: Viewer; systemId: string }) {
  const org = params.viewer.organizationId;
  const system = await getSystemById(db, { organizationId: org, systemId: params.systemId });
  if (!system) return null;
  const [site, tests] = await Promise.all([
    getSiteById(db, { organizationId: org, siteId: system.siteId }),
    listTestsBySystem(db, { viewer: params.viewer, systemId: system.id, limit: 200 }),
  ]);
  return {
    system,
    site,
    tests: tests.map(({ series, ...t }) => ({
      ...t,
      testedAt: t.testedAt.toISOString(),
      // Time from isolation, so holds of different pull-downs line up when overlaid.
      curve: sparklineOf(series, { isolationAtSeconds: t.isolationAt, limitMicrons: null, points: OVERLAY_POINTS }),
    })),
  };
}
export type SystemHistory = NonNullable<Awaited<ReturnType<typeof systemHistoryOf>>>;
