/**
 * The planner beside a system's own record: for each vacuum test on the system (that the viewer
 * may see), the recorded pull-down from the first reading at or below 20,000 microns to the
 * target, and the plan for that test's rig, volume and condition over the same span — both shown.
 */
import { conditionFromHistory, type SystemCondition } from "@/analysis/calculators/planner-load";
import type { Db } from "@/db/client";
import { listPullDownsBySystem, listRigSetupsByIds } from "@/db/queries/planner-history";
import { getSystemById } from "@/db/queries/records";
import type { Viewer } from "@/db/queries/visibility";
import { AppError } from "@/lib/errors";
import { planRecordedPullDown, type RecordedPullDown } from "./recorded";

export type { RecordedPullDown } from "./recorded";

export interface PlannerHistory {
  system: { id: string; name: string };
  /** The condition the system's last decay test suggests for the next pull-down. */
  suggestion: { condition: SystemCondition; why: string } | null;
  pullDowns: RecordedPullDown[];
  /** Over the tests with both a recorded time and a plan: how many recorded within a factor of 2 of the likely plan. */
  summary: { compared: number; withinFactorTwo: number; medianRatio: number | null };
}

const MAX_TESTS = 30;

function median(xs: number[]): number | null {
  if (xs.length === 0) return null;
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** The planner history of one system; 404 for a system of another shop or none. */
export async function loadPlannerHistory(db: Db, params: { viewer: Viewer; systemId: string }): Promise<PlannerHistory> {
  const org = params.viewer.organizationId;
  const system = await getSystemById(db, { organizationId: org, systemId: params.systemId });
  if (!system) throw new AppError("not_found", "No such system.");
  const rows = await listPullDownsBySystem(db, { viewer: params.viewer, systemId: system.id, limit: MAX_TESTS });
  const rigIds = [...new Set(rows.map((r) => r.rigId).filter((x): x is string => Boolean(x)))];
  const setups = await listRigSetupsByIds(db, { organizationId: org, rigIds });

  const pullDowns = rows.map((row) =>
    planRecordedPullDown(row, system, row.rigId ? { items: setups.items.filter((i) => i.rigId === row.rigId), blankOffs: setups.blankOffs.filter((b) => b.rigId === row.rigId) } : null),
  );
  const ratios = pullDowns.map((p) => p.ratio).filter((r): r is number => r !== null);
  return {
    system: { id: system.id, name: system.name },
    suggestion: conditionFromHistory(rows.map((r) => r.verdict)),
    pullDowns,
    summary: { compared: ratios.length, withinFactorTwo: ratios.filter((r) => r >= 0.5 && r <= 2).length, medianRatio: median(ratios) },
  };
}
