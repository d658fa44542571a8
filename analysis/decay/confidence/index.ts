/**
 * A verdict's confidence as a calibrated probability that it is right, in numbers and in words.
 *
 * Method: the verdict's evidence (features.ts) goes through a logistic map fitted per verdict on
 * simulated logs with known truth (`npm run calibrate`, scripts/calibrate-confidence.ts), whose
 * weights live in table.ts. Calibrated means: of the verdicts given 80 % confidence, about 80 % are
 * right; `npm run eval:analysis` prints the reliability table and the expected calibration error
 * (ECE) on held-out and independent logs (C. Guo, G. Pleiss, Y. Sun, K. Q. Weinberger, "On
 * Calibration of Modern Neural Networks", ICML 2017; reliability diagrams: M. H. DeGroot &
 * S. E. Fienberg, "The Comparison and Evaluation of Forecasters", The Statistician 32, 1983).
 *
 * Words: "sure" from 90 %, "likely" from 70 %, "unsure" below, each with what holds it down.
 */
import { groupedInteger } from "../../shared/format";
import type { Certainty, CertaintyWords } from "../types";
import { confidenceFeatures, FEATURE_NAMES, type ConfidenceEvidence, type ConfidenceInput } from "./features";
import { linearScore, sigmoid } from "./logistic";
import { CALIBRATION } from "./table";

export { confidenceFeatures, FEATURE_NAMES, type ConfidenceEvidence, type ConfidenceInput } from "./features";
export { CALIBRATION } from "./table";

/** Confidence is kept within these bounds: no log makes a verdict certain, none makes it worthless. */
export const CONFIDENCE_FLOOR = 0.05;
export const CONFIDENCE_CEILING = 0.99;
export const SURE_FROM = 0.9;
export const LIKELY_FROM = 0.7;

export type { Certainty, CertaintyWords };

export function certaintyWordsOf(confidence: number): CertaintyWords {
  return confidence >= SURE_FROM ? "sure" : confidence >= LIKELY_FROM ? "likely" : "unsure";
}

/** The evidence as the vector the table's weights multiply. */
export function featureVector(e: ConfidenceEvidence): number[] {
  return FEATURE_NAMES.map((k) => e[k]);
}

/** The calibrated probability of the verdict being right, from its evidence (table.ts weights). */
export function calibratedConfidence(verdict: ConfidenceInput["verdict"], e: ConfidenceEvidence): number {
  const w = CALIBRATION.weights[verdict];
  const p = sigmoid(linearScore(w, featureVector(e)));
  return Math.round(Math.min(Math.max(p, CONFIDENCE_FLOOR), CONFIDENCE_CEILING) * 100) / 100;
}

const fmt = (x: number) => groupedInteger(Math.round(x));

/** What holds the confidence down, in plain words, weakest first (empty when nothing stands out). */
function whyOf(input: ConfidenceInput, e: ConfidenceEvidence): string[] {
  const { verdict, reading: c, evidence: ev, profile } = input;
  const out: string[] = [];
  if (!ev || !profile) return ["No hold was found to judge."];
  if (verdict === "inconclusive") {
    if (ev.holdSeconds < profile.holdMinutes * 60) out.push(`The hold is ${(ev.holdSeconds / 60).toFixed(1)} min, shorter than the profile's ${profile.holdMinutes} min.`);
    if (ev.readings < 6) out.push(`Only ${ev.readings} readings in the hold.`);
    return out;
  }
  if (c && Math.abs(e.margin) < 0.5) {
    const level = c.plateauMicrons !== null && c.levelledOff ? c.plateauMicrons : c.maxMicrons;
    const nearRate = Math.abs(Math.log2(Math.max(c.climbMicronsPerMinute, 1e-6) / profile.leakRateMicronsPerMinute)) < 0.5;
    const nearLimit = Math.abs(Math.log2(Math.max(level, 1e-6) / profile.limitMicrons)) < 0.5;
    if (nearRate) out.push(`The climb, ${c.climbMicronsPerMinute.toFixed(1)} microns/min, is close to the ${profile.leakRateMicronsPerMinute} microns/min that counts as a leak.`);
    if (nearLimit) out.push(`The level, ${fmt(level)} microns, is close to the ${fmt(profile.limitMicrons)}-micron limit.`);
  }
  if (ev.readings < 12) out.push(`Only ${ev.readings} readings in the hold.`);
  if (e.seen < 1) out.push(`The hold is ${(ev.holdSeconds / 60).toFixed(1)} min, shorter than the profile's ${profile.holdMinutes} min.`);
  if (e.logScatter > Math.log10(0.05)) out.push(`The readings scatter by about ${Math.round(10 ** e.logScatter * 100)} % around the curve.`);
  if (!ev.isolationSeen) out.push("The isolation itself is not in the log.");
  return out;
}

/** Confidence, its words and what holds it down, for a verdict and the evidence behind it. */
export function certaintyOf(input: ConfidenceInput): Certainty {
  const evidence = confidenceFeatures(input);
  const confidence = calibratedConfidence(input.verdict, evidence);
  const words = certaintyWordsOf(confidence);
  return { confidence, words, why: words === "sure" ? [] : whyOf(input, evidence), evidence: { ...evidence }, calibration: CALIBRATION.id };
}
