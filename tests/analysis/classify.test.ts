import { describe, expect, it } from "vitest";
import { classifyHold, type HoldEvidence } from "@/analysis/decay/classify";
import { DEFAULT_PROFILE } from "@/analysis/decay/profile";
import type { HoldFitResult, HoldModelKind, ModelFit } from "@/analysis/decay/types";

function fitOf(kind: HoldModelKind, params: ModelFit["params"]): HoldFitResult {
  const m: ModelFit = {
    kind, params, stdErrors: { p0: 1 }, covariance: [[1]], n: 60, dof: 56, rss: 100, residualSd: 5, rSquared: 0.99, aicc: 0,
    iterations: 5, stopReason: "converged", excluded: [],
  };
  return { chosen: kind, rule: "test", fits: { [kind]: m } };
}

const evidence = (over: Partial<HoldEvidence> = {}): HoldEvidence => ({
  holdSeconds: 900, readings: 90, startMicrons: 400, endMicrons: 600, maxMicrons: 620, isolationSeen: true, lateSlopeMicronsPerMinute: null, ...over,
});

describe("verdict (default profile: common practice, no published source)", () => {
  it("is pass for a level-off below the 1,000-micron limit, and meets the profile", () => {
    const c = classifyHold(fitOf("plateau", { p0: 400, a: 200, tauSeconds: 120 }), evidence(), DEFAULT_PROFILE, null);
    expect(c.verdict).toBe("pass");
    expect(c.meetsProfile).toBe(true);
    expect(c.decay!.plateauMicrons).toBe(600);
    expect(c.decay!.leakRateMicronsPerMinute).toBe(0);
  });

  it("is leak for a steady climb at or above 20 microns/min even while still below the limit", () => {
    const c = classifyHold(fitOf("climb", { p0: 300, l: 30 / 60 }), evidence({ maxMicrons: 750, lateSlopeMicronsPerMinute: 29 }), DEFAULT_PROFILE, null);
    expect(c.verdict).toBe("leak");
    expect(c.decay!.leakRateMicronsPerMinute).toBeCloseTo(30, 9);
    expect(c.profileRules.find((r) => r.rule === "leak_rate")!.met).toBe(false);
  });

  it("is not a leak below the threshold (10 microns/min)", () => {
    const c = classifyHold(fitOf("climb", { p0: 300, l: 10 / 60 }), evidence({ maxMicrons: 450 }), DEFAULT_PROFILE, null);
    expect(c.verdict).toBe("pass");
  });

  it("is not a leak when the second half of the hold is flat (a step, not a steady climb)", () => {
    const c = classifyHold(fitOf("climb", { p0: 500, l: 24 / 60 }), evidence({ maxMicrons: 740, lateSlopeMicronsPerMinute: 1 }), DEFAULT_PROFILE, null);
    expect(c.verdict).toBe("pass");
  });

  it("is moisture for a level-off above the limit and leak_and_moisture with a climb as well", () => {
    expect(classifyHold(fitOf("plateau", { p0: 300, a: 2500, tauSeconds: 150 }), evidence({ maxMicrons: 2800 }), DEFAULT_PROFILE, null).verdict).toBe("moisture");
    const both = classifyHold(fitOf("plateau_climb", { p0: 300, a: 2500, tauSeconds: 150, l: 2 }), evidence({ maxMicrons: 4000 }), DEFAULT_PROFILE, null);
    expect(both.verdict).toBe("leak_and_moisture");
    expect(both.decay!.leakRateMicronsPerMinute).toBeCloseTo(120, 9);
    expect(both.decay!.plateauMicrons).toBe(2800);
  });

  it("is inconclusive with no hold, with too few readings, or a short hold still under the limit", () => {
    expect(classifyHold(null, null, DEFAULT_PROFILE, null).verdict).toBe("inconclusive");
    expect(classifyHold(fitOf("flat", { p0: 400 }), evidence({ readings: 4 }), DEFAULT_PROFILE, null).verdict).toBe("inconclusive");
    const short = classifyHold(fitOf("plateau", { p0: 400, a: 100, tauSeconds: 60 }), evidence({ holdSeconds: 240, maxMicrons: 500 }), DEFAULT_PROFILE, null);
    expect(short.verdict).toBe("inconclusive");
    expect(short.profileRules.find((r) => r.rule === "hold_time")!.met).toBe(false);
  });

  it("decides a short hold that has already passed the limit with a climb (leak)", () => {
    const c = classifyHold(fitOf("climb", { p0: 200, l: 100 }), evidence({ holdSeconds: 230, maxMicrons: 24000 }), DEFAULT_PROFILE, null);
    expect(c.verdict).toBe("leak");
  });

  it("fails the target rule when isolated above 500 microns but still reads the curve", () => {
    const c = classifyHold(fitOf("plateau", { p0: 700, a: 100, tauSeconds: 100 }), evidence({ startMicrons: 700, maxMicrons: 810 }), DEFAULT_PROFILE, null);
    expect(c.verdict).toBe("pass");
    expect(c.meetsProfile).toBe(false);
    expect(c.profileRules.find((r) => r.rule === "target")!.met).toBe(false);
    expect(c.reasons.join(" ")).toMatch(/profile is not met/);
  });

  it("keeps confidence within 0.05–0.99 and higher for a clear leak than for one whose climb is within the scatter of the threshold", () => {
    const clear = classifyHold(fitOf("climb", { p0: 300, l: 200 / 60 }), evidence({ maxMicrons: 3000 }), DEFAULT_PROFILE, null);
    const noisy = fitOf("climb", { p0: 300, l: 21 / 60 });
    noisy.fits.climb!.residualSd = 60;
    const borderline = classifyHold(noisy, evidence({ maxMicrons: 620, readings: 12 }), DEFAULT_PROFILE, null);
    for (const c of [clear, borderline]) {
      expect(c.confidence).toBeGreaterThanOrEqual(0.05);
      expect(c.confidence).toBeLessThanOrEqual(0.99);
    }
    expect(clear.confidence).toBeGreaterThan(borderline.confidence);
    expect(clear.certainty.words).toBe("sure");
    expect(borderline.certainty.words).not.toBe("sure");
    expect(borderline.certainty.why.join(" ")).toMatch(/close to the 20 microns\/min/);
  });

  it("quotes the same highest value in the limit rule and in the reasons, with the single highest reading beside a smoothed one", () => {
    const c = classifyHold(fitOf("plateau", { p0: 300, a: 2300, tauSeconds: 150 }), evidence({ maxMicrons: 2650, rawMaxMicrons: 2790 }), DEFAULT_PROFILE, null);
    const limit = c.profileRules.find((r) => r.rule === "limit")!;
    expect(limit.detail).toContain("highest 2,650 microns (smoothed over 5 readings; highest single reading 2,790)");
    const plateauOnly = classifyHold(fitOf("flat", { p0: 1500 }), evidence({ maxMicrons: 2650, rawMaxMicrons: 2790 }), DEFAULT_PROFILE, null);
    expect(plateauOnly.reasons.join(" ")).toContain("highest 2,650 microns (smoothed over 5 readings; highest single reading 2,790)");
  });
});
