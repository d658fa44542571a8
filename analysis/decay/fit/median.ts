/**
 * Median by quickselect (Hoare's FIND, 1961): expected O(n), reorders the given range in place.
 * Kept beside simple-statistics (which the engine uses where a copy costs nothing): the phase and fit
 * loops call these on reused typed-array scratch, where the library's copy per call would allocate.
 * Even counts give the mean of the two middle values.
 */
export function medianInPlace(v: Float64Array, from = 0, to = v.length): number {
  const n = to - from;
  if (n <= 0) return NaN;
  const k = from + (n >> 1);
  const hi = select(v, from, to - 1, k);
  if (n % 2) return hi;
  // The lower middle is the largest value left of k after the partition.
  let lo = -Infinity;
  for (let i = from; i < k; i++) if (v[i] > lo) lo = v[i];
  return (lo + hi) / 2;
}

/**
 * The k-th smallest of v[from, to) (k counted from 0 within the range), by the same quickselect; reorders
 * the range in place. The value is the one a full ascending sort would put at position from + k.
 */
export function kthSmallestInPlace(v: Float64Array, k: number, from = 0, to = v.length): number {
  if (k < 0 || k >= to - from) return NaN;
  return select(v, from, to - 1, from + k);
}

function select(v: Float64Array, left: number, right: number, k: number): number {
  while (right > left) {
    const pivot = v[(left + right) >> 1];
    let i = left;
    let j = right;
    while (i <= j) {
      while (v[i] < pivot) i++;
      while (v[j] > pivot) j--;
      if (i <= j) {
        const tmp = v[i];
        v[i] = v[j];
        v[j] = tmp;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else return v[k];
  }
  return v[k];
}

/**
 * 3-point running median of values[from..to] (inclusive), the first and last reading copied, written
 * into `out` from index 0 (a fresh array when none is given): a lone spike never survives it, a step
 * does. One pass, no allocation when `out` is given (the phase search reuses its scratch).
 * Reference: J. W. Tukey, Exploratory Data Analysis (1977), running medians of 3.
 */
export function runningMedian3(values: ArrayLike<number>, from: number, to: number, out: Float64Array = new Float64Array(Math.max(0, to - from + 1))): Float64Array {
  const n = to - from + 1;
  for (let i = 0; i < n; i++) {
    const j = from + i;
    if (i === 0 || i === n - 1) out[i] = values[j];
    else {
      const a = values[j - 1];
      const b = values[j];
      const c = values[j + 1];
      out[i] = Math.max(Math.min(a, b), Math.min(Math.max(a, b), c));
    }
  }
  return out;
}
