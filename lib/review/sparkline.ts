/**
 * A tiny curve for lists: the series thinned to at most `points` readings by taking each
 * bucket's highest value (a rise must stay visible), microns floored at 1 for the log scale.
 */
import { bucketExtremes } from "@/analysis/shared/downsample";

export interface Sparkline {
  /** Minutes from the first data row. */
  xMinutes: number[];
  microns: number[];
  isolationMinutes: number | null;
  limitMicrons: number | null;
}

export function sparklineOf(series: { t: number[]; p: number[] } | null, opts: { isolationAtSeconds: number | null; limitMicrons: number | null; points?: number }): Sparkline | null {
  if (!series || series.t.length < 2) return null;
  const n = Math.min(series.t.length, series.p.length);
  const buckets = Math.min(opts.points ?? 48, n);
  const xMinutes: number[] = [];
  const microns: number[] = [];
  // buckets ≤ n, so every bucket holds at least one reading
  bucketExtremes(series.p, n, buckets, (_lo, hi) => {
    xMinutes.push(series.t[hi] / 60);
    microns.push(Math.max(1, series.p[hi]));
  });
  return {
    xMinutes,
    microns,
    isolationMinutes: opts.isolationAtSeconds != null ? opts.isolationAtSeconds / 60 : null,
    limitMicrons: opts.limitMicrons,
  };
}
