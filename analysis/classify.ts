/**
 * The verdict on a hold, its confidence and reasons, the decay numbers and the profile rules.
 *
 * Rule (physics of the rise; thresholds from the acceptance profile, common practice):
 *  - no hold found, or fewer than MIN_HOLD_READINGS readings in it → inconclusive;
 *  - a hold shorter than the profile's hold time that has not yet passed the limit → inconclusive
 *    (the forecast may still give an early call);
 *  - a steady climb at or above the profile's leak rate is a leak, even below the limit; a curve still
 *    rising at that rate at the end because it has not levelled off counts as a climb too; the
 *    readings of the second half of the hold must climb at least half that rate (a step that then
 *    stays flat is not a leak);
 *  - a level-off above the limit is moisture (water boiling off, or refrigerant leaving the oil);
 *  - both → leak_and_moisture; neither → pass.
 */
import { evaluateModel } from "./fit";
import { groupedInteger } from "./format";
import { MIN_HOLD_READINGS } from "./profile";
import type { AcceptanceProfile, AnalysisResult, Decay, Forecast, HoldFitResult, ModelFit, Verdict } from "./types";

export interface HoldEvidence {
  /** Seconds of hold data (isolation to the last reading of the hold). */
  holdSeconds: number;
  readings: number;
  /** Reading at isolation (or the first reading when the log starts in the hold), microns. */
  startMicrons: number;
  /** Median of the last three readings, microns. */
  endMicrons: number;
  /** Highest reading (running median, spikes left out) over the whole hold, microns. */
  maxMicrons: number;
  isolationSeen: boolean;
  /** Least-squares slope of the readings over the last half of the hold (microns per minute), or null. */
  lateSlopeMicronsPerMinute: number | null;
}

export interface Classification {
  verdict: Verdict;
  confidence: number;
  reasons: string[];
  decay: Decay | null;
  meetsProfile: boolean;
  profileRules: AnalysisResult["profileRules"];
  /** Climb used for the verdict (microns per minute): the model's l, or the end slope when not levelled off. */
  climbMicronsPerMinute: number;
}

const fmt = (x: number): string => groupedInteger(Math.round(x));
const minutes = (s: number): string => (s / 60).toFixed(1);

export function chosenFit(fit: HoldFitResult | null): ModelFit | null {
  return fit ? (fit.fits[fit.chosen] ?? null) : null;
}

/** Decay numbers from the chosen model (leak rate 0 without a climb; plateau = p0 + a with a plateau). */
export function decayFromFit(fit: HoldFitResult | null, e: HoldEvidence): Decay {
  const m = chosenFit(fit);
  const l = m?.params.l;
  const a = m?.params.a;
  return {
    startMicrons: e.startMicrons,
    endMicrons: e.endMicrons,
    riseMicrons: e.endMicrons - e.startMicrons,
    holdSeconds: e.holdSeconds,
    leakRateMicronsPerMinute: m && l !== undefined ? Math.max(l * 60, 0) : 0,
    plateauMicrons: m && a !== undefined ? m.params.p0 + a : null,
    timeConstantSeconds: m?.params.tauSeconds ?? null,
  };
}

/**
 * Slope of the chosen model at the end of the hold (microns per minute) when its level-off has not
 * happened within the hold (τ longer than half the hold): such a curve is, over the log, a climb.
 */
function unlevelledSlopePerMinute(m: ModelFit | null, holdSeconds: number): number {
  if (!m || m.params.tauSeconds === undefined || m.params.tauSeconds <= holdSeconds / 2) return 0;
  const dt = Math.max(holdSeconds * 0.01, 1);
  return ((evaluateModel(m, holdSeconds) - evaluateModel(m, holdSeconds - dt)) / dt) * 60;
}

function clamp01(x: number): number {
  return Math.min(Math.max(x, 0), 1);
}

