import { describe, expect, it } from "vitest";
import {
  constantSpeedPumpDownSeconds,
  effectiveSpeedLps,
  knudsenConductanceLps,
  LPS_PER_CFM,
  molecularConductanceLps,
  pathEffectiveSpeedLps,
  seriesConductanceLps,
  shortTubeMolecularConductanceLps,
  viscousConductanceLps,
} from "@/analysis/calculators/conductance";
import { integratePullDown, planPullDown, planWhatIfs, type PlannerInput } from "@/analysis/calculators/planner";
import { comparePlanWithPullDown } from "@/analysis/calculators/planner-compare";
import { integrateWithLoad } from "@/analysis/calculators/planner-integrate";
import { MBAR_LITRES_PER_GRAM_WATER, waterLoadMbarLps, waterReleasedGrams } from "@/analysis/calculators/planner-load";
import { comparedWords } from "@/analysis/calculators/planner-whatifs";
import { systemVolumeLitres, tubeInsideDiameterIn } from "@/analysis/shared/volume";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("conductance of a round tube (air, 20 °C)", () => {
  it("molecular C = 12.1 d³/L for 3/8 in × 3 ft is 0.114352 L/s (Roth, Vacuum Technology; hand-worked)", () => {
    // d = 0.375 in = 0.9525 cm, L = 3 ft = 91.44 cm; d³ = 0.864162; 12.1 × 0.864162 / 91.44 = 0.114352 L/s.
    // Tolerance 1e-5 relative: the hand arithmetic carries 6 digits.
    expect(rel(molecularConductanceLps(0.9525, 91.44), 0.114352)).toBeLessThan(1e-5);
  });

  it("viscous 135 d⁴p̄/L agrees with Poiseuille π d⁴ p̄ /(128 η L), η = 1.81e-5 Pa·s, to 0.5 % (CHECK-VALUES, computed)", () => {
    // d = 1 cm, L = 100 cm, p̄ = 1 mbar: 135 × 1 × 1 / 100 = 1.35 L/s.
    expect(viscousConductanceLps(1, 100, 1)).toBeCloseTo(1.35, 12);
    // SI: π (0.01 m)⁴ (100 Pa) / (128 × 1.81e-5 Pa·s × 1 m) = 1.3560e-3 m³/s = 1.3560 L/s; 135 is that constant rounded.
    const poiseuilleLps = ((Math.PI * 0.01 ** 4 * 100) / (128 * 1.81e-5 * 1)) * 1000;
    expect(rel(viscousConductanceLps(1, 100, 1), poiseuilleLps)).toBeLessThan(0.005);
  });

  it("the Knudsen whole-range formula tends to the molecular and viscous limits (Roth, transcribed in CHECK-VALUES)", () => {
    // At d·p̄ = 1e-6 cm·mbar the transitional factor is 1 − 45e-6: within 1e-4 of molecular.
    expect(rel(knudsenConductanceLps(1, 100, 1e-6), molecularConductanceLps(1, 100))).toBeLessThan(1e-4);
    // At 100 mbar the molecular term (0.098 L/s) is 0.07 % of the viscous 135 L/s: within 0.1 %.
    expect(rel(knudsenConductanceLps(1, 100, 100), viscousConductanceLps(1, 100, 100))).toBeLessThan(0.001);
  });

  it("adds series conductances as reciprocals: 1/S_eff = 1/S + Σ 1/C (Roth; hand-worked)", () => {
    expect(seriesConductanceLps([2, 2])).toBeCloseTo(1, 12);
    // 10 CFM = 4.7195 L/s through 0.5 L/s: 1 / (1/4.7195 + 2) = 0.45210 L/s.
    expect(effectiveSpeedLps(10 * LPS_PER_CFM, [0.5])).toBeCloseTo(0.4521, 4);
  });

  it("the path solver equals the reciprocal sum in the molecular limit (1e-6 mbar; Roth, Dushman)", () => {
    const path = [{ name: "hose", diameterCm: 0.9525, lengthCm: 91.44, parallel: 2, assumed: false }];
    const s0 = 6 * LPS_PER_CFM;
    const solved = pathEffectiveSpeedLps(path, s0, 0, 1e-6);
    const expected = effectiveSpeedLps(s0, [2 * shortTubeMolecularConductanceLps(0.9525, 91.44)]);
    // Bisection to 32 halvings (2.3e-10); the transitional factor adds 4e-5: 1e-4 relative.
    expect(rel(solved, expected)).toBeLessThan(1e-4);
  });
});

