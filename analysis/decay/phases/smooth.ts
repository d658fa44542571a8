/**
 * Robust smoothing for phase finding, linear in the number of readings: readings are grouped
 * into time bins (at most a few thousand), each bin is summarised by its median, and a running
 * median of five bins removes single-bin spikes. Pressure is smoothed in log10 because a log spans
 * decades and gauge noise is proportional to the reading.
 */
import { kthSmallestInPlace, medianInPlace } from "../fit/median";

export interface Bins {
  /** Index of the first reading in each bin; bin j holds readings [start[j], start[j+1]). */
  start: Int32Array;
  /** Median time of each bin (seconds). */
  tSeconds: Float64Array;
  /** log10 of the bin's median reading, after a running median of three bins. */
  logMicrons: Float64Array;
  count: number;
}

let scratch = new Float64Array(64);

/**
 * Median of values[from, to) (mean of the two middle values for an even count), by quickselect on a reused
 * scratch copy, so the values are left as they are and nothing is allocated per call. Expected O(to − from).
 */
export function medianOf(values: ArrayLike<number>, from: number, to: number): number {
  const n = to - from;
  if (n <= 0) return NaN;
  if (n === 1) return values[from];
  if (scratch.length < n) scratch = new Float64Array(Math.max(n, 2 * scratch.length));
  for (let i = 0; i < n; i++) scratch[i] = values[from + i];
  return medianInPlace(scratch, 0, n);
}

/** A bin holding more readings than this is summarised by the median of this many spread evenly over it. */
const BIN_MEDIAN_READINGS = 63;

/**
 * Median of a bin of readings, values[from, to): of every reading when there are at most
 * BIN_MEDIAN_READINGS, else of that many taken at an even stride. The bins only smooth the series for
 * finding its turns (the isolation is then placed on every reading), and the median of 63 readings is
 * within a few per cent of the bin's own (its sampling spread is 1.25/√63 ≈ 16 % of the readings'
 * scatter), so a long log's thousands of readings a bin need not all be copied and selected.
 */
function binMedian(values: ArrayLike<number>, from: number, to: number): number {
  const n = to - from;
  if (n <= BIN_MEDIAN_READINGS) return medianOf(values, from, to);
  if (scratch.length < BIN_MEDIAN_READINGS) scratch = new Float64Array(64);
  const step = n / BIN_MEDIAN_READINGS;
  for (let k = 0; k < BIN_MEDIAN_READINGS; k++) scratch[k] = values[from + Math.floor(k * step)];
  return medianInPlace(scratch, 0, BIN_MEDIAN_READINGS);
}

/** Median of values[from, to) when they are known to be ascending: the middle one (or the mean of the two). */
function medianOfAscending(values: ArrayLike<number>, from: number, to: number): number {
  const n = to - from;
  if (n <= 0) return NaN;
  const k = from + (n >> 1);
  return n % 2 ? values[k] : (values[k - 1] + values[k]) / 2;
}

/**
 * Median positive step between consecutive times (seconds), from at most ~20,000 steps: the step a full
 * ascending sort would put at index ⌊m/2⌋ of the m positive steps, found by quickselect (O(m)).
 */
export function medianIntervalSeconds(t: ArrayLike<number>): number {
  const n = t.length;
  if (n < 2) return 1;
  const stride = Math.max(1, Math.floor(n / 20000));
  const steps = new Float64Array(Math.floor((n - 1) / stride));
  let m = 0;
  for (let i = stride; i < n; i += stride) {
    const d = (t[i] - t[i - stride]) / stride;
    if (d > 0) steps[m++] = d;
  }
  if (m === 0) return 1;
  return kthSmallestInPlace(steps, m >> 1, 0, m);
}

