/**
 * Generated holds with known truth, for recovery tests of the fit and the forecast (invented data).
 */
import { holdModelMicrons, type HoldParams } from "./models";
import { seededNormal } from "./prng";

export interface SyntheticHoldOptions {
  /** Hold length, seconds. */
  holdSeconds: number;
  /** Seconds between readings (default 1). */
  sampleSeconds?: number;
  /** Relative noise sd of a reading (default 0.02 = 2 % of the reading). */
  relativeNoise?: number;
  seed: number;
}

/**
 * Readings of a hold model with gauge-like noise: Gaussian with sd = relativeNoise × true reading, then
 * rounded to the gauge's resolution step (1 micron below 1,000 microns, 10 microns from 1,000 up).
 * Common practice for digital micron gauges, no published source.
 */
export function syntheticHold(truth: HoldParams, o: SyntheticHoldOptions): { tSeconds: number[]; microns: number[] } {
  const dt = o.sampleSeconds ?? 1;
  const rel = o.relativeNoise ?? 0.02;
  const normal = seededNormal(o.seed);
  const tSeconds: number[] = [];
  const microns: number[] = [];
  for (let t = 0; t <= o.holdSeconds + 1e-9; t += dt) {
    const p = holdModelMicrons(truth, t);
    const noisy = p * (1 + rel * normal());
    const step = noisy >= 1000 ? 10 : 1;
    tSeconds.push(t);
    microns.push(Math.max(0, Math.round(noisy / step) * step));
  }
  return { tSeconds, microns };
}
