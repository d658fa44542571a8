/**
 * The evidence a verdict's confidence is read from: how far the deciding numbers sit from the
 * profile's thresholds (as log₂ ratios and as multiples of the noise), how much of the hold was
 * seen, how many readings, how noisy they are, and whether the isolation is in the log.
 *
 * Every margin is signed so that a larger value supports the verdict given: for "pass" the margin
 * of the climb is how far it stays under the leak rate, for "leak" how far it is over it.
 * Units: margins in log₂ (1 = a factor of two), z-like margins as log(1 + |Δ|/σ) with their sign.
 */
import type { CurveReading } from "../rule";
import type { AcceptanceProfile, ModelFit, Verdict } from "../types";
import type { HoldEvidence } from "../classify";

export interface ConfidenceInput {
  verdict: Verdict;
  reading: CurveReading | null;
  evidence: HoldEvidence | null;
  fit: ModelFit | null;
  profile: AcceptanceProfile | null;
}

/** Named numbers, in the order the calibration table's weights use. */
export interface ConfidenceEvidence {
  /** Margin of the deciding rule, log₂, clipped to ±3. */
  margin: number;
  /** Margin of the other rule, log₂, clipped to ±3. */
  otherMargin: number;
  /** Climb against the leak rate in noise units: sign·ln(1 + |climb − rate|/σ_slope). */
  climbNoiseMargin: number;
  /** Level against the limit in noise units: sign·ln(1 + |level − limit|/σ). */
  levelNoiseMargin: number;
  /** Share of the profile's hold time recorded, 0–1. */
  seen: number;
  /** log₁₀ of the readings in the hold. */
  logReadings: number;
  /** log₁₀ of the residual standard deviation over the level (relative scatter), clipped to [−4, 0]. */
  logScatter: number;
  /** 1 when the isolation itself is in the log, else 0. */
  isolationSeen: number;
}

export const FEATURE_NAMES: (keyof ConfidenceEvidence)[] = ["margin", "otherMargin", "climbNoiseMargin", "levelNoiseMargin", "seen", "logReadings", "logScatter", "isolationSeen"];

const clip = (x: number, lo: number, hi: number) => Math.min(Math.max(Number.isFinite(x) ? x : 0, lo), hi);
const log2Ratio = (value: number, threshold: number, floor: number) => clip(Math.log2(Math.max(value, floor) / threshold), -3, 3);
const noiseMargin = (delta: number, sd: number) => (sd > 0 && Number.isFinite(delta) ? Math.sign(delta) * Math.log1p(Math.abs(delta) / sd) : Math.sign(delta) * 5);

/**
 * The evidence of one verdict. Without a hold (or without a fit) everything is 0 but the coverage
 * and the readings, so the table's intercept for that verdict decides.
 *
 * The slope's noise σ_slope is the least-squares slope error of evenly spread readings,
 * σ·√12 / (√n·T) (T the hold in seconds, σ the residual sd), in microns per minute.
 */
export function confidenceFeatures(input: ConfidenceInput): ConfidenceEvidence {
  const { verdict, reading: c, evidence: e, fit: m, profile } = input;
  const seen = e && profile ? clip(e.holdSeconds / (profile.holdMinutes * 60), 0, 1) : 0;
  const logReadings = e ? Math.log10(Math.max(e.readings, 1)) : 0;
  const isolationSeen = e?.isolationSeen ? 1 : 0;
  if (!c || !e || !m || !profile) return { margin: 0, otherMargin: 0, climbNoiseMargin: 0, levelNoiseMargin: 0, seen, logReadings, logScatter: 0, isolationSeen };

  const rateLimit = profile.leakRateMicronsPerMinute;
  const level = c.plateauMicrons !== null && c.levelledOff ? c.plateauMicrons : c.maxMicrons;
  const rate = log2Ratio(c.climbMicronsPerMinute, rateLimit, rateLimit / 8);
  const late = c.lateSlopeMicronsPerMinute === null ? 3 : log2Ratio(c.lateSlopeMicronsPerMinute, 0.5 * rateLimit, rateLimit / 16);
  const lvl = log2Ratio(level, profile.limitMicrons, 1);
  const sd = Math.max(m.residualSd, 1e-9);
  const slopeSd = ((sd * Math.sqrt(12)) / (Math.sqrt(Math.max(e.readings, 2)) * Math.max(e.holdSeconds, 1))) * 60;
  const climbZ = noiseMargin(c.climbMicronsPerMinute - rateLimit, slopeSd);
  const levelZ = noiseMargin(level - profile.limitMicrons, sd);
  const logScatter = clip(Math.log10(sd / Math.max(level, 1)), -4, 0);

  // signed for the verdict: positive supports it
  let margin = 0;
  let otherMargin = 0;
  let climbNoiseMargin = 0;
  let levelNoiseMargin = 0;
  switch (verdict) {
    case "pass":
      margin = Math.min(-rate, -lvl);
      otherMargin = Math.max(-rate, -lvl);
      climbNoiseMargin = -climbZ;
      levelNoiseMargin = -levelZ;
      break;
    case "leak":
      margin = Math.min(rate, late);
      otherMargin = -lvl;
      climbNoiseMargin = climbZ;
      levelNoiseMargin = -levelZ;
      break;
    case "moisture":
      margin = lvl;
      otherMargin = -rate;
      climbNoiseMargin = -climbZ;
      levelNoiseMargin = levelZ;
      break;
    case "leak_and_moisture":
      margin = Math.min(rate, late, lvl);
      otherMargin = Math.max(Math.min(rate, late), lvl);
      climbNoiseMargin = climbZ;
      levelNoiseMargin = levelZ;
      break;
    case "inconclusive":
      margin = clip(-Math.log2(Math.max(seen, 1 / 8)), 0, 3);
      otherMargin = 0;
      break;
  }
  return { margin, otherMargin, climbNoiseMargin, levelNoiseMargin, seen, logReadings, logScatter, isolationSeen };
}