/**
 * Relative gauge noise (standard deviation as a fraction of the reading) from the lower quartile of
 * the absolute second differences of log readings. For white noise Δ²y ~ N(0, 6σ²) and the lower
 * quartile of |N(0, s²)| is 0.3186·s, so σ_rel ≈ ln(10) · Q25(|Δ² log10 p|) / (0.3186 · √6). Second
 * differences cancel straight-line trends; the lower quartile ignores spikes and the curvature of a
 * sparsely sampled pull-down (robust scale estimation in the manner of Hampel 1974). Capped at 20 %.
 * The quartile is the element at ⌊m/4⌋ by quickselect on the strided typed array, not simple-statistics'
 * quantile (which copies the array and interpolates between elements, so the 0.3186 factor would not hold).
 */
export function relativeNoise(microns: ArrayLike<number>): number {
  const n = microns.length;
  if (n < 4) return 0.02;
  const stride = Math.max(1, Math.floor(n / 20000));
  const d = new Float64Array(Math.ceil((n - 2) / stride));
  let m = 0;
  if (stride === 1) {
    // each log10 once (the same values as taking them afresh for every difference)
    let l2 = Math.log10(microns[0]);
    let l1 = Math.log10(microns[1]);
    for (let i = 2; i < n; i++) {
      const l0 = Math.log10(microns[i]);
      d[m++] = Math.abs(l0 - 2 * l1 + l2);
      l2 = l1;
      l1 = l0;
    }
  } else {
    for (let i = 2; i < n; i += stride) d[m++] = Math.abs(Math.log10(microns[i]) - 2 * Math.log10(microns[i - 1]) + Math.log10(microns[i - 2]));
  }
  // the lower quartile as the element a full sort would put at index ⌊m/4⌋, by quickselect (O(m))
  const q25 = kthSmallestInPlace(d, m >> 2, 0, m);
  return Math.min(Math.max((Math.LN10 * q25) / (0.3186 * Math.sqrt(6)), 0.001), 0.2);
}

/** Bin readings by time so that there are at most `maxBins` bins and each spans ≥ one interval. */
export function binReadings(t: ArrayLike<number>, microns: ArrayLike<number>, maxBins = 3000): Bins {
  const n = t.length;
  const span = n > 1 ? t[n - 1] - t[0] : 0;
  const width = Math.max(span / maxBins, 0);
  const starts: number[] = [];
  let edge = -Infinity;
  for (let i = 0; i < n; i++) {
    if (t[i] >= edge) {
      starts.push(i);
      edge = t[i] + width;
      if (width === 0) edge = t[i] + 1e-9;
    }
  }
  const count = starts.length;
  const start = new Int32Array(count + 1);
  for (let j = 0; j < count; j++) start[j] = starts[j];
  start[count] = n;
  let ascending = true;
  for (let i = 1; i < n && ascending; i++) if (!(t[i] >= t[i - 1])) ascending = false;
  const tMid = new Float64Array(count);
  const raw = new Float64Array(count);
  for (let j = 0; j < count; j++) {
    tMid[j] = ascending ? medianOfAscending(t, start[j], start[j + 1]) : medianOf(t, start[j], start[j + 1]);
    raw[j] = Math.log10(binMedian(microns, start[j], start[j + 1]));
  }
  return { start, tSeconds: tMid, logMicrons: runningMedian(raw, count >= 60 ? 5 : 3), count };
}

/** Running median with an odd window (edges use the part of the window that exists). */
export function runningMedian(values: Float64Array, window: number): Float64Array {
  const n = values.length;
  const half = window >> 1;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = medianOf(values, Math.max(0, i - half), Math.min(n, i + half + 1));
  return out;
}

export interface Pivot {
  kind: "peak" | "trough";
  /** Bin index. */
  bin: number;
  /** False for the last, still-open extreme at the end of the log. */
  confirmed: boolean;
}

/**
 * Zig-zag pivots of a log10 series: a peak (trough) is confirmed once the series has fallen (risen) by
 * more than `threshold` from it, and by more than `minMicrons` in microns (a coarse gauge's steps are not
 * turns). Linear time. The last extreme is returned unconfirmed.
 */
