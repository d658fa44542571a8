/**
 * Locating the isolation point: the pump valved off is where the curve stops falling and starts
 * rising. A continuous broken line (two straight pieces joined at a candidate reading) is fitted by
 * least squares at every candidate, and the joint with the smallest residual sum of squares wins
 * (segmented regression with a change point; Hinkley 1969, Biometrika 56:495). Prefix sums make each
 * candidate O(1), so the search is linear in the window length.
 */
import { runningMedian3 } from "../fit/median";

/**
 * Scratch arrays reused from call to call (grown when a window is longer): a multi-day log's flat floor
 * can put a quarter of a million readings in the window, and six fresh arrays that size per call are
 * garbage the collector must then chase. Single-threaded, so module state is safe.
 */
let scratch = new Float64Array(0);
function scratchFor(n: number): Float64Array {
  if (scratch.length < 6 * (n + 1)) scratch = new Float64Array(Math.max(6 * (n + 1), 2 * scratch.length));
  return scratch;
}

/**
 * Index (into the full arrays) of the best split between a falling and a rising/flat straight
 * line on readings [from, to], the split searched within [splitFrom, splitTo]. Needs at least two
 * readings on each side; returns `fallback` when the window is too short.
 */
export function hingeSplit(
  t: ArrayLike<number>,
  microns: ArrayLike<number>,
  from: number,
  to: number,
  fallback: number,
  splitFrom = from,
  splitTo = to,
): number {
  const n = to - from + 1;
  if (n < 5) return fallback;
  const buffer = scratchFor(n);
  const part = (k: number) => buffer.subarray(k * (n + 1), (k + 1) * (n + 1));
  // a 3-point median guards against spikes on dense logs; on sparse ones it would erase the corner
  const y = part(5);
  if (n >= 15) runningMedian3(microns, from, to, y);
  else for (let i = 0; i < n; i++) y[i] = microns[from + i];
  const t0 = t[from];
  // prefix sums of 1, x, y, x², xy, y² (index 0 is the empty sum)
  const sx = part(0);
  const sy = part(1);
  const sxx = part(2);
  const sxy = part(3);
  const syy = part(4);
  sx[0] = sy[0] = sxx[0] = sxy[0] = syy[0] = 0;
  for (let i = 0; i < n; i++) {
    const x = t[from + i] - t0;
    sx[i + 1] = sx[i] + x;
    sy[i + 1] = sy[i] + y[i];
    sxx[i + 1] = sxx[i] + x * x;
    sxy[i + 1] = sxy[i] + x * y[i];
    syy[i + 1] = syy[i] + y[i] * y[i];
  }
  // continuous hinge at x_k: y = a + b·min(x − x_k, 0) + c·max(x − x_k, 0); normal equations from
  // the prefix sums, solved by Cramer's rule (3 × 3), so each candidate costs O(1)
  const seg = (i: number, j: number) => ({
    n: j - i,
    x: sx[j] - sx[i],
    xx: sxx[j] - sxx[i],
    xy: sxy[j] - sxy[i],
    y: sy[j] - sy[i],
  });
  const all = seg(0, n);
  const yy = syy[n];
  let best = fallback;
  let bestRss = Infinity;
  for (let k = Math.max(1, splitFrom - from); k <= Math.min(n - 2, splitTo - from); k++) {
    const xk = t[from + k] - t0;
    const L = seg(0, k + 1);
    const R = seg(k + 1, n);
    const su = L.x - L.n * xk;
    const suu = L.xx - 2 * xk * L.x + L.n * xk * xk;
    const suy = L.xy - xk * L.y;
    const sv = R.x - R.n * xk;
    const svv = R.xx - 2 * xk * R.x + R.n * xk * xk;
    const svy = R.xy - xk * R.y;
    const det = n * suu * svv - su * su * svv - sv * sv * suu;
    if (!(Math.abs(det) > 1e-12)) continue;
    const a = (all.y * suu * svv - su * suy * svv - sv * svy * suu) / det;
    const b = (n * suy * svv - all.y * su * svv - sv * sv * suy + sv * su * svy) / det;
    const c = (n * suu * svy - su * su * svy - all.y * sv * suu + su * sv * suy) / det;
    // a pull-down turning into a hold: the right side must rise faster than the left
    if (b > c) continue;
    const rss = yy - (a * all.y + b * suy + c * svy);
    if (rss < bestRss) {
      bestRss = rss;
      best = from + k;
    }
  }
  return best;
}

/** Windows longer than this many readings are searched coarse to fine (a multi-day log's flat floor). */
export const HINGE_FULL_READINGS = 20000;

/**
 * hingeSplit for any window length in time linear in HINGE_FULL_READINGS rather than the window: a
 * window longer than that is first searched on every k-th reading (k = ⌈length / HINGE_FULL_READINGS⌉),
 * then again on every reading within HINGE_FULL_READINGS / 2 of that split, the split searched within
 * 2k readings of it. The two lines are then fitted to the readings near the corner only, which is where
 * they matter. Same result as hingeSplit on windows up to HINGE_FULL_READINGS.
 */
export function hingeSplitBounded(
  t: ArrayLike<number>,
  microns: ArrayLike<number>,
  from: number,
  to: number,
  fallback: number,
  splitFrom = from,
  splitTo = to,
): number {
  const n = to - from + 1;
  if (n <= HINGE_FULL_READINGS) return hingeSplit(t, microns, from, to, fallback, splitFrom, splitTo);
  const k = Math.ceil(n / HINGE_FULL_READINGS);
  const m = Math.floor((n - 1) / k) + 1;
  const tc = new Float64Array(m);
  const pc = new Float64Array(m);
  for (let j = 0; j < m; j++) {
    tc[j] = t[from + j * k];
    pc[j] = microns[from + j * k];
  }
  const toCoarse = (i: number) => Math.min(m - 1, Math.max(0, Math.round((i - from) / k)));
  const coarse = from + k * hingeSplit(tc, pc, 0, m - 1, toCoarse(fallback), toCoarse(splitFrom), toCoarse(splitTo));
  const half = HINGE_FULL_READINGS >> 1;
  const lo = Math.max(from, coarse - half);
  const hi = Math.min(to, coarse + half);
  return hingeSplit(t, microns, lo, hi, coarse, Math.max(splitFrom, coarse - 2 * k, lo), Math.min(splitTo, coarse + 2 * k, hi));
}
