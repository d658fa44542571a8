import { describe, expect, it } from "vitest";
import { atmosphereAtElevation, checkAtmosphere, PLAUSIBLE_ATMOSPHERE, standardAtmospherePa } from "@/analysis/calculators/atmosphere";

describe("standard atmosphere at a site's elevation (ISO 2533 / ICAO standard atmosphere)", () => {
  // Table values of the standard atmosphere, printed to 0.1 Pa (from memory; the 1976 US Standard
  // Atmosphere prints the same numbers below 32 km). Tolerance: half the last printed digit.
  const table: [number, number][] = [
    [0, 101325.0],
    [1000, 89874.6],
    [2000, 79495.2],
    [3000, 70108.5],
  ];
  for (const [h, pa] of table)
    it(`${h} m: ${pa} Pa (ISO 2533 table, from memory)`, () => {
      expect(Math.abs(standardAtmospherePa(h) - pa)).toBeLessThanOrEqual(0.05);
    });

  it("5,280 ft is 12.10 psia (ISO 2533 formula, computed; 1 ft = 0.3048 m, psi from NIST SP 811)", () => {
    // 1609.344 m → 83,427 Pa → 12.100 psia.
    expect(atmosphereAtElevation(5280, "ft", "psia")).toBeCloseTo(12.1001, 3);
  });

  it("refuses an elevation outside −450…4,300 m with a message naming it (common practice, no published source)", () => {
    expect(() => standardAtmospherePa(6000)).toThrow(/6000 m is outside/);
    expect(() => standardAtmospherePa(NaN)).toThrow(RangeError);
  });
});

describe("plausible atmosphere per unit (our rule, common practice, no published source)", () => {
  it("accepts sea level and a high site in each unit and refuses the other unit's number with a hint", () => {
    expect(() => checkAtmosphere(14.696, "psia")).not.toThrow();
    expect(() => checkAtmosphere(101.325, "kpa")).not.toThrow();
    expect(() => checkAtmosphere(1.01325, "bar")).not.toThrow();
    expect(() => checkAtmosphere(PLAUSIBLE_ATMOSPHERE.psia.min, "psia")).not.toThrow();
    // 101.3 typed for a psig test is kPa: refused, saying so.
    expect(() => checkAtmosphere(101.3, "psia")).toThrow(/looks like kPa abs/);
    expect(() => checkAtmosphere(14.7, "kpa")).toThrow(/looks like psia/);
    expect(() => checkAtmosphere(0.5, "bar")).toThrow(/outside the 0.58–1.07 bar abs/);
  });

  it("the three ranges are the same range of pressures within rounding (NIST SP 811 psi definition)", () => {
    const pa = (u: "psia" | "kpa" | "bar", v: number) => v * { psia: 6894.757293168, kpa: 1000, bar: 1e5 }[u];
    // Within 1.5 % of each other: the psia bounds are rounded to 0.5 psi.
    for (const bound of ["min", "max"] as const) {
      const kpa = pa("kpa", PLAUSIBLE_ATMOSPHERE.kpa[bound]);
      expect(Math.abs(pa("psia", PLAUSIBLE_ATMOSPHERE.psia[bound]) / kpa - 1)).toBeLessThan(0.015);
      expect(Math.abs(pa("bar", PLAUSIBLE_ATMOSPHERE.bar[bound]) / kpa - 1)).toBeLessThan(1e-9);
    }
  });
});
