/**
 * The verdict on a hold, its confidence and reasons, the decay numbers and the profile rules.
 *
 * The curve's verdict comes from the one rule in rule.ts (shared with the forecast's early call).
 * On top of it:
 *  - no hold found, or fewer than MIN_HOLD_READINGS readings in it → inconclusive;
 *  - a hold shorter than the profile's hold time that has not yet passed the limit → inconclusive
 *    (the forecast may still give an early call);
 *  - the profile is met only when the curve passes and every rule of the profile is met; a rule that
 *    fails is named, and the curve's own statement stays as it is (two statements, never merged).
 */
import { certaintyOf, type Certainty } from "./confidence";
import { groupedInteger } from "../shared/format";
import { MIN_HOLD_READINGS } from "./profile";
import { climbOf, curveVerdict, levelledOffWithin, type CurveReading } from "./rule";
import type { AcceptanceProfile, AnalysisResult, Decay, Forecast, HoldFitResult, ModelFit, Verdict } from "./types";

export interface HoldEvidence {
  /** Seconds of hold data (isolation to the last reading of the hold). */
  holdSeconds: number;
  readings: number;
  /** Reading at isolation (or the first reading when the log starts in the hold), microns. */
  startMicrons: number;
  /** The last reading of the hold, as the gauge showed it, microns. */
  endMicrons: number;
  /** Highest running median (figures.ts, spikes left out) over the whole hold, microns: what the limit rule judges. */
  maxMicrons: number;
  /** Highest single reading over the same part of the hold, microns (shown beside the smoothed one). */
  rawMaxMicrons?: number;
  isolationSeen: boolean;
  /** Least-squares slope of the readings over the last half of the hold (microns per minute), or null. */
  lateSlopeMicronsPerMinute: number | null;
}

