import { describe, expect, it } from "vitest";
import { analyzeReadings } from "@/analysis";
import { CAUTION_COMPRESSOR, CAUTION_NITROGEN } from "@/analysis/decay/diagnose";
import { simulateLog, type Scenario } from "@/analysis/decay/simulate";
import { simulatedAsImported } from "./helpers";

function codesOf(scenario: Scenario, seed: number) {
  const r = analyzeReadings(simulatedAsImported(simulateLog({ scenario, seed })));
  return { r, codes: r.findings.map((f) => f.code) };
}

// Each sign from the trade primer (common practice, no published source) on simulated logs.
describe("findings", () => {
  it.each([
    ["target_not_reached", "target_not_reached"],
    ["slow_pulldown", "slow_pulldown"],
    ["oil_oscillation", "oil_oscillation"],
    ["frozen_moisture", "freeze_risk"],
    ["gross_leak", "gross_leak"],
    ["sensor_fault", "suspect_sensor"],
    ["short_hold", "hold_too_short"],
    ["sparse", "sparse_readings"],
    ["leak", "leak"],
    ["moisture", "moisture"],
  ] as [Scenario, string][])("%s logs raise %s (seeds 1–3)", (scenario, code) => {
    for (const seed of [1, 2, 3]) expect(codesOf(scenario, seed).codes).toContain(code);
  });

  it("raises none of the pull-down or sensor signs on tight, dry logs (seeds 1–5)", () => {
    for (let seed = 1; seed <= 5; seed++) {
      const { codes } = codesOf("tight_dry", seed);
      for (const code of ["target_not_reached", "slow_pulldown", "oil_oscillation", "freeze_risk", "suspect_sensor", "gross_leak", "leak", "moisture"]) expect(codes).not.toContain(code);
    }
  });

  it("every finding has a title, a message, checks and the maker's-instructions caution", () => {
    const { r } = codesOf("leak_and_moisture", 2);
    for (const f of r.findings) {
      expect(f.title.length).toBeGreaterThan(3);
      expect(f.message.length).toBeGreaterThan(20);
      expect(f.checks.length).toBeGreaterThan(0);
      expect(f.cautions.some((c) => /maker's instructions/.test(c))).toBe(true);
    }
  });

  it("moisture warns never to energise the compressor under vacuum; a leak warns to use nitrogen through a regulator", () => {
    const { r } = codesOf("leak_and_moisture", 2);
    expect(r.findings.find((f) => f.code === "moisture")!.cautions).toContain(CAUTION_COMPRESSOR);
    expect(r.findings.find((f) => f.code === "leak")!.cautions).toContain(CAUTION_NITROGEN);
  });

  it("freeze risk quotes the ice-equilibrium temperature (about −24.5 °C at 500 microns, CHECK-VALUES) at the stall", () => {
    const { r } = codesOf("frozen_moisture", 1);
    const f = r.findings.find((x) => x.code === "freeze_risk")!;
    expect(typeof f.evidence.iceEquilibriumC).toBe("number");
    // stalls are simulated between 1,500 and 3,500 microns: ice point between about −14 °C and −4 °C
    expect(f.evidence.iceEquilibriumC as number).toBeLessThan(0);
    expect(f.evidence.iceEquilibriumC as number).toBeGreaterThan(-20);
  });
});
