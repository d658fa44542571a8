/**
 * A plan beside a real pull-down: when the real curve is slower than the plan's slow end, say
 * where it lags and what that usually means (restriction, leak, moisture).
 *
 * Method: both curves are aligned at the real log's first reading at or below 20,000 microns
 * (many micron gauges only read below about that), and the time each takes from there to
 * 5,000 microns, and from 5,000 microns to the target, is compared. Below about 4,600 microns
 * water at 0 °C boils, so a curve that keeps up above 5,000 and lags below it points to water;
 * one that lags from the start points to a restriction or the pump.
 * Thresholds (our own rule, common practice, no published source): slower than the plan's slow
 * end by SLOW_END_MARGIN or more is "much slower"; the factors are against the likely case.
 */
import { durationWords } from "../shared/format";
import type { Finding } from "../decay/types";
import type { Plan } from "./planner";

/** Real ÷ likely plan above which the part above or below 5,000 microns counts as lagging. */
export const MUCH_SLOWER_FACTOR = 3;
/** Real time ÷ the slow end's time above which the pull-down is "much slower than planned". */
export const SLOW_END_MARGIN = 1.2;
const ALIGN_BELOW_MICRONS = 20_000;
const WATER_LEVEL_MICRONS = 5_000;

export interface PlanComparison {
  /** Real time ÷ the likely plan's time from the alignment reading to the target (null if the real one never got there). */
  slowdownFactor: number | null;
  /** Seconds from the alignment reading to the target: real, and the plan's fast end, likely case and slow end. */
  realSecondsToTarget: number | null;
  planSecondsToTarget: { fast: number | null; likely: number | null; slow: number | null };
  /** The same ratio above 5,000 microns and from 5,000 microns to the target. */
  upperFactor: number | null;
  lowerFactor: number | null;
  alignedAtMicrons: number | null;
  /** The plan curve shifted in time to start where the real curve was aligned (for overlays). */
  planOnRealTime: { tSeconds: number[]; microns: number[] } | null;
  findings: Finding[];
}

/** Plan time at a pressure, interpolated in ln(p) on the falling plan curve (the likely case unless another curve is given). */
export function planSecondsAt(plan: Plan, microns: number, curve: { tSeconds: number[]; microns: number[] } = plan.curve): number | null {
  const { tSeconds: t, microns: p } = curve;
  if (microns >= p[0]) return 0;
  for (let i = 1; i < p.length; i++)
    if (p[i] <= microns) {
      const f = (Math.log(p[i - 1]) - Math.log(microns)) / (Math.log(p[i - 1]) - Math.log(p[i]));
      return t[i - 1] + f * (t[i] - t[i - 1]);
    }
  return null;
}

/** First time the real series is at or below a pressure, interpolated linearly between readings. */
function realSecondsAt(real: { tSeconds: number[]; microns: number[] }, microns: number, from: number): number | null {
  for (let i = Math.max(from, 1); i < real.microns.length; i++)
    if (real.microns[i] <= microns) {
      const a = real.microns[i - 1];
      const b = real.microns[i];
      const f = a === b ? 1 : (a - microns) / (a - b);
      return real.tSeconds[i - 1] + Math.min(1, Math.max(0, f)) * (real.tSeconds[i] - real.tSeconds[i - 1]);
    }
  return null;
}

const ratio = (real: number | null, planned: number | null) => (real !== null && planned !== null && planned > 0 ? real / planned : null);

