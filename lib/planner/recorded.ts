/**
 * One recorded pull-down beside its plan: the recorded time from the first reading at or below
 * 20,000 microns to the target, and the plan for that test's rig, volume and condition over the
 * same span. Pure (the rows come from db/queries/planner-history.ts, or from the demo month).
 */
import { planPullDown, type PlannerInput } from "@/analysis/calculators/planner";
import { comparePlanWithPullDown } from "@/analysis/calculators/planner-compare";
import type { SystemCondition } from "@/analysis/calculators/planner-load";
import { conditionOfTest, isNewInstall, setupFromRig, volumeForPlan, type BlankOffForPlan, type RigItemForPlan } from "./setup";

export interface RecordedPullDown {
  testId: string;
  title: string;
  testedAt: string;
  technicianName: string;
  verdict: string | null;
  rigName: string | null;
  condition: SystemCondition | null;
  /** Where both were measured from (the first reading at or below 20,000 microns) and to. */
  fromMicrons: number | null;
  targetMicrons: number;
  /** Recorded seconds over that span; null when the log never reached the target. */
  recordedSeconds: number | null;
  /** The plan's seconds over the same span; null when it could not be planned (no rig, no volume). */
  plan: { fastSeconds: number | null; likelySeconds: number | null; slowSeconds: number | null } | null;
  /** Recorded ÷ the plan's likely time. */
  ratio: number | null;
  /** What the plan was made from, in words. */
  assumptions: string[];
  /** Why there is no plan, when there is none. */
  notPlanned: string | null;
}

export interface RecordedTestRow {
  id: string;
  title: string;
  testedAt: Date;
  technicianName: string;
  verdict: string | null;
  lineSetFeet: number | null;
  liquidOd: string | null;
  suctionOd: string | null;
  volumeLitres: number | null;
  jobReason: string | null;
  rigId: string | null;
  rigName: string | null;
  targetMicrons: number | null;
  pulldownEndSeconds: number | null;
  series: { t: number[]; p: number[] } | null;
}

export interface SystemForPlan {
  lineSetFeet: number | null;
  liquidOd: string | null;
  suctionOd: string | null;
  indoorCoilLitres: number | null;
  outdoorUnitLitres: number | null;
}

/** The recorded pull-down of one test beside the plan for its rig, volume and condition (see the file comment). */
export function planRecordedPullDown(row: RecordedTestRow, system: SystemForPlan, rig: { items: RigItemForPlan[]; blankOffs: BlankOffForPlan[] } | null): RecordedPullDown {
  const targetMicrons = row.targetMicrons ?? 500;
  const base = { testId: row.id, title: row.title, testedAt: row.testedAt.toISOString(), technicianName: row.technicianName, verdict: row.verdict, rigName: row.rigName ?? null, targetMicrons };
  const end = row.pulldownEndSeconds;
  const real = { tSeconds: [] as number[], microns: [] as number[] };
  if (row.series && end !== null)
    for (let i = 0; i < row.series.t.length && row.series.t[i] <= end; i++) {
      real.tSeconds.push(row.series.t[i]);
      real.microns.push(row.series.p[i]);
    }
  const newInstall = isNewInstall(row.jobReason, row.title);
  const condition = conditionOfTest(row.verdict, newInstall);
  const volume = volumeForPlan(row, system, newInstall);
  const setup = rig ? setupFromRig(rig.items, rig.blankOffs, base.testedAt.slice(0, 10)) : null;
  const notPlanned = real.microns.length < 3 ? "No pull-down in this log." : !setup ? (row.rigId ? "The rig has no pump or hoses recorded." : "No rig recorded for this test.") : !volume ? "No line set or volume recorded." : null;
  if (notPlanned || !setup || !volume) return { ...base, condition: null, fromMicrons: null, recordedSeconds: null, plan: null, ratio: null, assumptions: [], notPlanned };
  const input: PlannerInput = { volumeLitres: volume.litres, ...setup.setup, targetMicrons, condition: condition.condition, lineSet: volume.lineSet };
  const cmp = comparePlanWithPullDown(planPullDown(input), real);
  return {
    ...base,
    condition: condition.condition,
    fromMicrons: cmp.alignedAtMicrons,
    recordedSeconds: cmp.realSecondsToTarget,
    plan: { fastSeconds: cmp.planSecondsToTarget.fast, likelySeconds: cmp.planSecondsToTarget.likely, slowSeconds: cmp.planSecondsToTarget.slow },
    ratio: cmp.slowdownFactor,
    assumptions: [volume.words, ...setup.words, condition.words],
    notPlanned: null,
  };
}
