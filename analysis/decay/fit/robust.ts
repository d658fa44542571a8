/**
 * Spike handling: a lone bad reading (a gauge glitch, a bumped hose) must not bend the fitted rise.
 */
import { median, medianAbsoluteDeviation } from "simple-statistics";

/** Residuals beyond this many robust standard deviations are spikes. */
export const SPIKE_K = 5;
/** Never call more than this fraction of the readings spikes: beyond it the model is wrong, not the points. */
export const SPIKE_MAX_FRACTION = 0.05;
/**
 * …except that a few are always allowed: one or two wild readings (a bumped hose, a hand on the gauge),
 * perhaps twice, are spikes even in a hand-typed hold of a dozen readings.
 */
export const SPIKE_MAX_ALWAYS = 3;
/** A spike must also be off by more than this many microns (a few resolution steps of a micron gauge). */
export const SPIKE_MIN_MICRONS = 5;

/**
 * Readings per block for the local scale: at least this many (the MAD of 100 Gaussian values is within
 * ~17 % of σ at 1 sd, so a 5-sd test rarely fires on clean data), and at most 20 blocks per hold.
 */
export const SPIKE_BLOCK_MIN = 100;

/**
 * Indices of readings that are spikes against a first fit. Gauge noise changes along a hold (it grows
 * with the reading, and resolution steps change at 1,000 microns), and a first fit may miss the curve's
 * shape a little, so the test is local: the residuals (reading − fit, microns) are cut into consecutive
 * blocks of max(100, n/20) readings, and a reading is a spike when it lies more than k robust sd from its
 * block's median residual (robust sd = 1.4826·MAD of the block, consistent with σ for Gaussian noise,
 * floored at 1 micron, one resolution step) and is off by more than SPIKE_MIN_MICRONS, in a run of at
 * most SPIKE_MAX_RUN successive readings (isolatedRuns). If more than
 * max(SPIKE_MAX_ALWAYS, SPIKE_MAX_FRACTION of the readings) would be flagged, none are (the model is
 * wrong, not the points).
 * Reference: F. R. Hampel, J. Amer. Statist. Assoc. 69 (1974) 383 (the MAD-based outlier identifier);
 * P. J. Rousseeuw & C. Croux, J. Amer. Statist. Assoc. 88 (1993) 1273 (the 1.4826 factor).
 */
export function findSpikes(readingsMicrons: ArrayLike<number>, fittedMicrons: Float64Array, k = SPIKE_K): number[] {
  const n = fittedMicrons.length;
  if (n < 5) return [];
  const resid = new Float64Array(n);
  for (let i = 0; i < n; i++) resid[i] = readingsMicrons[i] - fittedMicrons[i];
  return findSpikesInResiduals(resid, k);
}

/** findSpikes on the residuals (reading − fit, microns) already in hand; `resid` is left as it is. */
export function findSpikesInResiduals(resid: Float64Array, k = SPIKE_K): number[] {
  const n = resid.length;
  if (n < 5) return [];
  const block = Math.max(SPIKE_BLOCK_MIN, Math.ceil(n / 20));
  const out: number[] = [];
  for (let from = 0; from < n; from += block) {
    // Fold a short last block into a full-size window ending at n.
    const lo = Math.max(0, Math.min(from, n - block));
    const hi = Math.min(n, lo + block);
    // simple-statistics copies each block (at most ~20 blocks of the reduced hold's ≤ 1,000 points), not per reading
    const window = Array.from(resid.subarray(lo, hi));
    const centre = median(window);
    const scale = Math.max(1.4826 * medianAbsoluteDeviation(window), 1);
    for (let i = from; i < Math.min(n, from + block); i++) {
      const off = Math.abs(resid[i] - centre);
      if (off > k * scale && off > SPIKE_MIN_MICRONS) out.push(i);
    }
  }
  const isolated = isolatedRuns(out);
  return isolated.length > Math.max(SPIKE_MAX_ALWAYS, SPIKE_MAX_FRACTION * n) ? [] : isolated;
}

/** Longest run of successive flagged readings that is still a spike: a bumped hose gives one or two. */
export const SPIKE_MAX_RUN = 2;

/**
 * Of the flagged indices (ascending), those in runs of at most SPIKE_MAX_RUN successive readings: a
 * longer run is the curve doing something the first fit did not follow (a climb at the end of the log),
 * never a spike to leave out — leaving it out could hide a rise above the limit.
 */
function isolatedRuns(flagged: number[]): number[] {
  const out: number[] = [];
  for (let a = 0; a < flagged.length; ) {
    let b = a;
    while (b + 1 < flagged.length && flagged[b + 1] === flagged[b] + 1) b++;
    if (b - a + 1 <= SPIKE_MAX_RUN) for (let k = a; k <= b; k++) out.push(flagged[k]);
    a = b + 1;
  }
  return out;
}
