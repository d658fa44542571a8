/**
 * Spike handling: a lone bad reading (a gauge glitch, a bumped hose) must not bend the fitted rise.
 */
import { medianInPlace } from "./median";

/** Residuals beyond this many robust standard deviations are spikes. */
export const SPIKE_K = 5;
/** Never call more than this fraction of the readings spikes: beyond it the model is wrong, not the points. */
export const SPIKE_MAX_FRACTION = 0.05;
/** A spike must also be off by more than this many microns (a few resolution steps of a micron gauge). */
export const SPIKE_MIN_MICRONS = 5;

/**
 * Indices of readings that are spikes against a first fit. Gauge noise grows with the reading, so each
 * residual is taken relative to the fitted reading, z = (reading − fit)/max(fit, 1 micron); a reading is a
 * spike when z lies more than k robust sd from the median z (robust sd = 1.4826·MAD, consistent with σ for
 * Gaussian noise) and it is off by more than SPIKE_MIN_MICRONS. If more than SPIKE_MAX_FRACTION of the
 * readings would be flagged, none are (the model is wrong, not the points). Units: microns.
 * Reference: F. R. Hampel, J. Amer. Statist. Assoc. 69 (1974) 383 (the MAD-based outlier identifier);
 * P. J. Rousseeuw & C. Croux, J. Amer. Statist. Assoc. 88 (1993) 1273 (the 1.4826 factor).
 */
export function findSpikes(readingsMicrons: ArrayLike<number>, fittedMicrons: Float64Array, k = SPIKE_K): number[] {
  const n = fittedMicrons.length;
  if (n < 5) return [];
  const z = new Float64Array(n);
  for (let i = 0; i < n; i++) z[i] = (readingsMicrons[i] - fittedMicrons[i]) / Math.max(fittedMicrons[i], 1);
  const work = Float64Array.from(z);
  const centre = medianInPlace(work);
  for (let i = 0; i < n; i++) work[i] = Math.abs(z[i] - centre);
  const scale = 1.4826 * medianInPlace(work);
  const out: number[] = [];
  for (let i = 0; i < n; i++) {
    const off = Math.abs(readingsMicrons[i] - fittedMicrons[i]);
    if (Math.abs(z[i] - centre) > k * scale && off > SPIKE_MIN_MICRONS) out.push(i);
  }
  return out.length > SPIKE_MAX_FRACTION * n ? [] : out;
}
