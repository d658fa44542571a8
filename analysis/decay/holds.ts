/**
 * What field logs add to the verdict on a hold: the spikes left out of the fit (one or two wild readings
 * from a bumped hose, never the end of a hold), a hold that climbed out of the gauge's range soon after
 * isolation (a gross leak, its rate a lower bound), and the reasons when a re-pull left several holds.
 * Rules: common practice, no published source.
 */
import type { Classification, HoldEvidence } from "./classify";
import { chosenFit } from "./classify";
import { calibratedConfidence, certaintyWordsOf, FEATURE_NAMES, type ConfidenceEvidence } from "./confidence";
import { groupedInteger } from "../shared/format";
import type { PhaseAnalysis } from "./phases";
import { MIN_HOLD_READINGS } from "./profile";
import type { AcceptanceProfile, Decay, HoldFitResult } from "./types";

/** 1 where the chosen fit left a reading of the hold out as a spike (indices from the hold's first reading). */
export function spikeMask(fit: HoldFitResult | null, n: number): Uint8Array {
  const mask = new Uint8Array(n);
  const m = chosenFit(fit);
  if (m) for (const i of m.excluded) if (i >= 0 && i < n) mask[i] = 1;
  return mask;
}

/** Seconds (from the first data row) of the readings the chosen fit left out as spikes. */
export function spikeSecondsOf(fit: HoldFitResult | null, t: number[], start: number): number[] {
  const m = chosenFit(fit);
  return m ? m.excluded.map((i) => t[start + i]) : [];
}

/** The last `count` readings of p[from..to] not marked in `skip` (indexed from `from`), in time order. */
export function lastReadings(p: number[], from: number, to: number, skip: Uint8Array, count: number): number[] {
  const out: number[] = [];
  for (let i = to; i >= from && out.length < count; i--) if (!skip[i - from]) out.unshift(p[i]);
  return out.length > 0 ? out : [p[to]];
}

const fmt = (x: number): string => groupedInteger(Math.round(x));
const minutes = (s: number): string => (s / 60).toFixed(1);

/**
 * A hold that climbed out of the gauge's range within the profile's hold time is a gross leak or an open
 * valve, however few readings it kept in range (three are enough: isolation and two on the way up). Its
 * climb is given as a lower bound: the rise from isolation to the last reading in range, over the time
 * from isolation to the first reading over range, (p_last − p_iso) / (t_over − t_iso), microns per minute;
 * at t_over the pressure was at least p_last, so the mean climb up to then was at least that. With enough
 * readings for a fit, the fitted climb is given when it is higher.
 */
function grossLeak(c: Classification, pa: PhaseAnalysis, t: number[], p: number[], e: HoldEvidence, profile: AcceptanceProfile): Classification | null {
  const k = pa.phases.primary!;
  const hold = pa.phases.holds[k];
  const r = pa.ranges[k];
  const left = hold.leftRangeAtSeconds ?? null;
  if (left === null || left - hold.isolatedAtSeconds > profile.holdMinutes * 60) return null;
  const first = p[r.startIndex];
  const last = p[r.endIndex];
  const bound = ((last - first) / Math.max(left - t[r.startIndex], 1e-9)) * 60;
  const fitted = e.readings >= MIN_HOLD_READINGS && c.verdict !== "inconclusive" ? c.climbMicronsPerMinute : 0;
  const rate = Math.max(bound, fitted, profile.leakRateMicronsPerMinute);
  const both = c.verdict === "leak_and_moisture";
  const base: Decay = c.decay ?? {
    startMicrons: e.startMicrons, endMicrons: e.endMicrons, riseMicrons: e.endMicrons - e.startMicrons, holdSeconds: e.holdSeconds,
    leakRateMicronsPerMinute: 0, plateauMicrons: null, timeConstantSeconds: null,
  };
  const decay: Decay = { ...base, leakRateMicronsPerMinute: rate, leakRateAtLeast: true, plateauMicrons: both ? base.plateauMicrons : null, timeConstantSeconds: both ? base.timeConstantSeconds : null };
  const after = left - hold.isolatedAtSeconds;
  const reasons = [
    e.isolationSeen ? `Isolated at ${fmt(e.startMicrons)} microns.` : `The log starts in the hold at ${fmt(e.startMicrons)} microns; the isolation is not in the log.`,
    `It climbed out of the gauge's range ${after < 120 ? `${fmt(after)} seconds` : `${minutes(after)} minutes`} after isolation (last reading in range ${fmt(last)} microns): a gross leak or an open valve, climbing at least ${fmt(rate)} microns per minute.`,
  ];
  if (both) for (const x of c.reasons.slice(1)) if (x.startsWith("It levels off")) reasons.push(x);
  const profileRules = c.profileRules.map((rule) =>
    rule.rule === "leak_rate"
      ? { ...rule, met: false, detail: `climbed at least ${fmt(rate)} microns/min (a leak at ${profile.leakRateMicronsPerMinute} or more)` }
      : rule.rule === "limit"
        ? { ...rule, met: false, detail: `highest ${fmt(e.maxMicrons)} microns, then out of the gauge's range (last reading in range ${fmt(last)}; limit ${fmt(profile.limitMicrons)})` }
        : rule,
  );
  const verdict = both ? "leak_and_moisture" : "leak";
  const evidence = grossLeakEvidence(c.certainty.evidence, rate, profile);
  const confidence = calibratedConfidence(verdict, evidence);
  const words = certaintyWordsOf(confidence);
  const why = words === "sure" ? [] : [`Only ${e.readings} readings in range before the gauge left its range.`];
  const certainty = { ...c.certainty, confidence, words, why, evidence: { ...evidence } };
  return { ...c, verdict, confidence, certainty, reasons, decay, meetsProfile: false, profileRules, climbMicronsPerMinute: rate };
}