/** Compare a plan with a real pull-down (seconds, microns; the part before isolation). */
export function comparePlanWithPullDown(plan: Plan, real: { tSeconds: number[]; microns: number[] }): PlanComparison {
  const empty: PlanComparison = {
    slowdownFactor: null,
    realSecondsToTarget: null,
    planSecondsToTarget: { fast: null, likely: null, slow: null },
    upperFactor: null,
    lowerFactor: null,
    alignedAtMicrons: null,
    planOnRealTime: null,
    findings: [],
  };
  if (real.microns.length < 2) return empty;
  let a = real.microns.findIndex((m) => m <= ALIGN_BELOW_MICRONS);
  if (a < 0) a = 0;
  const pA = real.microns[a];
  const target = plan.input.targetMicrons;
  const tRealA = real.tSeconds[a];
  const tPlanA = planSecondsAt(plan, pA);
  if (tPlanA === null || pA <= target) return { ...empty, alignedAtMicrons: pA };

  const planTo = (m: number) => {
    const t = planSecondsAt(plan, m);
    return t === null ? null : t - tPlanA;
  };
  const realTo = (m: number) => {
    const t = realSecondsAt(real, m, a + 1);
    return t === null ? null : t - tRealA;
  };
  const planTarget = planTo(target);
  const realTarget = realTo(target);
  const slowdownFactor = ratio(realTarget, planTarget);
  const caseTo = (key: "fast" | "slow") => {
    const c = plan.cases.find((x) => x.key === key);
    if (!c) return null;
    const a0 = planSecondsAt(plan, pA, c.curve);
    const a1 = planSecondsAt(plan, target, c.curve);
    return a0 === null || a1 === null ? null : a1 - a0;
  };
  const planSecondsToTarget = { fast: caseTo("fast"), likely: planTarget, slow: caseTo("slow") };
  const slowEnd = planSecondsToTarget.slow ?? planTarget;
  let upperFactor: number | null = null;
  let lowerFactor: number | null = null;
  if (pA > WATER_LEVEL_MICRONS && WATER_LEVEL_MICRONS > target) {
    const p5 = planTo(WATER_LEVEL_MICRONS);
    const r5 = realTo(WATER_LEVEL_MICRONS);
    upperFactor = ratio(r5, p5);
    if (r5 !== null && p5 !== null && realTarget !== null && planTarget !== null) lowerFactor = ratio(realTarget - r5, planTarget - p5);
  }
  // The plan from the alignment pressure on, moved onto the real log's clock.
  const planOnRealTime = { tSeconds: [tRealA], microns: [pA] };
  plan.curve.tSeconds.forEach((t, i) => {
    if (t > tPlanA) {
      planOnRealTime.tSeconds.push(t - tPlanA + tRealA);
      planOnRealTime.microns.push(plan.curve.microns[i]);
    }
  });

  const findings: Finding[] = [];
  const realSpan = real.tSeconds[real.tSeconds.length - 1] - tRealA;
  const evidence = {
    plannedSecondsToTarget: planTarget,
    realSecondsToTarget: realTarget,
    slowdownFactor,
    upperFactor,
    lowerFactor,
    alignedAtMicrons: pA,
    targetMicrons: target,
  };
  const moistureLikely = upperFactor !== null && upperFactor < MUCH_SLOWER_FACTOR && (lowerFactor ?? Infinity) >= MUCH_SLOWER_FACTOR;
  const checks = moistureLikely
    ? [
        "It kept up with the plan above 5,000 microns and lagged below: water boiling off is the usual cause. Keep evacuating and add heat (indoor blower, outdoor fan).",
        "Never run the compressor under vacuum.",
        "If it still lags, isolate and watch the rise: a plateau means moisture, a steady climb a leak.",
      ]
    : [
        "Look for restrictions: cores left in, core depressors in hose ends, long or narrow hoses, a manifold in the path.",
        "Test the rig alone: pump blank-off with the gauge on the pump, then with the hoses capped (gaskets, core tools).",
        "Check the pump oil: cloudy or yellow oil slows a pump down; change it.",
      ];
  if (realTarget !== null && slowEnd !== null && realTarget >= SLOW_END_MARGIN * slowEnd && slowdownFactor !== null) {
    findings.push({
      code: "pull_down_much_slower_than_plan",
      severity: "advice",
      title: `Pull-down ${slowdownFactor.toFixed(1)}× slower than planned`,
      message: `From ${Math.round(pA).toLocaleString("en-US")} microns the real pull-down took ${durationWords(realTarget)} to reach ${target} microns; the plan's slow end is ${durationWords(slowEnd)} (likely ${planTarget !== null ? durationWords(planTarget) : "never"}).`,
      evidence,
      checks,
      cautions: ["Never energise the compressor while the system is in deep vacuum."],
    });
  } else if (realTarget === null && slowEnd !== null && realSpan >= SLOW_END_MARGIN * slowEnd) {
    findings.push({
      code: "target_not_reached_planned",
      severity: "warning",
      title: "Target not reached in far more than the planned time",
      message: `From ${Math.round(pA).toLocaleString("en-US")} microns the plan reaches ${target} microns in ${durationWords(slowEnd)} at its slow end; the real pull-down had ${durationWords(realSpan)} and never got there.`,
      evidence,
      checks: [
        "Check the rig's history: pump oil changes and blank-off trend.",
        ...checks,
      ],
      cautions: ["Never energise the compressor while the system is in deep vacuum."],
    });
  }
  return { slowdownFactor, realSecondsToTarget: realTarget, planSecondsToTarget, upperFactor, lowerFactor, alignedAtMicrons: pA, planOnRealTime, findings };
}
