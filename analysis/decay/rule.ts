/**
 * The one rule that turns what a hold curve does into a verdict. The classification of a recorded
 * hold and the forecast's early call both apply this function, so a forecast can never call a curve
 * by other rules than the verdict (a leak is a leak in both, whatever the limit says).
 *
 * Rule (physics of the rise, thresholds from the acceptance profile; common practice, no published
 * source):
 *  - a steady climb at or above the profile's leak rate is a leak, even below the limit; the second
 *    half of the hold must climb at least half that rate too (a step that then stays flat is not one);
 *  - a level-off above the limit is moisture (water boiling off, or refrigerant leaving the oil), and
 *    so is a hold that passed the limit without a steady climb;
 *  - both → leak_and_moisture; neither → pass (tight and dry).
 */
import type { AcceptanceProfile, ModelFit } from "./types";
import { holdModelMicrons } from "./fit/models";

/** What the verdict looks at, all in microns and microns per minute. */
export interface CurveReading {
  /** The steady climb: the model's linear term, or the end slope of a curve that has not levelled off. */
  climbMicronsPerMinute: number;
  /** Least-squares slope of the second half of the hold, or null when it cannot be measured. */
  lateSlopeMicronsPerMinute: number | null;
  /** Level the curve settles at (p0 + a), or null without a level-off part. */
  plateauMicrons: number | null;
  /** The level-off happened within the hold (τ at most half the hold). */
  levelledOff: boolean;
  /** Highest reading of the judged part of the hold (smoothed, see figures.ts). */
  maxMicrons: number;
}

export type CurveVerdict = "pass" | "leak" | "moisture" | "leak_and_moisture";

export interface CurveCall {
  verdict: CurveVerdict;
  leak: boolean;
  moisture: boolean;
}

/** The verdict of a hold that ran the profile's hold time, from what its curve does (see the file's rule). */
export function curveVerdict(c: CurveReading, profile: AcceptanceProfile): CurveCall {
  const steady = c.lateSlopeMicronsPerMinute === null || c.lateSlopeMicronsPerMinute >= 0.5 * profile.leakRateMicronsPerMinute;
  const leak = c.climbMicronsPerMinute >= profile.leakRateMicronsPerMinute && steady;
  const moisture = (c.plateauMicrons !== null && c.levelledOff && c.plateauMicrons > profile.limitMicrons) || (!leak && c.maxMicrons > profile.limitMicrons);
  return { verdict: leak && moisture ? "leak_and_moisture" : leak ? "leak" : moisture ? "moisture" : "pass", leak, moisture };
}

/** A level-off within the hold: no τ, or τ at most half the hold (seconds). */
export function levelledOffWithin(params: ModelFit["params"], holdSeconds: number): boolean {
  return params.tauSeconds === undefined || params.tauSeconds <= holdSeconds / 2;
}

/**
 * Slope of a model at the end of the hold (microns per minute) when its level-off has not happened
 * within the hold (τ longer than half the hold): such a curve is, over the log, a climb. 0 otherwise.
 * Backward difference over 1 % of the hold (at least 1 s).
 */
export function unlevelledSlopePerMinute(params: ModelFit["params"], holdSeconds: number): number {
  if (params.tauSeconds === undefined || levelledOffWithin(params, holdSeconds)) return 0;
  const dt = Math.max(holdSeconds * 0.01, 1);
  return ((holdModelMicrons(params, holdSeconds) - holdModelMicrons(params, holdSeconds - dt)) / dt) * 60;
}

/** The steady climb the verdict uses (microns per minute): max(l·60 floored at 0, the unlevelled end slope). */
export function climbOf(params: ModelFit["params"], holdSeconds: number): number {
  const l = params.l !== undefined ? Math.max(params.l * 60, 0) : 0;
  return Math.max(l, unlevelledSlopePerMinute(params, holdSeconds));
}
