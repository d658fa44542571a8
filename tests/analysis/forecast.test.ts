/**
 * Forecast of the verdict at 10 minutes from the first 4 minutes of generated holds (invented data,
 * seeded noise: 2 % of the reading plus resolution steps, analysis/decay/fit/synthetic.ts), default profile:
 * limit 1,000 microns, leak from 20 microns/min. The rates asserted are Riseline's own acceptance
 * bars: common practice, no published source.
 */
import { describe, expect, it } from "vitest";
import { fitHoldModels } from "@/analysis/decay/fit/index";
import { holdModelMicrons, type HoldParams } from "@/analysis/decay/fit/models";
import { seededUniform } from "@/analysis/decay/fit/prng";
import { studentTCdf, studentTQuantile } from "@/analysis/decay/fit/student";
import { syntheticHold } from "@/analysis/decay/fit/synthetic";
import { earlyCallWithVerdict, forecastHold, FORECAST_BAND_POINTS } from "@/analysis/decay/forecast";
import { DEFAULT_PROFILE } from "@/analysis/decay/profile";
import { climbOf, curveVerdict, levelledOffWithin } from "@/analysis/decay/rule";

const LIMIT = DEFAULT_PROFILE.limitMicrons;

function earlyForecast(truth: HoldParams, seed: number) {
  const full = syntheticHold(truth, { holdSeconds: 600, seed });
  const t = full.tSeconds.slice(0, 241);
  const p = full.microns.slice(0, 241);
  const fit = fitHoldModels(t, p);
  return { forecast: forecastHold(fit, 240, DEFAULT_PROFILE, { tSeconds: t, microns: p }), trueAt600: holdModelMicrons(truth, 600), readingAt600: full.microns[600] };
}

/** The verdict the true curve gets at 10 minutes by the verdict's own rule, as pass/fail. */
function truthCall(truth: HoldParams): "pass" | "fail" {
  let highest = 0;
  for (let s = 0; s <= 600; s += 5) highest = Math.max(highest, holdModelMicrons(truth, s));
  const v = curveVerdict(
    {
      climbMicronsPerMinute: climbOf(truth, 600),
      lateSlopeMicronsPerMinute: ((holdModelMicrons(truth, 600) - holdModelMicrons(truth, 300)) / 300) * 60,
      plateauMicrons: truth.a !== undefined ? truth.p0 + truth.a : null,
      levelledOff: levelledOffWithin(truth, 600),
      maxMicrons: highest,
    },
    DEFAULT_PROFILE,
  );
  return v.verdict === "pass" ? "pass" : "fail";
}

describe("Student t quantile", () => {
  it("matches the two-sided 95 % table values t(1) 12.706, t(4) 2.776, t(12) 2.179, t(∞) 1.960 to 4 digits (standard t table, from memory)", () => {
    // Table values are printed to 3 decimals; 5e-4 is their rounding.
    expect(studentTQuantile(0.975, 1)).toBeCloseTo(12.706, 3);
    expect(studentTQuantile(0.975, 4)).toBeCloseTo(2.776, 3);
    expect(studentTQuantile(0.975, 12)).toBeCloseTo(2.179, 3);
    expect(studentTQuantile(0.975, 1e7)).toBeCloseTo(1.96, 3);
    expect(studentTQuantile(0.025, 4)).toBeCloseTo(-2.776, 3);
  });
  it("CDF of t with 1 dof is the Cauchy CDF ½ + atan(t)/π to 1e-12 (closed form)", () => {
    for (const t of [-3, -0.5, 0, 0.7, 4]) expect(studentTCdf(t, 1)).toBeCloseTo(0.5 + Math.atan(t) / Math.PI, 12);
  });
});

describe("forecastHold — early call from 4 of 10 minutes by the whole rule set (common practice, no published source)", () => {
  const u = seededUniform(7);
  const r = (lo: number, hi: number) => lo + (hi - lo) * u();
  const clear: [string, () => HoldParams, "pass" | "fail", number][] = [
    ["tight and dry (flat)", () => ({ p0: r(150, 600) }), "pass", 45],
    ["small plateau", () => ({ p0: r(150, 400), a: r(50, 300), tauSeconds: r(20, 120) }), "pass", 45],
    ["very slow climb (1–12 microns/min)", () => ({ p0: r(150, 400), l: r(0.02, 0.2) }), "pass", 45],
    // The case a limit-only call got wrong: a steady climb that stays under the limit at 10 minutes is still a leak.
    ["slow leak under the limit (26–48 microns/min)", () => ({ p0: r(150, 300), l: r(0.44, 0.8) }), "fail", 45],
    ["leak", () => ({ p0: r(150, 500), l: r(2, 10) }), "fail", 45],
    ["moisture", () => ({ p0: r(150, 500), a: r(1500, 4000), tauSeconds: r(20, 150) }), "fail", 45],
    ["moisture and a leak", () => ({ p0: r(150, 500), a: r(800, 3000), tauSeconds: r(20, 150), l: r(0.5, 5) }), "fail", 45],
  ];
  for (const [name, gen, expected, minRight] of clear) {
    it(`calls ${expected} early on ≥ ${minRight} of 50 clear "${name}" holds and wrong on none`, () => {
      let right = 0;
      let wrong = 0;
      for (let k = 0; k < 50; k++) {
        const truth = gen();
        expect(truthCall(truth)).toBe(expected);
        const { forecast } = earlyForecast(truth, 9000 + k);
        if (forecast.earlyCall === expected) right++;
        else if (forecast.earlyCall !== null) wrong++;
      }
      expect(right).toBeGreaterThanOrEqual(minRight);
      expect(wrong).toBe(0);
    });
  }

  it("over 200 borderline holds (near the limit or the leak rate) is wrong against the truth's verdict in ≤ 2 % and says which rule fails", () => {
    let calls = 0;
    let wrong = 0;
    for (let k = 0; k < 200; k++) {
      const kind = k % 4;
      const truth: HoldParams =
        kind === 0
          ? { p0: r(600, 1100) }
          : kind === 1
            ? { p0: r(150, 500), a: r(200, 1200), tauSeconds: r(20, 200) }
            : kind === 2
              ? { p0: r(150, 400), l: r(0.2, 0.5) }
              : { p0: r(150, 400), a: r(100, 800), tauSeconds: r(20, 150), l: r(0.1, 0.6) };
      const { forecast } = earlyForecast(truth, 20000 + k);
      if (forecast.earlyCall) {
        calls++;
        if (forecast.earlyCall !== truthCall(truth)) wrong++;
        if (forecast.earlyCall === "fail") expect(["limit", "leak_rate", "plateau"]).toContain(forecast.decidingRule);
        expect(forecast.agreement).toBeGreaterThanOrEqual(0.95);
      }
    }
    expect(calls).toBeGreaterThan(100);
    expect(wrong).toBeLessThanOrEqual(4);
  });
});

