/**
 * Aligning curves at isolation for the overlay. Pure functions, no database.
 * Time is seconds; pressure microns.
 */

/**
 * Linear interpolation of p at time t in a series sorted by t (seconds, microns); clamps to the
 * ends outside the series. Method: straight line between the two bracketing readings.
 */
export function micronsAt(series: { t: number[]; p: number[] }, tSeconds: number): number {
  const { t, p } = series;
  const n = Math.min(t.length, p.length);
  if (n === 0) return Number.NaN;
  if (tSeconds <= t[0]) return p[0];
  if (tSeconds >= t[n - 1]) return p[n - 1];
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (t[mid] <= tSeconds) lo = mid;
    else hi = mid;
  }
  if (t[lo] === tSeconds) return p[lo];
  const f = (tSeconds - t[lo]) / (t[hi] - t[lo]);
  return p[lo] + f * (p[hi] - p[lo]);
}

export interface AlignedSeries {
  /** Seconds from the first data row taken as time zero (isolation, or the first reading). */
  zeroSeconds: number;
  /** The reading at time zero (interpolated when zero falls between readings), microns. */
  zeroMicrons: number;
  /** Seconds relative to zero (negative during the pull-down); always contains 0. */
  t: number[];
  p: number[];
}

/**
 * Shift a series so that t = 0 is the isolation (valve-off) point: t' = t − isolationAt.
 * A test without an isolation point starts in the hold, so zero is its first reading.
 * When isolation falls between two readings an interpolated reading is inserted at t' = 0,
 * so every aligned series has a value at exactly zero.
 */
export function alignAtIsolation(series: { t: number[]; p: number[] }, isolationAtSeconds: number | null): AlignedSeries {
  const n = Math.min(series.t.length, series.p.length);
  if (n === 0) return { zeroSeconds: 0, zeroMicrons: Number.NaN, t: [], p: [] };
  const zero = isolationAtSeconds ?? series.t[0];
  const zeroMicrons = micronsAt(series, zero);
  const t: number[] = [];
  const p: number[] = [];
  let placedZero = false;
  for (let i = 0; i < n; i++) {
    const rel = series.t[i] - zero;
    if (!placedZero && rel >= 0) {
      if (rel > 0) {
        t.push(0);
        p.push(zeroMicrons);
      }
      placedZero = true;
    }
    t.push(rel);
    p.push(series.p[i]);
  }
  if (!placedZero) {
    t.push(0);
    p.push(zeroMicrons);
  }
  return { zeroSeconds: zero, zeroMicrons, t, p };
}
