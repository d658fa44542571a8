import { describe, expect, it } from "vitest";
import { iceEquilibriumC, waterBoilingC, waterVapourPressurePa } from "@/analysis/calculators/water";

/** Relative difference in parts per million. */
const ppm = (got: number, ref: number) => Math.abs(got / ref - 1) * 1e6;

describe("waterVapourPressurePa (PsychroLib, Hyland–Wexler)", () => {
  // ASHRAE claims its equations agree with its table within 300 ppm; measured 60–200 ppm.
  for (const [c, pa] of [
    [-20, 103.24],
    [-5, 401.74],
    [5, 872.6],
    [25, 3169.7],
  ]) {
    it(`gives ${pa} Pa at ${c} °C within 300 ppm (ASHRAE Handbook Fundamentals 2017 ch.1 table 3)`, () => {
      expect(ppm(waterVapourPressurePa(c), pa)).toBeLessThanOrEqual(300);
    });
  }

  // Hyland–Wexler (1983) and IAPWS R14-08 (2011) are independent fits; over ice they differ by up to
  // ~330 ppm near −40 °C (measured), so 500 ppm is the tolerance here.
  for (const [c, pa] of [
    [-40, 12.841],
    [-30, 38.005],
    [-20, 103.239],
    [-10, 259.874],
    [0, 611.154],
  ]) {
    it(`gives ${pa} Pa over ice at ${c} °C within 500 ppm (IAPWS R14-08 sublimation pressure, computed)`, () => {
      expect(ppm(waterVapourPressurePa(c), pa)).toBeLessThanOrEqual(500);
    });
  }
  it("gives 8.94735 Pa over ice at 230 K within 500 ppm (IAPWS R14-08 check value)", () => {
    expect(ppm(waterVapourPressurePa(230 - 273.15), 8.94735)).toBeLessThanOrEqual(500);
  });

  // Over liquid, against Wagner & Pruss: measured 40–210 ppm; 300 ppm tolerance as ASHRAE's own claim.
  for (const [c, pa, src] of [
    [10, 1228.11, "Wagner & Pruss 2002 auxiliary equation, computed"],
    [20, 2339.19, "Wagner & Pruss 2002 auxiliary equation, computed"],
    [30, 4246.92, "Wagner & Pruss 2002 auxiliary equation, computed"],
    [275 - 273.15, 698.451167, "IAPWS-95 check value at 275 K"],
  ] as const) {
    it(`gives ${pa} Pa over water at ${c.toFixed(2)} °C within 300 ppm (${src})`, () => {
      expect(ppm(waterVapourPressurePa(c), pa)).toBeLessThanOrEqual(300);
    });
  }

  it("is NaN outside the equations' range −100…200 °C (PsychroLib's stated range)", () => {
    expect(waterVapourPressurePa(-101)).toBeNaN();
    expect(waterVapourPressurePa(201)).toBeNaN();
  });
});

describe("iceEquilibriumC / waterBoilingC", () => {
  // Check values are printed to 0.1 °C: 0.05 °C is their rounding.
  for (const [microns, c] of [
    [250, -31.3],
    [500, -24.5],
    [1000, -17.3],
  ]) {
    it(`puts ice in equilibrium at ${c} °C under ${microns} microns within 0.05 °C (CHECK-VALUES.md, computed)`, () => {
      expect(Math.abs(iceEquilibriumC(microns) - c)).toBeLessThanOrEqual(0.05);
    });
  }
  it("reaches the triple point 0.01 °C at 4,588 microns within 0.01 °C (CHECK-VALUES.md, computed)", () => {
    expect(Math.abs(iceEquilibriumC(4588) - 0.01)).toBeLessThanOrEqual(0.01);
  });
  it("inverts waterVapourPressurePa to 1e-6 °C from −90 to 190 °C (round trip, no published source)", () => {
    for (let c = -90; c <= 190; c += 7.3) {
      const microns = waterVapourPressurePa(c) / (101325 / 760 / 1000);
      expect(Math.abs(waterBoilingC(microns) - c)).toBeLessThan(1e-6);
    }
  });
  it("boils water at 100 °C near one atmosphere, 760,000 microns, within 0.05 °C (steam tables, from memory)", () => {
    expect(Math.abs(waterBoilingC(760000) - 100)).toBeLessThan(0.05);
  });
  it("is NaN for a vacuum beyond the equations' range, 0 microns (PsychroLib's stated range)", () => {
    expect(iceEquilibriumC(0)).toBeNaN();
  });
});