describe("pull-down integration", () => {
  it("reproduces t = (V/S) ln(p0/p) at constant speed: 10 L, 6 CFM, 760,000 → 500 microns is 25.87 s (CHECK-VALUES; hand-worked)", () => {
    // S = 6 × 0.471947 = 2.83168 L/s; V/S = 3.53147 s; ln(1520) = 7.32647; t = 25.8734 s.
    const s = 6 * LPS_PER_CFM;
    const { timeToTargetSeconds } = integratePullDown({
      volumeLitres: 10, startMicrons: 760_000, endMicrons: 200, ultimateMicrons: 0, targetMicrons: 500, speedLpsAt: () => s, steps: 100,
    });
    expect(constantSpeedPumpDownSeconds(10, s, 760_000, 500)).toBeCloseTo(25.8734, 3);
    // The trapezoid rule is exact for a constant integrand; 1e-9 relative covers floating point.
    expect(rel(timeToTargetSeconds!, 25.8734)).toBeLessThan(1e-5);
  });

  it("with an ultimate pressure follows (V/S) ln((p0 − pu)/(p − pu)): 50 micron blank-off gives 26.245 s (CHECK-VALUES, S/M; hand-worked)", () => {
    // ln(759,950 / 450) = 7.43176; × 3.53147 = 26.2452 s.
    const s = 6 * LPS_PER_CFM;
    const { timeToTargetSeconds } = integratePullDown({
      volumeLitres: 10, startMicrons: 760_000, endMicrons: 100, ultimateMicrons: 50, targetMicrons: 500, speedLpsAt: () => s, steps: 80,
    });
    expect(rel(timeToTargetSeconds!, 26.2452)).toBeLessThan(1e-5);
  });
});

describe("pull-down with a load (gas balance V dp/dt = −S(p − pu) + L, solved by hand)", () => {
  it("constant speed and constant load: reaches the target at (V/S) ln((p0 − p_eq)/(p − p_eq)), p_eq = pu + L/S (hand-worked)", () => {
    // V = 5 L, S = 1 L/s, L = 100 micron·L/s: p_eq = 100 + 20 = 120 microns; from 760,000 to 500:
    // t = 5 × ln(759,880 / 380) = 5 × 7.60077 = 38.004 s.
    const run = integrateWithLoad({
      volumeLitres: 5, startMicrons: 760_000, endMicrons: 300, ultimateMicrons: 20, targetMicrons: 500,
      throughputAt: (m) => ({ q: 1 * (m - 20), dqdp: 1 }), loadAt: () => 100, loadTimeScaleSeconds: 1e9, maxSeconds: 3600,
    });
    // Linearised backward Euler with 2 % steps in p − pu: first-order error, within 2 %.
    expect(rel(run.timeToTargetSeconds!, 38.004)).toBeLessThan(0.02);
    // And it never goes below the balance pressure.
    expect(Math.min(...run.curve.microns)).toBeGreaterThan(120);
  });

  it("a load above what the path can carry at the target never reaches it", () => {
    const run = integrateWithLoad({
      volumeLitres: 5, startMicrons: 760_000, endMicrons: 300, ultimateMicrons: 20, targetMicrons: 500,
      throughputAt: (m) => ({ q: 0.1 * (m - 20), dqdp: 0.1 }), loadAt: () => 100, loadTimeScaleSeconds: 1e9, maxSeconds: 7200,
    });
    expect(run.timeToTargetSeconds).toBeNull();
  });

  it("1 g of water is 1,353 mbar·L of vapour at 20 °C, and the load releases all of it (ideal gas, computed)", () => {
    // 8.314462618 × 293.15 / 18.015 = 135.30 J/g = 135.30 Pa·m³/g = 1353.0 mbar·L/g.
    expect(Math.abs(MBAR_LITRES_PER_GRAM_WATER - 1353.0)).toBeLessThan(0.1);
    const load = { waterGrams: 0.8, releaseMinSeconds: 120, releaseMaxSeconds: 3600 };
    // By 10 τ_max essentially all (e^-10) has come off; the trapezoid sum is good to 0.5 %.
    expect(rel(waterReleasedGrams(load, 36_000, 20_000), 0.8)).toBeLessThan(0.005);
    // Well between τ_min and τ_max the rate falls as 1/t (the 1/t outgassing of water, O'Hanlon): ×10 in time, ÷10 within 1 %.
    const wide = { waterGrams: 1, releaseMinSeconds: 10, releaseMaxSeconds: 1e6 };
    const ratio = waterLoadMbarLps(wide, 100) / waterLoadMbarLps(wide, 1000);
    expect(Math.abs(ratio - 10)).toBeLessThan(0.1);
  });
});

