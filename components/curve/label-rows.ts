/**
 * Rows for labels drawn along the top of a chart so that none overlaps another: each label, in the
 * order given, takes the first row where its span [x0, x1] (pixels, with a gap) clears every label
 * already placed in that row. Greedy interval placement; O(n · rows).
 */
export function labelRows(spans: readonly { x0: number; x1: number }[], gapPx = 4): number[] {
  const rows: { x0: number; x1: number }[][] = [];
  return spans.map((s) => {
    let r = 0;
    while (rows[r]?.some((o) => s.x0 < o.x1 + gapPx && o.x0 < s.x1 + gapPx)) r++;
    (rows[r] ??= []).push(s);
    return r;
  });
}
