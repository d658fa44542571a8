/** Axis ticks people can read (pure): 1-2-5 steps on a log pressure axis, round minutes on a linear one. */
import { describe, expect, it } from "vitest";
import { logTicks125, roundLinearTicks } from "@/components/curve/log-ticks";

describe("log-axis ticks at 1-2-5 steps (common practice for log scales, no published source)", () => {
  it("a pull-down from 20,000 to 300 microns is labelled 500, 1,000, 2,000, 5,000, 10,000, 20,000", () => {
    expect(logTicks125(280, 28_000)).toEqual([500, 1000, 2000, 5000, 10_000, 20_000]);
  });
  it("a narrow hold range still gets at least three labels (3 and 7 added, then every multiple)", () => {
    expect(logTicks125(420, 1_400)).toEqual([500, 700, 1000]);
    expect(logTicks125(600, 900).length).toBeGreaterThanOrEqual(3);
    expect(logTicks125(0, 10)).toEqual([]);
  });
});

describe("round linear ticks (minutes)", () => {
  it("0.6 to 42.9 minutes reads 10, 20, 30, 40 (never the data's own ends)", () => {
    expect(roundLinearTicks(0.6, 42.9)).toEqual([10, 20, 30, 40]);
    expect(roundLinearTicks(0, 42.9)).toEqual([0, 10, 20, 30, 40]);
    expect(roundLinearTicks(0, 3)).toEqual([0, 0.5, 1, 1.5, 2, 2.5, 3]);
    for (const t of roundLinearTicks(0.6, 187.3)) expect(t % 10 === 0 || t % 5 === 0 || t % 2 === 0).toBe(true);
  });
});