const base: PlannerInput = {
  volumeLitres: 6,
  pump: { displacement: 6, displacementUnit: "cfm", blankOffMicrons: 20 },
  hoses: { count: 2, insideDiameterIn: 0.25, lengthFt: 6 },
  coresRemoved: false,
  manifold: true,
  targetMicrons: 500,
};

describe("pull-down planner", () => {
  it("is never faster than the pump alone, and every what-if that removes a restriction helps", () => {
    const plan = planPullDown(base);
    const pumpAlone = constantSpeedPumpDownSeconds(6, 6 * LPS_PER_CFM, 760_000, 500, 20);
    expect(plan.timeToTargetSeconds!).toBeGreaterThan(pumpAlone);
    expect(plan.elements.map((e) => e.name)).toContain(plan.bottleneck);
    // With wide hoses and no manifold, the cores left in are what limits the flow.
    expect(planPullDown({ ...base, manifold: false, hoses: { ...base.hoses, insideDiameterIn: 0.375 } }).bottleneck).toMatch(/Schrader core/);
    const whatIfs = planWhatIfs(base);
    const t = Object.fromEntries(whatIfs.map((w) => [w.key, w.plan.timeToTargetSeconds!]));
    expect(t.hoses_3_8).toBeLessThan(t.as_planned);
    expect(t.shorter_hoses).toBeLessThan(t.as_planned);
    expect(t.cores_out).toBeLessThan(t.as_planned);
    expect(t.no_manifold).toBeLessThan(t.as_planned);
    expect(t.best).toBeLessThan(Math.min(t.hoses_3_8, t.cores_out, t.no_manifold, t.shorter_hoses));
    expect(whatIfs.find((w) => w.key === "hoses_1_4")).toBeUndefined(); // already 1/4 in
    expect(plan.assumptions.some((a) => a.startsWith("Assumption:"))).toBe(true);
    expect(plan.assumptions.join(" ")).toMatch(/Water and outgassing/);
    expect(plan.caveat).toMatch(/water/i);
  });

  it("curve falls monotonically from atmosphere and passes the target at the reported time", () => {
    const plan = planPullDown({ ...base, coresRemoved: true, manifold: false });
    const { tSeconds, microns } = plan.curve;
    expect(microns[0]).toBe(760_000);
    for (let i = 1; i < microns.length; i++) {
      expect(microns[i]).toBeLessThan(microns[i - 1]);
      expect(tSeconds[i]).toBeGreaterThan(tSeconds[i - 1]);
    }
    const i = microns.findIndex((m) => m <= 500);
    expect(tSeconds[i]).toBeGreaterThanOrEqual(plan.timeToTargetSeconds!);
    expect(tSeconds[i - 1]).toBeLessThanOrEqual(plan.timeToTargetSeconds!);
  });

  it("never reaches a target at or below the pump's blank-off", () => {
    const plan = planPullDown({ ...base, pump: { ...base.pump, blankOffMicrons: 600 } });
    expect(plan.timeToTargetSeconds).toBeNull();
    expect(plan.assumptions.join(" ")).toMatch(/never reached/);
  });
});

