import { describe, expect, it } from "vitest";
import { evaluateNitrogenTest, NITROGEN_CAUTIONS } from "@/analysis/nitrogen";
import { endReadingsOfNitrogenLog, readNitrogenLog } from "@/analysis/nitrogen-log";
import { LogError } from "@/analysis/errors";

// The worked examples are given to two decimals; 0.005 is half the last printed digit.
const HALF_CENT = 0.005;

describe("nitrogen standing-pressure test, ideal gas in absolute units", () => {
  it("300 psig at 80 °F cooling to 70 °F expects 294.17 psig (CHECK-VALUES worked example (ideal gas, computed))", () => {
    const res = evaluateNitrogenTest({
      unit: "psig",
      temperatureUnit: "F",
      start: { pressureGauge: 300, temperature: 80 },
      end: { pressureGauge: 294.17, temperature: 70 },
      ratedTestPressureGauge: 450,
    });
    expect(Math.abs(res.expectedEndGauge - 294.17)).toBeLessThan(HALF_CENT);
    // 5.83 psi of the drop is temperature alone (same worked example).
    expect(Math.abs(res.temperatureExplainedDropGauge - 5.83)).toBeLessThan(HALF_CENT);
    expect(res.verdict).toBe("holds");
    expect(res.warnings).toEqual([]);
  });

  it("150 psig 95 °F → 75 °F expects 158.76 psia = 144.06 psig (CHECK-VALUES worked example (ideal gas, computed))", () => {
    const res = evaluateNitrogenTest({
      unit: "psig",
      temperatureUnit: "F",
      start: { pressureGauge: 150, temperature: 95 },
      end: { pressureGauge: 144, temperature: 75 },
    });
    expect(Math.abs(res.expectedEndAbs - 158.76)).toBeLessThan(HALF_CENT);
    expect(Math.abs(res.expectedEndGauge - 144.06)).toBeLessThan(HALF_CENT);
    const steps = Object.fromEntries(res.steps.map((s) => [s.key, s.value]));
    expect(steps.p1_abs).toBeCloseTo(164.696, 9);
    expect(steps.t1_abs).toBeCloseTo(554.67, 9);
    expect(steps.t2_abs).toBeCloseTo(534.67, 9);
    expect(res.verdict).toBe("holds");
    expect(res.warnings.map((w) => w.code)).toEqual(["rated_pressure_missing"]);
  });

  it("658 kPa gauge 20 °C → 60 °C with 101.3 kPa atmosphere expects 761.6 kPa gauge (CHECK-VALUES worked example (ideal gas, computed))", () => {
    const res = evaluateNitrogenTest({
      unit: "kpa_gauge",
      temperatureUnit: "C",
      atmosphereAbs: 101.3,
      start: { pressureGauge: 658, temperature: 20 },
      end: { pressureGauge: 760, temperature: 60 },
      ratedTestPressureGauge: 3000,
    });
    // Printed to one decimal (862.9 / 761.6): tolerance half of 0.1.
    expect(Math.abs(res.expectedEndAbs - 862.9)).toBeLessThan(0.05);
    expect(Math.abs(res.expectedEndGauge - 761.6)).toBeLessThan(0.05);
    expect(res.verdict).toBe("holds");
  });

  it("calls a drop beyond the temperature change a leak and a gain a thermometer check (tolerance: our documented choice, common practice, no published source)", () => {
    const base = { unit: "psig" as const, temperatureUnit: "F" as const, ratedTestPressureGauge: 450 };
    // Expected 294.17; tolerance = 1 psi + 308.87 × 1/529.67 = 1.58 psi.
    const drop = evaluateNitrogenTest({ ...base, start: { pressureGauge: 300, temperature: 80 }, end: { pressureGauge: 292, temperature: 70 } });
    expect(drop.toleranceGauge).toBeCloseTo(1 + 308.865 / 529.67, 2);
    expect(drop.verdict).toBe("drops");
    const rise = evaluateNitrogenTest({ ...base, start: { pressureGauge: 300, temperature: 80 }, end: { pressureGauge: 296.5, temperature: 70 } });
    expect(rise.verdict).toBe("rises");
    const inside = evaluateNitrogenTest({ ...base, start: { pressureGauge: 300, temperature: 80 }, end: { pressureGauge: 293, temperature: 70 } });
    expect(inside.verdict).toBe("holds");
  });

  it("warns when the test pressure is above the nameplate rating and always carries the cautions", () => {
    const res = evaluateNitrogenTest({
      unit: "bar_gauge",
      temperatureUnit: "C",
      start: { pressureGauge: 32, temperature: 20 },
      end: { pressureGauge: 32, temperature: 20 },
      ratedTestPressureGauge: 30,
    });
    expect(res.warnings.map((w) => w.code)).toContain("above_rated_pressure");
    expect(res.cautions).toBe(NITROGEN_CAUTIONS);
    expect(res.cautions.join(" ")).toMatch(/regulator/);
    expect(res.cautions.join(" ")).toMatch(/relief valve/);
    expect(res.cautions.join(" ")).toMatch(/oxygen or compressed air/);
  });
});