describe("forecastHold — band and widening (common practice, no published source)", () => {
  it("gives 31 band points from 0 to the hold time, low ≤ predicted ≤ high, wider at 10 min than at 4 min", () => {
    const { forecast } = earlyForecast({ p0: 300, a: 600, tauSeconds: 90 }, 5);
    expect(forecast.band.length).toBe(FORECAST_BAND_POINTS);
    expect(forecast.band[0].tSeconds).toBe(0);
    expect(forecast.band[FORECAST_BAND_POINTS - 1].tSeconds).toBe(600);
    for (const b of forecast.band) {
      expect(b.low).toBeLessThanOrEqual(b.microns);
      expect(b.high).toBeGreaterThanOrEqual(b.microns);
    }
    const width = (t: number) => {
      const b = forecast.band.find((x) => x.tSeconds === t)!;
      return b.high - b.low;
    };
    expect(width(600)).toBeGreaterThan(width(240));
    expect(forecast.basedOnSeconds).toBe(240);
    expect(forecast.predictedMicrons).toBe(forecast.band[FORECAST_BAND_POINTS - 1].microns);
  });

  it("covers the 10-minute reading with its 95 % band in 90–100 % of 100 holds", () => {
    const u = seededUniform(11);
    let covered = 0;
    for (let k = 0; k < 100; k++) {
      const { forecast, readingAt600 } = earlyForecast({ p0: 200 + 300 * u(), a: 100 + 900 * u(), tauSeconds: 20 + 130 * u() }, 30000 + k);
      if (readingAt600 >= forecast.lowMicrons && readingAt600 <= forecast.highMicrons) covered++;
    }
    expect(covered).toBeGreaterThanOrEqual(90);
  });

  it("makes no early call from 3 readings, too few to tell a rise from scatter", () => {
    const fit = fitHoldModels([0, 60, 120], [300, 320, 345]);
    const f = forecastHold(fit, 120, DEFAULT_PROFILE, { tSeconds: [0, 60, 120], microns: [300, 320, 345] });
    expect(f.earlyCall).toBeNull();
    expect(f.basis).toMatch(/too few readings/);
  });

  it("calls a whole-micron straight climb of 62 microns/min a fail from 10 typed readings (no scatter at all), and none from 9", () => {
    const nine = [0, 60, 120, 180, 240, 300, 360, 420, 480];
    const q = nine.map((s) => 350 + (62 * s) / 60);
    expect(forecastHold(fitHoldModels(nine, q), 480, { ...DEFAULT_PROFILE, holdMinutes: 15 }, { tSeconds: nine, microns: q }).earlyCall).toBeNull();
    const t = [...nine, 540];
    const p = t.map((s) => 350 + (62 * s) / 60);
    const f = forecastHold(fitHoldModels(t, p), 540, DEFAULT_PROFILE, { tSeconds: t, microns: p });
    expect(f.earlyCall).toBe("fail");
    expect(f.decidingRule).toBe("leak_rate");
  });

  it("makes no early call when the limit lies inside the interval", () => {
    // A climb (6 microns/min, no leak) that reaches the limit at about 10 minutes.
    const { forecast } = earlyForecast({ p0: 940, l: 0.1 }, 6);
    expect(forecast.lowMicrons).toBeLessThan(LIMIT);
    expect(forecast.highMicrons).toBeGreaterThan(LIMIT);
    expect(forecast.earlyCall).toBeNull();
  });

  it("turns the call into the verdict's own once the readings decided it (a short hold already past the limit)", () => {
    const { forecast } = earlyForecast({ p0: 300 }, 1);
    expect(forecast.earlyCall).toBe("pass");
    const decided = earlyCallWithVerdict(forecast, "leak", true);
    expect(decided.earlyCall).toBe("fail");
    expect(decided.decidingRule).toBe("leak_rate");
    expect(earlyCallWithVerdict(forecast, "inconclusive", false)).toBe(forecast);
  });
});
