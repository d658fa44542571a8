/**
 * Reduce a long hold to a bounded number of points before any iterative fitting, so the cost is one
 * O(n) pass plus a constant (a 24 h hold at 1 Hz is 86,400 readings).
 */
import { medianInPlace } from "./median";

/** Above this many points a hold is binned. */
export const BIN_ABOVE_POINTS = 2000;
/** Number of equal time bins used when binning. */
export const BIN_COUNT = 1000;

export interface ReducedHold {
  tSeconds: Float64Array;
  microns: Float64Array;
  binned: boolean;
}

/**
 * Bin medians over equal time bins. Readings (tSeconds ascending) are split into BIN_COUNT bins of equal
 * width in time over [t_first, t_last]; each non-empty bin becomes one point at the mean time of its
 * readings with their median reading (the median shrugs off a lone spike and the gauge's resolution
 * steps; its variance for m readings is about (π/2)·σ²/m, so parameter uncertainties from the binned fit
 * stay honest). Readings with excluded[i] = 1 (spikes) are left out. Holds of BIN_ABOVE_POINTS kept
 * readings or fewer are returned as they are. Time in seconds, readings in microns.
 * Reference: common practice in data reduction, no published source for the bin count.
 */
export function reduceHold(tSeconds: ArrayLike<number>, microns: ArrayLike<number>, excluded: Uint8Array): ReducedHold {
  const n = tSeconds.length;
  let keptCount = 0;
  for (let i = 0; i < n; i++) if (!excluded[i]) keptCount++;
  const tKept = new Float64Array(keptCount);
  const pKept = new Float64Array(keptCount);
  for (let i = 0, j = 0; i < n; i++) {
    if (excluded[i]) continue;
    tKept[j] = tSeconds[i];
    pKept[j++] = microns[i];
  }
  if (keptCount <= BIN_ABOVE_POINTS) return { tSeconds: tKept, microns: pKept, binned: false };
  const t0 = tKept[0];
  const span = tKept[keptCount - 1] - t0 || 1;
  const tOut: number[] = [];
  const pOut: number[] = [];
  let start = 0;
  while (start < keptCount) {
    const bin = Math.min(BIN_COUNT - 1, Math.floor(((tKept[start] - t0) / span) * BIN_COUNT));
    const binEnd = t0 + ((bin + 1) * span) / BIN_COUNT;
    let end = start + 1;
    while (end < keptCount && (bin === BIN_COUNT - 1 || tKept[end] < binEnd)) end++;
    let tSum = 0;
    for (let i = start; i < end; i++) tSum += tKept[i];
    tOut.push(tSum / (end - start));
    pOut.push(medianInPlace(pKept, start, end));
    start = end;
  }
  return { tSeconds: Float64Array.from(tOut), microns: Float64Array.from(pOut), binned: true };
}
