/**
 * Reduce a long hold to a bounded number of points before any iterative fitting, so the cost is one
 * O(n) pass plus a constant (a 24 h hold at 1 Hz is 86,400 readings; a 1-hour log at 1 Hz holds ~2,700).
 */

/** Above this many kept readings a hold is binned. */
export const BIN_ABOVE_POINTS = 1000;
/** Fewest equal time bins used when binning. */
export const BIN_COUNT_MIN = 500;
/** Most equal time bins used when binning (the fit's fixed cost grows with the bin count). */
export const BIN_COUNT_MAX = 1000;
/** Bins are made no wider than this where BIN_COUNT_MAX allows (seconds). */
export const BIN_SECONDS_MAX = 30;

/** Equal time bins for a hold spanning spanSeconds: ⌈span / BIN_SECONDS_MAX⌉, kept within [BIN_COUNT_MIN, BIN_COUNT_MAX]. */
export function binCountFor(spanSeconds: number): number {
  const wanted = Math.ceil(spanSeconds / BIN_SECONDS_MAX);
  return Math.min(BIN_COUNT_MAX, Math.max(BIN_COUNT_MIN, Number.isFinite(wanted) ? wanted : BIN_COUNT_MIN));
}

export interface ReducedHold {
  tSeconds: Float64Array;
  microns: Float64Array;
  binned: boolean;
}

/**
 * Bin means over equal time bins. Kept readings (tSeconds ascending; excluded[i] = 1 marks a spike left
 * out) are split into binCountFor(span) bins of equal width in time over [t_first kept, t_last kept]
 * (500 bins up to a 4 h 10 min hold, 30 s wide up to 1,000 bins, then 1,000); each
 * non-empty bin becomes one point: the mean time and the mean reading of its readings. Holds of
 * BIN_ABOVE_POINTS kept readings or fewer are returned as they are. Time in seconds, readings in microns.
 *
 * Why the fit on bin means stands in for the fit on every reading: for m readings per bin the least-squares
 * sum splits into Σ_bins m·(p̄ − f(t̄))² plus within-bin terms, and the within-bin terms carry only the
 * curve's slope inside each bin, a share of order 1/bins² of the information, so the same parameters
 * minimise both to that order. A bin mean's noise variance is σ²/m (the gauge's resolution steps average
 * out too), so s² from the bin residuals and s²·(JᵀJ)⁻¹ scale together and the parameter uncertainties
 * stay those of the full fit. At a steady sampling interval equal-time bins hold m or m + 1 readings;
 * weights that uneven leave least squares unbiased and change its variance by under 1/m² (Kish's design
 * effect 1 + CV² of the weights). The model's curvature inside a bin biases a mean by about f''·h²/24
 * (h = bin width), i.e. (h/τ)²/24 of the rise's remaining part: under 0.4 % for τ ≥ 100 s at h ≤ 30 s,
 * and ~1 % at τ = 10 s in the 5 s bins of a 1-hour hold (a rise with τ under two samples is a step at
 * isolation that selection sets aside anyway). Spikes are not averaged in for
 * good: the spike search runs on every raw reading against the first fit, and the fit is redone without
 * them (index.ts); above SPIKE_MAX_FRACTION the hold is fitted as it is, as an unbinned one would be.
 * The agreement with the unbinned fit is checked on simulated holds (tests/analysis/hold-binning.test.ts).
 * Reference: grouped-data least squares, e.g. N. R. Draper & H. Smith, Applied Regression Analysis
 * (3rd ed., 1998) §9 on replicated and grouped observations (from memory); L. Kish, Survey Sampling
 * (1965) §11.7 (the design effect of unequal weights, from memory). Bin count: common practice, no
 * published source.
 */
export function reduceHold(tSeconds: ArrayLike<number>, microns: ArrayLike<number>, excluded: Uint8Array): ReducedHold {
  const n = tSeconds.length;
  let keptCount = 0;
  let first = -1;
  let last = -1;
  for (let i = 0; i < n; i++) {
    if (excluded[i]) continue;
    keptCount++;
    if (first < 0) first = i;
    last = i;
  }
  if (keptCount <= BIN_ABOVE_POINTS) {
    const tKept = new Float64Array(keptCount);
    const pKept = new Float64Array(keptCount);
    for (let i = 0, j = 0; i < n; i++) {
      if (excluded[i]) continue;
      tKept[j] = tSeconds[i];
      pKept[j++] = microns[i];
    }
    return { tSeconds: tKept, microns: pKept, binned: false };
  }
  const t0 = tSeconds[first];
  const span = tSeconds[last] - t0 || 1;
  const bins = binCountFor(span);
  const tSum = new Float64Array(bins);
  const pSum = new Float64Array(bins);
  const count = new Float64Array(bins);
  for (let i = first; i <= last; i++) {
    if (excluded[i]) continue;
    const bin = Math.min(bins - 1, Math.floor(((tSeconds[i] - t0) / span) * bins));
    tSum[bin] += tSeconds[i];
    pSum[bin] += microns[i];
    count[bin]++;
  }
  let used = 0;
  for (let b = 0; b < bins; b++) if (count[b] > 0) used++;
  const tOut = new Float64Array(used);
  const pOut = new Float64Array(used);
  for (let b = 0, j = 0; b < bins; b++) {
    if (count[b] === 0) continue;
    tOut[j] = tSum[b] / count[b];
    pOut[j++] = pSum[b] / count[b];
  }
  return { tSeconds: tOut, microns: pOut, binned: true };
}