export function zigzag(y: Float64Array, threshold: number, minMicrons = 0): Pivot[] {
  const n = y.length;
  const pivots: Pivot[] = [];
  if (n === 0) return pivots;
  let trend = 0;
  let hi = 0;
  let lo = 0;
  for (let j = 1; j < n; j++) {
    if (trend >= 0 && y[j] > y[hi]) hi = j;
    if (trend <= 0 && y[j] < y[lo]) lo = j;
    if (trend >= 0 && y[hi] - y[j] > threshold && (minMicrons === 0 || 10 ** y[hi] - 10 ** y[j] > minMicrons)) {
      pivots.push({ kind: "peak", bin: hi, confirmed: true });
      trend = -1;
      lo = j;
    } else if (trend <= 0 && y[j] - y[lo] > threshold && (minMicrons === 0 || 10 ** y[j] - 10 ** y[lo] > minMicrons)) {
      pivots.push({ kind: "trough", bin: lo, confirmed: true });
      trend = 1;
      hi = j;
    }
  }
  if (trend > 0) pivots.push({ kind: "peak", bin: hi, confirmed: false });
  else if (trend < 0) pivots.push({ kind: "trough", bin: lo, confirmed: false });
  else pivots.push({ kind: "trough", bin: lo, confirmed: false });
  return pivots;
}

/**
 * Take out one- or two-bin excursions that come straight back (a bumped hose, a hand on the gauge, a
 * wireless glitch) from a log10 series, in place: bins whose value leaves both outer neighbours by more
 * than `threshold` in the same direction while those neighbours agree within it are replaced by the
 * straight line between the neighbours. A sparse log has one reading a bin, so its running median of
 * three keeps a two-reading spike; this does not (a turn of the curve has neighbours that disagree).
 * Linear in the bins. Hampel-style outlier replacement (F. R. Hampel, J. Amer. Statist. Assoc. 69 (1974) 383).
 */
export function removeShortExcursions(y: Float64Array, threshold: number): number {
  const n = y.length;
  let removed = 0;
  for (let j = 1; j + 1 < n; j++) {
    const a = y[j - 1];
    for (const width of [1, 2]) {
      if (j + width >= n) break;
      const d = y[j + width];
      if (Math.abs(a - d) > threshold) continue;
      const lo = Math.min(a, d);
      const hi = Math.max(a, d);
      let up = true;
      let down = true;
      for (let k = j; k < j + width; k++) {
        if (!(y[k] > hi + threshold)) up = false;
        if (!(y[k] < lo - threshold)) down = false;
      }
      if (!up && !down) continue;
      for (let k = j; k < j + width; k++) y[k] = a + ((d - a) * (k - j + 1)) / (width + 1);
      removed += width;
      j += width - 1;
      break;
    }
  }
  return removed;
}

/**
 * The display step of the gauge below 1,000 microns: 100 or 10 when nearly every reading there (95 %, of
 * at most ~20,000 looked at) is a multiple of it, within 2 % of a step (readings exported in another unit
 * and converted back carry that much rounding), else 1. Cheap gauges step in 10 or 100 microns; common
 * practice, no published source.
 */
export function resolutionMicrons(microns: ArrayLike<number>): number {
  const n = microns.length;
  const stride = Math.max(1, Math.floor(n / 20000));
  let low = 0;
  let of100 = 0;
  let of10 = 0;
  for (let i = 0; i < n; i += stride) {
    const v = microns[i];
    if (!(v > 0 && v < 1000)) continue;
    low++;
    if (Math.abs(v / 100 - Math.round(v / 100)) < 0.02) of100++;
    if (Math.abs(v / 10 - Math.round(v / 10)) < 0.02) of10++;
  }
  if (low < 10) return 1;
  return of100 >= 0.95 * low ? 100 : of10 >= 0.95 * low ? 10 : 1;
}
