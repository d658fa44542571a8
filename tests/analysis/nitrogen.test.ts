import { describe, expect, it } from "vitest";
import { evaluateNitrogenTest, NITROGEN_CAUTIONS } from "@/analysis/calculators/nitrogen";
import { endReadingsOfNitrogenLog, inspectNitrogenLogHeader, readNitrogenLog } from "@/analysis/calculators/nitrogen-log";
import { readNitrogenHeaderUnit } from "@/analysis/calculators/nitrogen-units";
import { LogError } from "@/analysis/shared/errors";

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

  it("stops a test that starts above the nameplate rating and always carries the cautions (common practice, no published source)", () => {
    const res = evaluateNitrogenTest({
      unit: "bar_gauge",
      temperatureUnit: "C",
      start: { pressureGauge: 32, temperature: 20 },
      end: { pressureGauge: 32, temperature: 20 },
      ratedTestPressureGauge: 30,
    });
    expect(res.warnings.map((w) => w.code)).toContain("above_rated_pressure");
    expect(res.verdict).toBe("stopped");
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

describe("over-pressure anywhere in the test (common practice, no published source)", () => {
  const base = { unit: "psig" as const, temperatureUnit: "F" as const, ratedTestPressureGauge: 450 };

  it("300 → 480 → 296 psig against a 450 rating: stopped, names 480 psig and when, never 'Holds'", () => {
    // The ends alone hold (294 psig is within the 1.58 psi tolerance of the 294.17 expected); the middle reading does not.
    const res = evaluateNitrogenTest({
      ...base,
      start: { pressureGauge: 300, temperature: 80 },
      end: { pressureGauge: 294, temperature: 70 },
      readings: [
        { pressureGauge: 310, tSeconds: 600, line: 3 },
        { pressureGauge: 480, tSeconds: 1200, line: 4 },
        { pressureGauge: 300, tSeconds: 1800, line: 5 },
      ],
      durationSeconds: 3600,
    });
    expect(res.temperatureVerdict).toBe("holds");
    expect(res.verdict).toBe("stopped");
    expect(res.highest).toEqual({ pressureGauge: 480, atSeconds: 1200, line: 4, which: "reading" });
    expect(res.overPressure).toMatchObject({ ratedGauge: 450, excessGauge: 30, readingsAbove: 1 });
    expect(res.summary).toMatch(/^Stopped: above the rated test pressure\./);
    expect(res.summary).toContain("480 psig at 20 min (line 4 of the file)");
    expect(res.summary).not.toMatch(/Holds/);
    expect(res.warnings[0].code).toBe("above_rated_pressure");
    expect(res.warnings[0].message).toMatch(/regulator/);
  });

  it("a reading exactly at the rating is not above it; one 0.1 above is", () => {
    const at = evaluateNitrogenTest({ ...base, start: { pressureGauge: 300, temperature: 70 }, end: { pressureGauge: 300, temperature: 70 }, readings: [{ pressureGauge: 450, tSeconds: 60 }] });
    expect(at.verdict).toBe("holds");
    const over = evaluateNitrogenTest({ ...base, start: { pressureGauge: 300, temperature: 70 }, end: { pressureGauge: 300, temperature: 70 }, readings: [{ pressureGauge: 450.1, tSeconds: null }] });
    expect(over.verdict).toBe("stopped");
    expect(over.highest.atSeconds).toBeNull();
  });

  it("every mid-log peak is caught wherever it sits (seeded positions; ideal gas ends, Gay-Lussac's law)", () => {
    for (let k = 1; k < 200; k += 7) {
      const readings = Array.from({ length: 200 }, (_, i) => ({ pressureGauge: 300 - i * 0.02, tSeconds: (i + 1) * 30 }));
      readings[k] = { pressureGauge: 451, tSeconds: (k + 1) * 30 };
      const res = evaluateNitrogenTest({ ...base, start: { pressureGauge: 300, temperature: 70 }, end: { pressureGauge: 296, temperature: 70 }, readings, durationSeconds: 201 * 30 });
      expect(res.verdict, `peak at ${k}`).toBe("stopped");
      expect(res.highest.atSeconds).toBe((k + 1) * 30);
    }
  });

  it("rate of change per hour after temperature correction: 300 psig 80 °F → 292 psig 70 °F over 2 h is −1.09 psi/h (Gay-Lussac's law, ideal gas; computed)", () => {
    const res = evaluateNitrogenTest({ ...base, start: { pressureGauge: 300, temperature: 80 }, end: { pressureGauge: 292, temperature: 70 }, durationSeconds: 7200 });
    // Expected end 294.17 psig (CHECK-VALUES); (292 − 294.17) / 2 h = −1.085 psi/h.
    expect(res.ratePerHourGauge!).toBeCloseTo((292 - res.expectedEndGauge) / 2, 12);
    expect(Math.abs(res.ratePerHourGauge! + 1.085)).toBeLessThan(0.005);
    expect(res.steps.find((x) => x.key === "rate_per_hour")?.unit).toBe("psi/h");
    expect(res.summary).toMatch(/-1\.0[89] psi\/h/);
  });

  it("refuses 101.3 as the atmosphere of a psig test: it is kPa (plausible range, common practice, no published source)", () => {
    expect(() => evaluateNitrogenTest({ ...base, atmosphereAbs: 101.3, start: { pressureGauge: 500, temperature: 70 }, end: { pressureGauge: 500, temperature: 70 } })).toThrow(/looks like kPa abs/);
    expect(() => evaluateNitrogenTest({ ...base, atmosphereAbs: 12.1, start: { pressureGauge: 300, temperature: 70 }, end: { pressureGauge: 300, temperature: 70 } })).not.toThrow();
  });
});

describe("gauge or absolute is read from the header, never guessed (our reading rules, common practice, no published source)", () => {
  it("reads the file's own g / a / abs / gauge suffixes", () => {
    const cases: [string, "gauge" | "absolute", string][] = [
      ["Pressure (psig)", "gauge", "psi"],
      ["PSIA", "absolute", "psi"],
      ["P kPa g", "gauge", "kPa"],
      ["Pressure (kPa(a))", "absolute", "kPa"],
      ["kPaG", "gauge", "kPa"],
      ["bar (g)", "gauge", "bar"],
      ["bara", "absolute", "bar"],
      ["mbar abs", "absolute", "mbar"],
      ["Pressure abs (kPa)", "absolute", "kPa"],
      ["Gauge pressure (bar)", "gauge", "bar"],
      ["pressure_MPa_gauge", "gauge", "MPa"],
      ["Pa (absolute)", "absolute", "Pa"],
    ];
    for (const [header, reference, unitWord] of cases) expect(readNitrogenHeaderUnit(header), header).toMatchObject({ reference, unitWord });
  });

  it("reports every bare unit as silent and the log is refused until the technician answers", () => {
    for (const header of ["Pressure (kPa)", "kPa", "mbar", "Pa", "psi", "bar", "hPa", "MPa", "Pressure gauge 2 (kPa)"]) {
      expect(readNitrogenHeaderUnit(header)?.reference, header).toBeNull();
      const csv = `seconds,${header.includes(",") ? `"${header}"` : header}\n0,2050\n60,2049\n`;
      expect(inspectNitrogenLogHeader(csv).unit.reference).toBeNull();
      expect(() => readNitrogenLog(csv), header).toThrow(/does not say gauge or absolute/);
    }
    expect(() => readNitrogenHeaderUnit("kPa g (abs)")).toThrow(/both gauge and absolute/);
  });

  it("a logger's 'Pressure (kPa)' of 2,050 read as gauge stays 2,050 kPa g and stops against a 2,000 rating", () => {
    const csv = "seconds,Pressure (kPa),temp C\n0,1900,20\n600,2050,20\n1200,1899,20\n";
    const log = readNitrogenLog(csv, { ambiguousAs: "gauge" });
    expect(log.unit).toBe("kpa_gauge");
    expect(log.pressureGauge).toEqual([1900, 2050, 1899]);
    expect(log.referenceFrom).toBe("technician");
    expect(log.assumptions.join(" ")).toMatch(/as the technician chose/);
    const asAbs = readNitrogenLog(csv, { ambiguousAs: "absolute" });
    // kPa abs − 101.325 kPa (standard atmosphere, 101325 Pa).
    expect(asAbs.pressureGauge[1]).toBeCloseTo(1948.675, 9);
  });

  it("mbar gauge is kept in kPa (1 mbar = 0.1 kPa, NIST SP 811) and the header wins over a contrary answer", () => {
    const log = readNitrogenLog("time_s,mbar g\n0,30000\n60,29990\n", { ambiguousAs: "absolute" });
    expect(log.unit).toBe("kpa_gauge");
    expect(log.pressureGauge[0]).toBeCloseTo(3000, 9);
    expect(log.readingsAre).toBe("gauge");
    expect(log.assumptions.join(" ")).toMatch(/says gauge/);
  });

  it("refuses vacuum units and names the column", () => {
    expect(() => readNitrogenLog("time_s,microns\n0,500\n10,510\n")).toThrow(/vacuum unit/);
    expect(() => readNitrogenLog("time_s,Torr\n0,500\n10,510\n")).toThrow(/'Torr'/);
  });
});
