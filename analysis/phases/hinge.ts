/**
 * Locating the isolation point: the pump valved off is where the curve stops falling and starts
 * rising. Two straight lines are fitted by least squares, one to each side of every candidate split
 * (the split reading belongs to both), and the split with the smallest total residual sum of squares
 * wins (a segmented regression / change-point search; Hinkley 1969). Prefix sums make each candidate
 * O(1), so the search is linear in the window length.
 */

/** 3-point running median of microns[from..to] (inclusive), edges copied. */
function median3(values: ArrayLike<number>, from: number, to: number): Float64Array {
  const n = to - from + 1;
  const out = new Float64Array(n);
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

/**
 * Index (into the full arrays) of the best split between a falling and a rising/flat straight
 * line on readings [from, to]. Needs at least two readings on each side; returns `fallback`
 * when the window is too short.
 */
export function hingeSplit(t: ArrayLike<number>, microns: ArrayLike<number>, from: number, to: number, fallback: number): number {
  const n = to - from + 1;
  if (n < 5) return fallback;
  const y = median3(microns, from, to);
  const t0 = t[from];
  // prefix sums of 1, x, y, x², xy, y²
  const sx = new Float64Array(n + 1);
  const sy = new Float64Array(n + 1);
  const sxx = new Float64Array(n + 1);
  const sxy = new Float64Array(n + 1);
  const syy = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) {
    const x = t[from + i] - t0;
    sx[i + 1] = sx[i] + x;
    sy[i + 1] = sy[i] + y[i];
    sxx[i + 1] = sxx[i] + x * x;
    sxy[i + 1] = sxy[i] + x * y[i];
    syy[i + 1] = syy[i] + y[i] * y[i];
  }
  // residual sum of squares and slope of a line through points [a, b)
  const lineFit = (a: number, b: number): { rss: number; slope: number } => {
    const m = b - a;
    const mx = (sx[b] - sx[a]) / m;
    const my = (sy[b] - sy[a]) / m;
    const cxx = sxx[b] - sxx[a] - m * mx * mx;
    const cxy = sxy[b] - sxy[a] - m * mx * my;
    const cyy = syy[b] - syy[a] - m * my * my;
    if (cxx <= 0) return { rss: Math.max(cyy, 0), slope: 0 };
    return { rss: Math.max(cyy - (cxy * cxy) / cxx, 0), slope: cxy / cxx };
  };
  let best = fallback;
  let bestRss = Infinity;
  for (let k = 1; k <= n - 2; k++) {
    const left = lineFit(0, k + 1);
    const right = lineFit(k, n);
    // the left side must not be rising faster than the right: a pull-down turning into a hold
    if (left.slope > right.slope) continue;
    const rss = left.rss + right.rss;
    if (rss < bestRss) {
      bestRss = rss;
      best = from + k;
    }
  }
  return best;
}
