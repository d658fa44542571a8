/**
 * Long holds are fitted on equal-time-bin means (analysis/decay/fit/reduce.ts). These tests show the binned fit
 * agrees with the fit on every reading, on generated holds with known truth (invented data, seeded noise:
 * 2 % of the reading, rounded to the gauge's resolution step — analysis/decay/fit/synthetic.ts).
 *
 * The unbinned reference is the same variable-projection fit (fitPlateauModel) run
 * on all readings. Tolerances, both relative to the unbinned fit's own standard errors (SE):
 * - each parameter within 0.3 SE: binning may move an estimate by a small fraction of its own uncertainty
 *   (measured: under 0.2 SE on these holds), far below what any decision can see;
 * - each SE within ±20 %: s² from B bin residuals has a relative sampling sd of about √(2/B) ≈ 6 % at
 *   500 bins, so ±20 % is about three of those sds.
 * Common practice for grouped-data least squares, no published source for the thresholds.
 */
import { describe, expect, it } from "vitest";
import { fitHoldModels } from "@/analysis/decay/fit/index";
import { HOLD_MODEL_PARAMS, type HoldParams } from "@/analysis/decay/fit/models";
import { BIN_ABOVE_POINTS, binCountFor, reduceHold } from "@/analysis/decay/fit/reduce";
import { syntheticHold } from "@/analysis/decay/fit/synthetic";
import { fitPlateauModel } from "@/analysis/decay/fit/varpro";

interface Case {
  name: string;
  truth: HoldParams;
  holdSeconds: number;
  sampleSeconds: number;
  seeds: number[];
}

const CASES: Case[] = [
  { name: "1-hour hold at 1 Hz, moisture and a leak", truth: { p0: 300, a: 250, tauSeconds: 300, l: 1 / 60 }, holdSeconds: 2700, sampleSeconds: 1, seeds: [1, 2, 3] },
  { name: "1-hour hold at 1 Hz, moisture only", truth: { p0: 350, a: 600, tauSeconds: 240 }, holdSeconds: 2700, sampleSeconds: 1, seeds: [4, 5] },
  { name: "30-minute hold at 1 Hz, fast rise and a leak", truth: { p0: 400, a: 150, tauSeconds: 120, l: 0.3 }, holdSeconds: 1800, sampleSeconds: 1, seeds: [6, 7] },
  { name: "2-hour hold every 2 s, slow rise and a leak", truth: { p0: 250, a: 400, tauSeconds: 900, l: 0.02 }, holdSeconds: 7200, sampleSeconds: 2, seeds: [8] },
  { name: "24-hour hold at 1 Hz", truth: { p0: 300, a: 1500, tauSeconds: 600, l: 0.05 }, holdSeconds: 86400, sampleSeconds: 1, seeds: [9] },
];

describe("fitHoldModels on bin means agrees with the fit on every reading (generated holds; tolerances in the file header, common practice, no published source)", () => {
  for (const c of CASES)
    for (const seed of c.seeds)
      it(`${c.name} (seed ${seed}): every parameter within 0.3 SE and every SE within 20 % of the unbinned fit`, () => {
        const h = syntheticHold(c.truth, { holdSeconds: c.holdSeconds, sampleSeconds: c.sampleSeconds, seed });
        expect(h.tSeconds.length).toBeGreaterThan(BIN_ABOVE_POINTS);
        const kind = c.truth.l === undefined ? "plateau" : "plateau_climb";
        const withClimb = kind === "plateau_climb";
        // the τ range fitHoldModels searches: [min(1 s, half a sample), 10× the hold]
        const full = fitPlateauModel(Float64Array.from(h.tSeconds), Float64Array.from(h.microns), withClimb, Math.min(1, c.sampleSeconds / 2), 10 * c.holdSeconds);
        expect(full.fit).not.toBeNull();
        const r = fitHoldModels(h.tSeconds, h.microns, { robust: false });
        expect(r.rule).toMatch(/equal-time-bin means/);
        expect(r.chosen).toBe(kind);
        const binned = r.fits[kind]!;
        HOLD_MODEL_PARAMS[kind].forEach((name, j) => {
          const se = full.fit!.stdErrors[j];
          const diff = Math.abs((binned.params[name] as number) - full.fit!.params[j]);
          expect(diff, `${name}: binned ${binned.params[name]}, unbinned ${full.fit!.params[j]} ± ${se}`).toBeLessThanOrEqual(0.3 * se);
          const seRatio = (binned.stdErrors[name] as number) / se;
          expect(seRatio, `${name} SE ratio`).toBeGreaterThan(0.8);
          expect(seRatio).toBeLessThan(1.2);
        });
      });
});

describe("reduceHold — bin count and bin means (common practice, no published source)", () => {
  it("keeps holds of up to 1,000 readings as they are and leaves excluded readings out", () => {
    const t = Float64Array.from({ length: 1001 }, (_, i) => i);
    const p = Float64Array.from({ length: 1001 }, (_, i) => 300 + i);
    const excluded = new Uint8Array(1001);
    excluded[10] = 1;
    const r = reduceHold(t, p, excluded);
    expect(r.binned).toBe(false);
    expect(r.tSeconds.length).toBe(1000);
    expect(r.microns[10]).toBe(311);
  });

  it("bins 2,700 readings at 1 Hz into 500 bins whose means lie on a straight line exactly (a mean of a line is the line at the mean time)", () => {
    const n = 2700;
    const t = Float64Array.from({ length: n }, (_, i) => i);
    const p = Float64Array.from({ length: n }, (_, i) => 300 + 0.5 * i);
    const r = reduceHold(t, p, new Uint8Array(n));
    expect(r.binned).toBe(true);
    expect(r.tSeconds.length).toBe(500);
    let worst = 0;
    for (let j = 0; j < r.tSeconds.length; j++) worst = Math.max(worst, Math.abs(r.microns[j] - (300 + 0.5 * r.tSeconds[j])));
    // only rounding error of summing a few readings (microns)
    expect(worst).toBeLessThan(1e-9);
  });

  it("asks for 30 s bins between 500 and 1,000 of them", () => {
    expect(binCountFor(2700)).toBe(500);
    expect(binCountFor(20_000)).toBe(667);
    expect(binCountFor(86_400)).toBe(1000);
  });
});
