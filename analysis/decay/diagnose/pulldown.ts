/**
 * Findings about the pull-down: target not reached, slow pull-down (restriction), oil hopping in
 * the coil, and freeze risk (a stall where water boils and freezes). Thresholds are common practice
 * with no published source unless a reference is named.
 */
import type { Finding } from "../types";
import { iceEquilibriumC } from "../../calculators/water";
import type { DiagnoseContext } from "./context";
import { runningMedian3 } from "../fit/median";
import { CAUTION_CODES, CAUTION_COMPRESSOR, CAUTION_NITROGEN, finding, fmt } from "./wording";

/** e-folding time of the best stretch of the pull-down above which it counts as slow (seconds). */
export const SLOW_PULLDOWN_TAU_SECONDS = 300;
/** Water at 0 °C boils below about 4,588 microns (triple point, 611.657 Pa; IAPWS). */
const TRIPLE_POINT_MICRONS = 4588;

export function pulldownFindings(ctx: DiagnoseContext): Finding[] {
  const range = ctx.phases.pulldownRange;
  const pd = ctx.phases.phases.pulldown;
  if (!range || !pd || range.endIndex - range.startIndex < 4) return [];
  const out: Finding[] = [];
  const t = ctx.tSeconds;
  const smooth = runningMedian3(ctx.microns, range.startIndex, range.endIndex);
  const at = (k: number) => t[range.startIndex + k];

  if (pd.lowestMicrons > ctx.profile.targetMicrons) {
    out.push(
      finding(
        "target_not_reached",
        "warning",
        "Target not reached",
        `The pull-down got no lower than ${fmt(pd.lowestMicrons)} microns, above the ${fmt(ctx.profile.targetMicrons)}-micron target. If the setup is known to be good, suspect the pump or its oil.`,
        { lowestMicrons: Math.round(pd.lowestMicrons), targetMicrons: ctx.profile.targetMicrons },
        [
          "Change the vacuum-pump oil (cloudy or yellow oil cannot pull deep).",
          "Do a blank-off test: the pump alone on the gauge should reach well below the target.",
          "Check the rig: hoses, hose gaskets, core tools and every fitting between pump and system.",
        ],
        [CAUTION_CODES],
        pd.endSeconds,
      ),
    );
  }

  // slow pull-down: the fastest halving of pressure between 20,000 and 1,500 microns
  let bestTau = Infinity;
  let j = 0;
  for (let i = 0; i < smooth.length; i++) {
    if (smooth[i] > 20000 || smooth[i] < 1500) continue;
    if (j < i) j = i;
    while (j < smooth.length && smooth[j] > smooth[i] / 2) j++;
    if (j >= smooth.length) break;
    bestTau = Math.min(bestTau, (at(j) - at(i)) / Math.LN2);
  }
  if (Number.isFinite(bestTau) && bestTau > SLOW_PULLDOWN_TAU_SECONDS) {
    out.push(
      finding(
        "slow_pulldown",
        "advice",
        "Slow pull-down",
        `Even at its fastest the pressure took ${(bestTau / 60).toFixed(1)} minutes to fall by a factor of e (${((bestTau * Math.LN10) / 60).toFixed(0)} minutes per factor of ten). Something restricts the flow between pump and system, or the pump is small for the system.`,
        { timeConstantSeconds: Math.round(bestTau), thresholdSeconds: SLOW_PULLDOWN_TAU_SECONDS },
        [
          "Remove the Schrader cores with vacuum-rated core tools.",
          "Take core depressors out of the hose ends.",
          "Use short, large-bore vacuum hoses; skip the manifold where you can.",
          "Pull from both service valves: a metering device between pump and gauge slows one side.",
        ],
      ),
    );
  }

  // oil hopping: reversals of tens of microns while between 70 and 300 microns
  const noise = ctx.phases.noiseFraction;
  let hops = 0;
  let biggest = 0;
  let trend = 0;
  let hi = -Infinity;
  let lo = Infinity;
  let firstHopAt: number | null = null;
  for (let k = 0; k < smooth.length; k++) {
    const v = smooth[k];
    if (v < 70 || v > 300) continue;
    const amp = Math.max(20, 5 * noise * v);
    hi = Math.max(hi, v);
    lo = Math.min(lo, v);
    if (trend <= 0 && v - lo >= amp) {
      if (trend < 0) {
        hops++;
        biggest = Math.max(biggest, v - lo);
        firstHopAt ??= at(k);
      }
      trend = 1;
      hi = v;
    } else if (trend >= 0 && hi - v >= amp) {
      trend = -1;
      lo = v;
    }
  }
  if (hops >= 2) {
    out.push(
      finding(
        "oil_oscillation",
        "advice",
        "Reading hops during the pull-down",
        `Between about 100 and 200 microns the reading rose and fell ${hops} times by up to ${fmt(biggest)} microns. That usually means oil lying in the evaporator tubes, boiling and settling.`,
        { hops, largestHopMicrons: Math.round(biggest) },
        ["Blow the oil out of the coil with nitrogen.", "Evacuate from both sides of the system."],
        [CAUTION_NITROGEN, CAUTION_CODES],
        firstHopAt,
      ),
    );
  }

  // freeze risk: a stall between 1,000 and 4,588 microns (water boiling, cooling itself, freezing)
  const stall = longestStall(smooth, at, 1000, TRIPLE_POINT_MICRONS);
  let lowAfter = Infinity;
  if (stall) for (let k = stall.endK; k < smooth.length; k++) if (smooth[k] < lowAfter) lowAfter = smooth[k];
  const cold = ctx.ambientC !== null && ctx.ambientC <= 5 && (ctx.verdict === "moisture" || ctx.verdict === "leak_and_moisture");
  if ((stall && stall.seconds >= 420 && lowAfter < 0.7 * stall.microns) || cold) {
    const level = stall?.microns ?? pd.lowestMicrons;
    const iceC = iceEquilibriumC(level);
    out.push(
      finding(
        "freeze_risk",
        "warning",
        "Moisture may have frozen",
        stall
          ? `The pull-down stalled near ${fmt(level)} microns for ${(stall.seconds / 60).toFixed(0)} minutes, then fell again. Below about 4,600 microns water boils, cools itself and can freeze; ice at ${fmt(level)} microns sits near ${iceC.toFixed(1)} °C and sublimes slowly. Melting ice shows later as a rise.`
          : `It is cold around the system (${ctx.ambientC!.toFixed(0)} °C) and the hold shows moisture: water in the circuit may have frozen instead of boiling off.`,
        { stallMicrons: Math.round(level), stallMinutes: stall ? Math.round(stall.seconds / 60) : null, iceEquilibriumC: Math.round(iceC * 10) / 10, ambientC: ctx.ambientC },
        ["Add heat: run the indoor blower, the outdoor fan, or warm the coil.", "Keep evacuating until the rise after isolation stays low."],
        [CAUTION_COMPRESSOR, CAUTION_CODES],
        stall ? stall.startSeconds : null,
      ),
    );
  }
  return out;
}

/** Longest stretch whose readings stay within ±6 % inside [lo, hi] microns (two-pointer scan, O(n)). */
function longestStall(v: ArrayLike<number>, at: (k: number) => number, lo: number, hi: number): { seconds: number; microns: number; startSeconds: number; endK: number } | null {
  let best: { seconds: number; microns: number; startSeconds: number; endK: number } | null = null;
  let s = 0;
  for (let k = 0; k < v.length; k++) {
    if (v[k] < lo || v[k] > hi) {
      s = k + 1;
      continue;
    }
    while (s < k && (v[s] > v[k] * 1.12 || v[s] < v[k] / 1.12)) s++;
    const seconds = at(k) - at(s);
    if (!best || seconds > best.seconds) best = { seconds, microns: v[Math.floor((s + k) / 2)], startSeconds: at(s), endK: k };
  }
  return best;
}
