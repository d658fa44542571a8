import { describe, expect, it } from "vitest";
import { unit as mathUnit } from "mathjs";
import { micronsTo, PA_PER_MICRON, parsePressureUnit, toMicrons, UNITS_UNDERSTOOD } from "@/analysis/shared/units";
import type { PressureUnit } from "@/analysis/decay/types";

/** Relative difference |a − b| / |b|. */
function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

describe("unit definitions (NIST SP 811 appendix B.8)", () => {
  it("1 micron = 1 mTorr = 101325/760/1000 Pa exactly (NIST SP 811 B.8: torr = 101325/760 Pa)", () => {
    expect(PA_PER_MICRON).toBe(101325 / 760 / 1000);
    expect(toMicrons(1, "mtorr")).toBe(1);
    expect(toMicrons(1, "micron")).toBe(1);
    // Exactly 1000: torr is written out, not derived through Pa.
    expect(toMicrons(1, "torr")).toBe(1000);
    expect(micronsTo(760_000, "torr")).toBe(760);
  });

  it("500 microns = 66.661 Pa = 0.6666 mbar (CHECK-VALUES.md, computed from NIST SP 811 B.8)", () => {
    // Check values are printed to 5 and 4 significant figures: compare at half a unit in the last place.
    expect(Math.abs(micronsTo(500, "pa") - 66.661)).toBeLessThan(0.0005);
    expect(Math.abs(micronsTo(500, "mbar") - 0.6666)).toBeLessThan(0.00005);
    expect(Math.abs(micronsTo(500, "hpa") - 0.6666)).toBeLessThan(0.00005);
    expect(Math.abs(micronsTo(500, "kpa") - 0.066661)).toBeLessThan(0.0000005);
  });

  it("1 Pa = 7.500617 microns (NIST SP 811 B.8, CHECK-VALUES.md)", () => {
    // Printed to 7 significant figures.
    expect(Math.abs(toMicrons(1, "pa") - 7.500617)).toBeLessThan(5e-7);
  });

  it("mmHg 133.322387415 Pa, inHg 3386.388640 Pa, psi 6894.757293168 Pa (NIST SP 811 B.8 conventional values)", () => {
    // Round trip through microns: only floating-point rounding (a few ulps, 1e-14 relative).
    expect(rel(micronsTo(toMicrons(1, "mmhg"), "pa"), 133.322387415)).toBeLessThan(1e-14);
    expect(rel(micronsTo(toMicrons(1, "inhg"), "pa"), 3386.38864)).toBeLessThan(1e-14);
    expect(rel(micronsTo(toMicrons(1, "psia"), "pa"), 6894.757293168)).toBeLessThan(1e-14);
    // inHg (conventional) = 25.4 mmHg (NIST SP 811 B.8).
    expect(rel(toMicrons(1, "inhg"), 25.4 * toMicrons(1, "mmhg"))).toBeLessThan(1e-9);
  });

  it("760,000 microns = 1 standard atmosphere = 101325 Pa (NIST SP 811 B.8)", () => {
    expect(rel(micronsTo(760_000, "pa"), 101325)).toBeLessThan(1e-14);
    expect(rel(micronsTo(760_000, "mbar"), 1013.25)).toBeLessThan(1e-14);
  });

  it("round trip to/from microns for every unit (floating-point identity, 1e-12 relative)", () => {
    const units: PressureUnit[] = ["micron", "mtorr", "torr", "mmhg", "pa", "kpa", "mbar", "hpa", "psia", "inhg"];
    for (const u of units) for (const v of [0.001, 1, 537.25, 25_000]) expect(rel(micronsTo(toMicrons(v, u), u), v)).toBeLessThan(1e-12);
  });
});