describe("nitrogen logger CSV, gauge versus absolute units", () => {
  it("reads psig as gauge, unchanged", () => {
    const log = readNitrogenLog("elapsed_min,pressure (psig),temp (°F)\n0,300,80\n30,297,75\n60,294.2,70\n");
    expect(log.unit).toBe("psig");
    expect(log.convertedFromAbsolute).toBe(false);
    expect(log.pressureGauge).toEqual([300, 297, 294.2]);
    expect(log.tSeconds).toEqual([0, 1800, 3600]);
    expect(log.temperatureUnit).toBe("F");
    const { start, end } = endReadingsOfNitrogenLog(log);
    const res = evaluateNitrogenTest({ unit: log.unit, temperatureUnit: "F", start, end, ratedTestPressureGauge: 450 });
    expect(res.verdict).toBe("holds");
  });

  it("turns psia into psig by subtracting 14.696 psi (standard atmosphere, NIST SP 811 psi definition)", () => {
    const log = readNitrogenLog("time,pressure psia\n2026-05-01 08:00:00,314.696\n2026-05-01 09:00:00,308.866\n");
    expect(log.unit).toBe("psig");
    expect(log.convertedFromAbsolute).toBe(true);
    // Floating-point subtraction only: 1e-9 psi.
    expect(log.pressureGauge[0]).toBeCloseTo(300, 9);
    expect(log.pressureGauge[1]).toBeCloseTo(294.17, 9);
    expect(log.tSeconds[1]).toBe(3600);
  });

  it("uses the entered atmosphere for absolute kPa and keeps kPa g as gauge", () => {
    const abs = readNitrogenLog("seconds,kPa abs,temp C\n0,759.3,20\n60,862.9,60\n", { atmosphereAbs: 101.3 });
    expect(abs.unit).toBe("kpa_gauge");
    expect(abs.pressureGauge[0]).toBeCloseTo(658, 9);
    const gauge = readNitrogenLog("seconds,kPa g,temp C\n0,658,20\n60,761.6,60\n");
    expect(gauge.convertedFromAbsolute).toBe(false);
    expect(gauge.pressureGauge[1]).toBe(761.6);
  });

  it("refuses a bare 'psi' header unless told gauge or absolute, and an inHg vacuum column", () => {
    expect(() => readNitrogenLog("time_s,psi\n0,300\n10,299\n")).toThrow(LogError);
    const asAbs = readNitrogenLog("time_s,psi\n0,314.696\n10,313.696\n", { ambiguousAs: "absolute" });
    expect(asAbs.pressureGauge[0]).toBeCloseTo(300, 9);
    expect(() => readNitrogenLog("time_s,inHg vac\n0,29\n10,29\n")).toThrow(/vacuum/);
  });
});
