import { describe, expect, it } from "vitest";
import { ACR_TUBE, leakRateFromRise, systemVolumeLitres, temperOf, tubeInsideDiameterIn, tubeLitresPerFoot } from "@/analysis/shared/volume";
import { TUBE_ODS } from "@/lib/vacuum-tests/schemas";
import { LogError } from "@/analysis/shared/errors";

describe("tubeLitresPerFoot — ACR copper tube", () => {
  // Table values are printed to 0.01 mL/ft: 0.005 mL is their rounding.
  const table: [string, "annealed" | "drawn", number][] = [
    ["1/4", "annealed", 5.58],
    ["3/8", "annealed", 14.94],
    ["3/8", "drawn", 15.32],
    ["1/2", "annealed", 29.36],
    ["1/2", "drawn", 28.56],
    ["5/8", "annealed", 47.57],
    ["5/8", "drawn", 45.87],
    ["3/4", "annealed", 71.42],
    ["3/4", "drawn", 68.5],
    ["7/8", "drawn", 95.17],
    ["1-1/8", "drawn", 162.26],
  ];
  for (const [od, temper, mlPerFoot] of table) {
    it(`holds ${mlPerFoot} mL/ft for ${od}" ${temper} within 0.005 mL (ASTM B280 inside diameter, CHECK-VALUES.md)`, () => {
      expect(Math.abs(tubeLitresPerFoot(od, temper) * 1000 - mlPerFoot)).toBeLessThanOrEqual(0.005);
    });
  }
  it("1/4 in drawn has a 0.025 in wall, so a 0.200 in bore and 6.18 mL/ft (ASTM B280-20 Table 1, straight lengths; volume computed)", () => {
    expect(tubeInsideDiameterIn("1/4", "drawn")).toBeCloseTo(0.2, 12);
    // π/4 × 0.200² × 12 in³ × 16.387064 mL/in³ = 6.1779 mL.
    expect(Math.abs(tubeLitresPerFoot("1/4", "drawn") * 1000 - 6.1779)).toBeLessThan(0.0005);
  });

  // Inside diameters as the standard prints them (three decimals): drawn from B280-20 Table 1 (OD − 2 × wall),
  // annealed coils from the coil table as transcribed in CHECK-VALUES.md and secondary references.
  const published: Record<string, Partial<Record<"annealed" | "drawn", number>>> = {
    "1/4": { annealed: 0.19, drawn: 0.2 },
    "5/16": { annealed: 0.248 },
    "3/8": { annealed: 0.311, drawn: 0.315 },
    "1/2": { annealed: 0.436, drawn: 0.43 },
    "5/8": { annealed: 0.555, drawn: 0.545 },
    "3/4": { annealed: 0.68, drawn: 0.666 },
    "7/8": { annealed: 0.785, drawn: 0.785 },
    "1-1/8": { annealed: 1.025, drawn: 1.025 },
    "1-3/8": { annealed: 1.265, drawn: 1.265 },
    "1-5/8": { drawn: 1.505 },
    "2-1/8": { drawn: 1.985 },
  };
  it("every size the forms offer is in the table, with the standard's bore in every temper it is made in (ASTM B280)", () => {
    expect(Object.keys(ACR_TUBE).sort()).toEqual([...TUBE_ODS].sort());
    for (const od of TUBE_ODS) {
      const made = published[od];
      expect(made, od).toBeDefined();
      for (const temper of ["annealed", "drawn"] as const) {
        const id = made![temper];
        if (id === undefined) continue;
        // The standard prints three decimals: half of 0.001 in.
        expect(Math.abs(tubeInsideDiameterIn(od, temper) - id), `${od} ${temper}`).toBeLessThanOrEqual(0.0005 + 1e-12);
      }
    }
  });

  it("a size made in one temper only uses it: 5/16 is coils, 2-1/8 straight lengths (ASTM B280 tables)", () => {
    expect(temperOf("5/16", "drawn")).toBe("annealed");
    expect(temperOf("2-1/8")).toBe("drawn");
    expect(tubeLitresPerFoot("2-1/8")).toBe(tubeLitresPerFoot("2-1/8", "drawn"));
  });

  it("defaults to annealed and rejects a size not in the table with LogError invalid_option (common practice, no published source)", () => {
    expect(tubeLitresPerFoot("3/8")).toBe(tubeLitresPerFoot("3/8", "annealed"));
    expect(() => tubeLitresPerFoot("9/16")).toThrow(LogError);
  });
});

describe("systemVolumeLitres", () => {
  it("prefers litres when given (interface contract, no published source)", () => {
    expect(systemVolumeLitres({ litres: 4.2, coilLitres: 1 })).toBe(4.2);
  });
  it("sums liquid and suction line per set plus the coil (ASTM B280 volumes, CHECK-VALUES.md)", () => {
    // 25 ft of 3/8 + 3/4 annealed: 25 × (14.94 + 71.42) mL = 2.159 L, plus a 1.5 L coil.
    const v = systemVolumeLitres({ lineSet: [{ lengthFeet: 25, liquidOd: "3/8", suctionOd: "3/4" }], coilLitres: 1.5 })!;
    expect(Math.abs(v - (2.159 + 1.5))).toBeLessThan(0.001);
  });
  it("is null when nothing is known (interface contract, no published source)", () => {
    expect(systemVolumeLitres({})).toBeNull();
  });
  it("rejects a negative length with LogError invalid_option (interface contract, no published source)", () => {
    expect(() => systemVolumeLitres({ lineSet: [{ lengthFeet: -1, liquidOd: "1/4", suctionOd: "1/2" }] })).toThrow(LogError);
  });
});

describe("leakRateFromRise — Q = V·dp/dt", () => {
  it("gives 4.4e-4 Pa·m³/s for 2 L rising 1 Torr in 600 s (CHECK-VALUES.md rate-of-rise example, computed)", () => {
    // 1 Torr in 600 s = 1000 microns / 10 min = 100 microns per minute.
    const q = leakRateFromRise(100, 2);
    // Exact: 2e-3 m³ × 133.322368 Pa / 600 s = 4.44408e-4; the example is rounded to 2 digits.
    expect(q.paM3PerSecond).toBeCloseTo(4.44408e-4, 9);
    expect(Math.abs(q.paM3PerSecond - 4.4e-4)).toBeLessThan(0.05e-4);
    // 3.3e-3 Torr·L/s = 3.3e-3 × 1.33322 mbar·L/s.
    expect(q.mbarLitresPerSecond).toBeCloseTo((2 * 1) / 600 * 1.33322368, 9);
    expect(q.micronLitresPerMinute).toBe(200);
    expect(q.volumeLitres).toBe(2);
  });
});
