/** A system's history: every visible test on it, newest first, each with a small curve to overlay. */
import type { Db } from "@/db/client";
import { getSiteById, getSystemById } from "@/db/queries/records";
import { listTestsBySystem } from "@/db/queries/system-history";
import type { Viewer } from "@/db/queries/visibility";
import { hiddenPracticeTestIds } from "@/lib/practice/gate";
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
  // The practice gate: an apprentice sees an uncalled practice test's curve, never its verdict or numbers.
  const { viewer } = params;
  const hidden = await hiddenPracticeTestIds(db, { organizationId: org, userId: viewer.userId, role: viewer.role, testIds: tests.filter((t) => t.isPractice).map((t) => t.id) });
  return {
    system,
    site,
    tests: tests.map(({ series, ...t }) => {
      const closed = hidden.has(t.id);
      return {
        ...t,
        ...(closed ? { verdict: null, isolationAt: null, endMicrons: null, leakRateMicronsPerMinute: null, meetsProfile: null } : {}),
        testedAt: t.testedAt.toISOString(),
        /** Set while the viewer must make their practice call before the analysis shows. */
        practiceCallUrl: closed ? `/practice/${t.id}` : null,
        // Time from isolation, so holds of different pull-downs line up when overlaid (the raw curve while the call is pending).
        curve: sparklineOf(series, { isolationAtSeconds: closed ? null : t.isolationAt, limitMicrons: null, points: OVERLAY_POINTS }),
      };
    }),
  };
}
export type SystemHistory = NonNullable<Awaited<ReturnType<typeof systemHistoryOf>>>;