describe("against mathjs units (independent library)", () => {
  // mathjs defines torr and mmHg as 133.322 Pa (rounded to 6 figures): agreement to 3e-6 relative.
  it("torr and mmHg agree with mathjs to 3e-6 (mathjs rounds both to 133.322 Pa)", () => {
    expect(rel(micronsTo(toMicrons(1, "torr"), "pa"), mathUnit(1, "torr").toNumber("Pa"))).toBeLessThan(3e-6);
    expect(rel(micronsTo(toMicrons(1, "mmhg"), "pa"), mathUnit(1, "mmHg").toNumber("Pa"))).toBeLessThan(3e-6);
    expect(rel(micronsTo(500, "torr"), mathUnit(500e-3, "torr").toNumber("torr"))).toBeLessThan(1e-12);
  });

  it("psi agrees with mathjs to 1e-9 (mathjs: 6894.75729276459 Pa)", () => {
    expect(rel(micronsTo(toMicrons(1, "psia"), "pa"), mathUnit(1, "psi").toNumber("Pa"))).toBeLessThan(1e-9);
  });

  it("Pa, kPa, hPa and mbar (= 1e-3 bar) agree with mathjs exactly to 1e-12", () => {
    const microns = 12_345;
    const pa = micronsTo(microns, "pa");
    expect(rel(micronsTo(microns, "kpa"), mathUnit(pa, "Pa").toNumber("kPa"))).toBeLessThan(1e-12);
    expect(rel(micronsTo(microns, "hpa"), mathUnit(pa, "Pa").toNumber("hPa"))).toBeLessThan(1e-12);
    expect(rel(micronsTo(microns, "mbar"), mathUnit(pa, "Pa").toNumber("bar") * 1000)).toBeLessThan(1e-12);
  });
});

describe("parsePressureUnit (header and unit-cell spellings; common practice, no published source)", () => {
  const absolute: [string, PressureUnit][] = [
    ["microns", "micron"], ["Vacuum (microns)", "micron"], ["µmHg", "micron"], ["um Hg", "micron"], ["μm Hg", "micron"],
    ["mTorr", "mtorr"], ["pressure_mTorr", "mtorr"], ["millitorr", "mtorr"], ["Torr", "torr"], ["pressure (Torr)", "torr"],
    ["mmHg", "mmhg"], ["mm Hg", "mmhg"], ["Pa", "pa"], ["pressure (Pa)", "pa"], ["kPa", "kpa"], ["kPa abs", "kpa"],
    ["mbar", "mbar"], ["vacuum_mbar", "mbar"], ["hPa", "hpa"], ["psia", "psia"], ["psi a", "psia"],
    ["inHg", "inhg"], ["in Hg abs", "inhg"], ["inches of mercury", "inhg"],
  ];
  for (const [text, unit] of absolute)
    it(`reads '${text}' as absolute ${unit}`, () => expect(parsePressureUnit(text)).toEqual({ unit, gauge: false }));

  const gauge: [string, string][] = [["psig", "psig"], ["PSI g", "psig"], ["barg", "bar_gauge"], ["kPa g", "kpa_gauge"], ["inHg vac", "inhg_vacuum"], ["in Hg vacuum", "inhg_vacuum"]];
  for (const [text, gaugeUnit] of gauge)
    it(`reads '${text}' as gauge ${gaugeUnit}, not absolute`, () => expect(parsePressureUnit(text)).toEqual({ gaugeUnit, gauge: true }));

  it("tells mTorr from Torr and mbar from bar-gauge (case and camel case)", () => {
    expect(parsePressureUnit("MTORR")).toEqual({ unit: "mtorr", gauge: false });
    expect(parsePressureUnit("TORR")).toEqual({ unit: "torr", gauge: false });
    expect(parsePressureUnit("bar g")).toEqual({ gaugeUnit: "bar_gauge", gauge: true });
  });

  it("returns null for headers with no unit and for ambiguous psi / bar", () => {
    for (const text of ["time", "pressure", "Ambient (F)", "battery_pct", "psi", "bar", "", "Pressure reading"]) expect(parsePressureUnit(text)).toBeNull();
  });

  it("UNITS_UNDERSTOOD names every absolute unit for error messages", () => {
    const joined = UNITS_UNDERSTOOD.join(" ");
    for (const w of ["microns", "mTorr", "Torr", "mmHg", "Pa", "kPa", "mbar", "hPa", "psia", "inHg"]) expect(joined).toContain(w);
  });
});
