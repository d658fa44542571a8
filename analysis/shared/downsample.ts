/**
 * Downsampling a log for a chart without losing what matters (min/max decimation, in the spirit of
 * LTTB, Steinarsson 2013, but keeping extremes exactly so a dip or spike never vanishes):
 *
 *  - bucketExtremes: the lowest and highest reading of each of a number of equal-count buckets (the
 *    report's and the lists' small curves);
 *  - downsampleForChart: equal-time buckets, each keeping its first, lowest, highest and last reading,
 *    and the readings nearest the `keepTimes` (isolation, end of hold) always (the test's chart).
 * Both O(n).
 */

/**
 * Cuts values[0, n) into `buckets` equal-count buckets, bucket b = [⌊b·n/buckets⌋, ⌊(b+1)·n/buckets⌋),
 * and calls visit(lowest, highest) with the indices of each bucket's lowest and highest value (the
 * first of equal ones), bucket by bucket. An empty bucket (buckets > n) reports its start index twice.
 */
export function bucketExtremes(values: ArrayLike<number>, n: number, buckets: number, visit: (lowest: number, highest: number) => void): void {
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor((b * n) / buckets);
    const to = Math.floor(((b + 1) * n) / buckets);
    let lo = from;
    let hi = from;
    for (let i = from; i < to; i++) {
      if (values[i] < values[lo]) lo = i;
      if (values[i] > values[hi]) hi = i;
    }
    visit(lo, hi);
  }
}
export interface ChartSeries {
  tSeconds: number[];
  microns: number[];
}

export function downsampleForChart(tSeconds: number[], microns: number[], maxPoints: number, keepTimes: number[] = []): ChartSeries {
  const n = Math.min(tSeconds.length, microns.length);
  if (n <= maxPoints || n < 3) return { tSeconds: tSeconds.slice(0, n), microns: microns.slice(0, n) };
  const keep = new Uint8Array(n);
  keep[0] = 1;
  keep[n - 1] = 1;
  for (const k of keepTimes) {
    // nearest reading by binary search
    let lo = 0;
    let hi = n - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (tSeconds[mid] < k) lo = mid + 1;
      else hi = mid;
    }
    const best = lo > 0 && Math.abs(tSeconds[lo - 1] - k) <= Math.abs(tSeconds[lo] - k) ? lo - 1 : lo;
    keep[best] = 1;
  }
  const buckets = Math.max(1, Math.floor((maxPoints - 2 - keepTimes.length) / 4));
  const t0 = tSeconds[0];
  const span = Math.max(tSeconds[n - 1] - t0, 1e-9);
  let i = 0;
  for (let b = 0; b < buckets && i < n; b++) {
    const edge = t0 + ((b + 1) * span) / buckets;
    const first = i;
    let lo = i;
    let hi = i;
    while (i < n && (tSeconds[i] <= edge || b === buckets - 1)) {
      if (microns[i] < microns[lo]) lo = i;
      if (microns[i] > microns[hi]) hi = i;
      i++;
    }
    if (i > first) {
      keep[first] = 1;
      keep[lo] = 1;
      keep[hi] = 1;
      keep[i - 1] = 1;
    }
  }
  const out: ChartSeries = { tSeconds: [], microns: [] };
  for (let k = 0; k < n; k++) {
    if (keep[k]) {
      out.tSeconds.push(tSeconds[k]);
      out.microns.push(microns[k]);
    }
  }
  return out;
}
