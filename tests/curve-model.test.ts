/**
 * The chart's min/max thinning (components/curve/model.ts decimateMinMax, on the shared
 * bucketExtremes of analysis/shared/downsample.ts): a spike or a dip inside a bucket is never
 * thinned away (common practice for plotting long series, no published source).
 */
import { describe, expect, it } from "vitest";
import { decimateMinMax } from "@/components/curve/model";

describe("decimateMinMax keeps each bucket's lowest and highest reading (common practice, no source)", () => {
  it("keeps a one-reading spike and a one-reading dip of a 10,000-reading log, in time order, at most two points a bucket", () => {
    const t = Array.from({ length: 10_000 }, (_, i) => i);
    const p = t.map((i) => 400 + (i % 7));
    p[4321] = 5000; // a bumped hose
    p[7777] = 0.2; // below the log axis' floor
    const out = decimateMinMax(t, p, 700);
    expect(out.length).toBeLessThanOrEqual(1400);
    expect(out.some((pt) => pt.y === 5000 && pt.x === 4321 / 60)).toBe(true);
    expect(out.some((pt) => pt.x === 7777 / 60 && pt.y === 1)).toBe(true); // floored at 1 micron
    for (let i = 1; i < out.length; i++) expect(out[i].x).toBeGreaterThan(out[i - 1].x);
  });

  it("returns every reading of a short log unchanged but for the floor", () => {
    expect(decimateMinMax([0, 60, 120], [300, 0.5, 320], 700)).toEqual([{ x: 0, y: 300 }, { x: 1, y: 1 }, { x: 2, y: 320 }]);
  });
});