/**
 * The confidence evidence of a gross leak: the hold's own evidence, with the deciding margin the
 * lower bound of the climb against the leak rate (log₂, clipped to ±3 as in features.ts) and the
 * climb's noise margin at least the one of an unmeasured scatter; the calibration table maps it (it
 * is fitted on field logs with gross leaks out of range).
 */
function grossLeakEvidence(held: Record<string, number>, rateMicronsPerMinute: number, profile: AcceptanceProfile): ConfidenceEvidence {
  const e = {} as ConfidenceEvidence;
  for (const k of FEATURE_NAMES) e[k] = Number.isFinite(held[k]) ? held[k] : 0;
  e.margin = Math.min(Math.max(Math.log2(rateMicronsPerMinute / profile.leakRateMicronsPerMinute), -3), 3);
  // without a fit of the hold its noise is unmeasured: the climb's noise margin is then what features.ts gives an unmeasured sd (5)
  if (!(e.climbNoiseMargin > 0)) e.climbNoiseMargin = 5;
  return e;
}

/** Reasons when the log holds more than one hold (a re-pull): which one was judged and why. */
function repullReasons(pa: PhaseAnalysis, profile: AcceptanceProfile): string[] {
  const holds = pa.phases.holds;
  const k = pa.phases.primary;
  if (k === null || holds.length < 2) return [];
  const out: string[] = [];
  const judged = holds[k];
  if (k > 0)
    out.push(
      `The pump was opened again after ${k === 1 ? "an earlier hold" : `${k} earlier holds`} (a re-pull, shown on the chart); the verdict is on the ${judged.complete ? "last complete" : "last"} hold, isolated ${minutes(judged.isolatedAtSeconds)} minutes into the log.`,
    );
  const later = holds.length - 1 - k;
  if (later > 0) {
    const h = holds[holds.length - 1];
    out.push(
      `${later === 1 ? "A later hold" : `${later} later holds`} (the last ${minutes(h.endSeconds - h.isolatedAtSeconds)} minutes long) ${later === 1 ? "is" : "are"} shorter than the profile's ${profile.holdMinutes} minutes and not judged; the verdict is on the last complete hold.`,
    );
  }
  return out;
}

/** The classification of the primary hold with what field logs add (see the top of this file). */
export function judgeFieldHolds(c: Classification, pa: PhaseAnalysis, t: number[], p: number[], e: HoldEvidence | null, profile: AcceptanceProfile): Classification {
  const judged = e && pa.phases.primary !== null ? (grossLeak(c, pa, t, p, e, profile) ?? c) : c;
  const extra = repullReasons(pa, profile);
  return extra.length > 0 ? { ...judged, reasons: [...judged.reasons, ...extra] } : judged;
}