describe("the plan as crews see it (common practice, no published source, beside the physics above)", () => {
  // 25 ft of 3/8 + 7/8 line set, a 3 L coil, a 6 CFM pump and 1/4 in hoses through a manifold, cores in.
  const volume = systemVolumeLitres({ lineSet: [{ lengthFeet: 25, liquidOd: "3/8", suctionOd: "7/8" }], coilLitres: 3 })!;
  const setup: PlannerInput = {
    volumeLitres: volume,
    pump: { displacement: 6, displacementUnit: "cfm", blankOffMicrons: 20 },
    hoses: { count: 2, insideDiameterIn: 0.25, lengthFt: 6 },
    coresRemoved: false,
    manifold: true,
    lineSet: { lengthFt: 25, suctionInsideDiameterIn: tubeInsideDiameterIn("7/8") },
  };

  it("gives a range, fast ≤ likely ≤ slow, every one slower than the gas alone; tens of minutes for a repair through cores and a manifold", () => {
    const plan = planPullDown(setup);
    const { fastSeconds, likelySeconds, slowSeconds } = plan.range;
    expect(fastSeconds!).toBeLessThan(likelySeconds!);
    expect(likelySeconds!).toBeLessThan(slowSeconds!);
    expect(plan.gasOnlySeconds!).toBeLessThan(fastSeconds!);
    // The old gas-only planner promised 5 min 57 s for this; crews see tens of minutes.
    expect(likelySeconds!).toBeGreaterThan(20 * 60);
    expect(plan.input.condition).toBe("typical");
  });

  it("chokes at the cores at atmosphere: the effective speed there is at most the choked limit of two 1.5 mm openings, 0.70 L/s (isentropic choked flow, Anderson)", () => {
    const plan = planPullDown(setup);
    // Slope of the likely curve in its first second: S = −V dp/dt / p.
    const { tSeconds: t, microns: p } = plan.curve;
    const s = (-volume * (p[1] - p[0])) / (t[1] - t[0]) / p[0];
    expect(s).toBeLessThanOrEqual(0.703);
    expect(s).toBeGreaterThan(0.5);
  });

  it("a dry system is quicker than a typical one, a wet one slower, and the technician's own water figure moves the plan (planner assumption)", () => {
    const t = (extra: Partial<PlannerInput>) => planPullDown({ ...setup, ...extra }).range.likelySeconds!;
    expect(t({ condition: "dry" })).toBeLessThan(t({ condition: "typical" }));
    expect(t({ condition: "wet" })).toBeGreaterThan(t({ condition: "typical" }));
    expect(t({ waterGrams: 0.1 })).toBeLessThan(t({ waterGrams: 2 }));
  });

  it("says 'slower', never a negative saving (common practice, no published source)", () => {
    expect(comparedWords(600, 1000)).toBe("saves 40 %");
    expect(comparedWords(1500, 1000)).toBe("50 % slower");
    expect(comparedWords(1004, 1000)).toBe("about the same");
    expect(comparedWords(null, 1000)).toBe("—");
    for (const w of planWhatIfs(setup)) expect(comparedWords(w.plan.range.likelySeconds, planPullDown(setup).range.likelySeconds)).not.toMatch(/-|−/);
  });
});

describe("plan against a real pull-down", () => {
  it("flags a real pull-down far slower than the plan and stays quiet when it tracks", () => {
    const plan = planPullDown({ ...base, coresRemoved: true, manifold: false });
    const tPlan = plan.timeToTargetSeconds!;
    const tracks = comparePlanWithPullDown(plan, { tSeconds: plan.curve.tSeconds.map((t) => t * 1.2), microns: plan.curve.microns });
    expect(tracks.findings).toEqual([]);
    // The overlay starts where the real log was aligned, on the real clock.
    expect(tracks.planOnRealTime!.microns[0]).toBe(tracks.alignedAtMicrons);
    expect(tracks.planOnRealTime!.microns.every((m, i, a) => i === 0 || m < a[i - 1])).toBe(true);
    const slow = comparePlanWithPullDown(plan, { tSeconds: plan.curve.tSeconds.map((t) => t * 6), microns: plan.curve.microns });
    expect(slow.slowdownFactor!).toBeGreaterThan(5);
    expect(slow.planSecondsToTarget.slow!).toBeGreaterThan(slow.planSecondsToTarget.likely!);
    expect(slow.findings.map((f) => f.code)).toContain("pull_down_much_slower_than_plan");
    // Stuck above the target: never gets there.
    const stuck = comparePlanWithPullDown(plan, { tSeconds: [0, tPlan, 3 * tPlan], microns: [760_000, 2000, 1900] });
    expect(stuck.findings.map((f) => f.code)).toContain("target_not_reached_planned");
  });

  it("points to moisture when it keeps up above 5,000 microns and lags below; to restrictions when it lags from the start (our rule, common practice, no published source)", () => {
    const plan = planPullDown({ ...base, coresRemoved: true, manifold: false });
    const { tSeconds, microns } = plan.curve;
    const t5 = tSeconds[microns.findIndex((m) => m <= 5000)];
    // Same clock above 5,000 microns; 8 × slower below it.
    const wet = comparePlanWithPullDown(plan, { tSeconds: tSeconds.map((t) => (t <= t5 ? t : t5 + (t - t5) * 8)), microns });
    expect(wet.upperFactor!).toBeLessThan(1.01);
    expect(wet.lowerFactor!).toBeGreaterThan(7);
    expect(wet.findings[0].checks[0]).toMatch(/water/);
    const restricted = comparePlanWithPullDown(plan, { tSeconds: tSeconds.map((t) => t * 8), microns });
    expect(restricted.findings[0].checks[0]).toMatch(/restrictions/);
  });
});
