import { describe, expect, it } from "vitest";
import { classifyHold, type HoldEvidence } from "@/analysis/classify";
import { DEFAULT_PROFILE } from "@/analysis/profile";
import type { HoldFitResult, HoldModelKind, ModelFit } from "@/analysis/types";

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

  it("keeps confidence within 0–1 and higher for a clear leak than for a borderline one", () => {
    const clear = classifyHold(fitOf("climb", { p0: 300, l: 200 / 60 }), evidence({ maxMicrons: 3000 }), DEFAULT_PROFILE, null);
    const borderline = classifyHold(fitOf("climb", { p0: 300, l: 21 / 60 }), evidence({ maxMicrons: 620 }), DEFAULT_PROFILE, null);
    expect(clear.confidence).toBeLessThanOrEqual(1);
    expect(borderline.confidence).toBeGreaterThan(0);
    expect(clear.confidence).toBeGreaterThan(borderline.confidence);
  });
});