export interface Classification {
  verdict: Verdict;
  confidence: number;
  /** The confidence in words, with what holds it down. */
  certainty: Certainty;
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

/** "highest 2,650 microns" with the single highest reading beside it when the smoothing changed it. */
export function highestWords(e: Pick<HoldEvidence, "maxMicrons" | "rawMaxMicrons">): string {
  const raw = e.rawMaxMicrons;
  const differs = raw !== undefined && fmt(raw) !== fmt(e.maxMicrons);
  return `highest ${fmt(e.maxMicrons)} microns${differs ? ` (smoothed over 5 readings; highest single reading ${fmt(raw!)})` : ""}`;
}

function noHold(): Classification {
  const reasons = ["No hold found: the log never turns from falling to rising (the pump was not valved off, or the log ends in the pull-down)."];
  const certainty = certaintyOf({ verdict: "inconclusive", reading: null, evidence: null, fit: null, profile: null });
  return {
    verdict: "inconclusive",
    confidence: certainty.confidence,
    certainty,
    reasons,
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

function rulesOf(e: HoldEvidence, profile: AcceptanceProfile, climb: number): AnalysisResult["profileRules"] {
  const judged = Math.min(e.holdSeconds, profile.holdMinutes * 60);
  return [
    {
      rule: "target",
      met: e.startMicrons <= profile.targetMicrons,
      detail: e.isolationSeen
        ? `isolated at ${fmt(e.startMicrons)} microns (target ${fmt(profile.targetMicrons)})`
        : `log starts in the hold at ${fmt(e.startMicrons)} microns (target ${fmt(profile.targetMicrons)}); the isolation itself is not in the log`,
    },
    { rule: "hold_time", met: e.holdSeconds >= profile.holdMinutes * 60, detail: `held ${minutes(e.holdSeconds)} min (at least ${profile.holdMinutes} min)` },
    {
      rule: "limit",
      met: e.maxMicrons <= profile.limitMicrons,
      detail: `${highestWords(e)} in the first ${minutes(judged)} min of the hold (limit ${fmt(profile.limitMicrons)})`,
    },
    {
      rule: "leak_rate",
      met: climb < profile.leakRateMicronsPerMinute,
      detail: `steady climb ${climb.toFixed(1)} microns/min (a leak at ${profile.leakRateMicronsPerMinute} or more)`,
    },
  ];
}

export function classifyHold(fit: HoldFitResult | null, e: HoldEvidence | null, profile: AcceptanceProfile, forecast: Forecast | null): Classification {
  if (!e) return noHold();
  const limit = profile.limitMicrons;
  const holdTarget = profile.holdMinutes * 60;
  const m = chosenFit(fit);
  const decay = decayFromFit(fit, e);
  const levelledOff = !m || levelledOffWithin(m.params, e.holdSeconds);
  const climb = m ? climbOf(m.params, e.holdSeconds) : 0;
  const rules = rulesOf(e, profile, climb);

  if (e.readings < MIN_HOLD_READINGS || !m) {
    const certainty = certaintyOf({ verdict: "inconclusive", reading: null, evidence: e, fit: m, profile });
    return {
      verdict: "inconclusive",
      confidence: certainty.confidence,
      certainty,
      reasons: [`Only ${e.readings} readings in the hold: too few to tell a level-off from a climb (at least ${MIN_HOLD_READINGS} needed).`],
      decay,
      meetsProfile: false,
      profileRules: rules,
      climbMicronsPerMinute: climb,
    };
  }

  const plateau = decay.plateauMicrons;
  const reading: CurveReading = {
    climbMicronsPerMinute: climb,
    lateSlopeMicronsPerMinute: e.lateSlopeMicronsPerMinute,
    plateauMicrons: plateau,
    levelledOff,
    maxMicrons: e.maxMicrons,
  };
  const call = curveVerdict(reading, profile);
  const { leak, moisture } = call;
  const exceeded = e.maxMicrons > limit;
  const reasons: string[] = [];

  if (e.isolationSeen) reasons.push(`Isolated at ${fmt(e.startMicrons)} microns${e.startMicrons > profile.targetMicrons ? `, above the ${fmt(profile.targetMicrons)}-micron target` : ""}.`);
  else reasons.push(`The log starts in the hold at ${fmt(e.startMicrons)} microns; the isolation is not in the log.`);

  let verdict: Verdict;
  if (e.holdSeconds < holdTarget && !exceeded) {
    verdict = "inconclusive";
    reasons.push(`The hold lasted ${minutes(e.holdSeconds)} minutes, shorter than the ${profile.holdMinutes} minutes the profile asks, and has not passed the ${fmt(limit)}-micron limit yet.`);
    if (forecast?.earlyCall) reasons.push(`The forecast at ${profile.holdMinutes} minutes is ${fmt(forecast.predictedMicrons)} microns (${fmt(forecast.lowMicrons)}–${fmt(forecast.highMicrons)}), an early ${forecast.earlyCall}.`);
  } else {
    verdict = call.verdict;
  }
  if (leak) reasons.push(`It keeps climbing at ${climb.toFixed(0)} microns per minute (a leak at ${profile.leakRateMicronsPerMinute} or more): a leak admits gas at a steady rate.`);
  if (plateau !== null && levelledOff) {
    reasons.push(
      plateau > limit
        ? `It levels off near ${fmt(plateau)} microns, above the ${fmt(limit)}-micron limit: moisture boiling off, or refrigerant leaving the oil.`
        : `It levels off near ${fmt(plateau)} microns, below the ${fmt(limit)}-micron limit.`,
    );
  } else if (!leak && moisture) reasons.push(`It stays above the ${fmt(limit)}-micron limit without a steady climb (${highestWords(e)}).`);
  if (verdict === "pass")
    reasons.push(`It rose ${fmt(Math.max(decay.riseMicrons, 0))} microns in ${minutes(e.holdSeconds)} minutes (from ${fmt(e.startMicrons)} to a last reading of ${fmt(e.endMicrons)}) and stayed at or below ${fmt(limit)} microns: tight and dry.`);

  const certainty = certaintyOf({ verdict, reading, evidence: e, fit: m, profile });
  const meetsProfile = verdict === "pass" && rules.every((r) => r.met);
  if (verdict === "pass" && !meetsProfile) {
    const failed = rules.filter((r) => !r.met).map((r) => r.detail);
    reasons.push(`The curve looks tight and dry, but the profile is not met: ${failed.join("; ")}.`);
  }
  return { verdict, confidence: certainty.confidence, certainty, reasons, decay, meetsProfile, profileRules: rules, climbMicronsPerMinute: climb };
}