export function classifyHold(fit: HoldFitResult | null, e: HoldEvidence | null, profile: AcceptanceProfile, forecast: Forecast | null): Classification {
  const limit = profile.limitMicrons;
  const holdTarget = profile.holdMinutes * 60;
  const rules: Classification["profileRules"] = [];
  if (!e) {
    return {
      verdict: "inconclusive",
      confidence: 0.2,
      reasons: ["No hold found: the log never turns from falling to rising (the pump was not valved off, or the log ends in the pull-down)."],
      decay: null,
      meetsProfile: false,
      profileRules: [
        { rule: "target", met: false, detail: "no isolation found" },
        { rule: "hold_time", met: false, detail: "no hold found" },
        { rule: "limit", met: false, detail: "no hold found" },
        { rule: "leak_rate", met: false, detail: "no hold found" },
      ],
      climbMicronsPerMinute: 0,
    };
  }
  const m = chosenFit(fit);
  const decay = decayFromFit(fit, e);
  const levelledOff = m?.params.tauSeconds === undefined || m.params.tauSeconds <= e.holdSeconds / 2;
  const climb = Math.max(decay.leakRateMicronsPerMinute, unlevelledSlopePerMinute(m, e.holdSeconds));
  const reasons: string[] = [];

  rules.push({
    rule: "target",
    met: e.startMicrons <= profile.targetMicrons,
    detail: e.isolationSeen
      ? `isolated at ${fmt(e.startMicrons)} microns (target ${fmt(profile.targetMicrons)})`
      : `log starts in the hold at ${fmt(e.startMicrons)} microns (target ${fmt(profile.targetMicrons)}); the isolation itself is not in the log`,
  });
  rules.push({ rule: "hold_time", met: e.holdSeconds >= holdTarget, detail: `held ${minutes(e.holdSeconds)} min (at least ${profile.holdMinutes} min)` });
  rules.push({ rule: "limit", met: e.maxMicrons <= limit, detail: `highest ${fmt(e.maxMicrons)} microns (limit ${fmt(limit)})` });
  rules.push({
    rule: "leak_rate",
    met: climb < profile.leakRateMicronsPerMinute,
    detail: `steady climb ${climb.toFixed(1)} microns/min (a leak at ${profile.leakRateMicronsPerMinute} or more)`,
  });

  if (e.readings < MIN_HOLD_READINGS || !m) {
    return {
      verdict: "inconclusive",
      confidence: 0.3,
      reasons: [`Only ${e.readings} readings in the hold: too few to tell a level-off from a climb (at least ${MIN_HOLD_READINGS} needed).`],
      decay,
      meetsProfile: false,
      profileRules: rules,
      climbMicronsPerMinute: climb,
    };
  }

  // a steady climb shows in the second half of the hold too; a quick step that then stays flat does not
  const steady = e.lateSlopeMicronsPerMinute === null || e.lateSlopeMicronsPerMinute >= 0.5 * profile.leakRateMicronsPerMinute;
  const leak = climb >= profile.leakRateMicronsPerMinute && steady;
  const plateau = decay.plateauMicrons;
  const moisture = (plateau !== null && levelledOff && plateau > limit) || (!leak && e.maxMicrons > limit);
  const exceeded = e.maxMicrons > limit;

  if (e.isolationSeen) reasons.push(`Isolated at ${fmt(e.startMicrons)} microns${e.startMicrons > profile.targetMicrons ? `, above the ${fmt(profile.targetMicrons)}-micron target` : ""}.`);
  else reasons.push(`The log starts in the hold at ${fmt(e.startMicrons)} microns; the isolation is not in the log.`);

  let verdict: Verdict;
  if (e.holdSeconds < holdTarget && !exceeded) {
    verdict = "inconclusive";
    reasons.push(`The hold lasted ${minutes(e.holdSeconds)} minutes, shorter than the ${profile.holdMinutes} minutes the profile asks, and has not passed the ${fmt(limit)}-micron limit yet.`);
    if (forecast?.earlyCall) reasons.push(`The forecast at ${profile.holdMinutes} minutes is ${fmt(forecast.predictedMicrons)} microns (${fmt(forecast.lowMicrons)}–${fmt(forecast.highMicrons)}), an early ${forecast.earlyCall}.`);
  } else {
    verdict = leak && moisture ? "leak_and_moisture" : leak ? "leak" : moisture ? "moisture" : "pass";
  }
  if (leak) reasons.push(`It keeps climbing at ${climb.toFixed(0)} microns per minute (a leak at ${profile.leakRateMicronsPerMinute} or more): a leak admits gas at a steady rate.`);
  if (plateau !== null && levelledOff) {
    reasons.push(
      plateau > limit
        ? `It levels off near ${fmt(plateau)} microns, above the ${fmt(limit)}-micron limit: moisture boiling off, or refrigerant leaving the oil.`
        : `It levels off near ${fmt(plateau)} microns, below the ${fmt(limit)}-micron limit.`,
    );
  } else if (!leak && moisture) reasons.push(`It stays above the ${fmt(limit)}-micron limit without a steady climb (highest ${fmt(e.maxMicrons)} microns).`);
  if (verdict === "pass") reasons.push(`It rose ${fmt(Math.max(decay.riseMicrons, 0))} microns in ${minutes(e.holdSeconds)} minutes and stayed at or below ${fmt(limit)} microns: tight and dry.`);

  const confidence = verdict === "inconclusive" ? 0.3 : confidenceOf({ climb, plateau: levelledOff ? plateau : null, maxMicrons: e.maxMicrons, leak, moisture }, e, profile, m);
  const meetsProfile = verdict === "pass" && rules.every((r) => r.met);
  if (verdict === "pass" && !meetsProfile) {
    const failed = rules.filter((r) => !r.met).map((r) => r.detail);
    reasons.push(`The curve looks tight and dry, but the profile is not met: ${failed.join("; ")}.`);
  }
  return { verdict, confidence, reasons, decay, meetsProfile, profileRules: rules, climbMicronsPerMinute: climb };
}

/**
 * Confidence 0–1: how far the numbers sit from the thresholds that decide (log-ratio margins, a
 * factor of two counts as clear), scaled by how much of the profile's hold was seen and how many
 * readings there are. A heuristic, not a probability.
 */
function confidenceOf(
  v: { climb: number; plateau: number | null; maxMicrons: number; leak: boolean; moisture: boolean },
  e: HoldEvidence,
  profile: AcceptanceProfile,
  m: ModelFit,
): number {
  const marginOf = (value: number, threshold: number) => clamp01(Math.abs(Math.log(Math.max(value, 1e-6) / threshold)) / Math.LN2);
  const leakMargin = v.leak ? marginOf(v.climb, profile.leakRateMicronsPerMinute) : v.climb <= 0 ? 1 : marginOf(v.climb, profile.leakRateMicronsPerMinute);
  const level = v.plateau ?? v.maxMicrons;
  const levelMargin = marginOf(level, profile.limitMicrons);
  const seen = clamp01(e.holdSeconds / (profile.holdMinutes * 60));
  const readings = clamp01(e.readings / 20);
  const fitQuality = Number.isFinite(m.rSquared) ? 0.7 + 0.3 * clamp01(m.rSquared) : 0.7;
  const margin = Math.min(leakMargin, levelMargin);
  return Math.round(clamp01((0.45 + 0.55 * margin) * (0.6 + 0.4 * seen) * (0.7 + 0.3 * readings) * fitQuality) * 100) / 100;
}
