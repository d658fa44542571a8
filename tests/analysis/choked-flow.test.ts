import { describe, expect, it } from "vitest";
import { chokedSpeedLpsPerCm2, criticalPressureRatio, nozzleThroughput } from "@/analysis/calculators/choked-flow";
import {
  apertureConductanceLps,
  elementThroughput,
  knudsenConductanceLps,
  molecularConductanceLps,
  shortTubeConductanceLps,
  shortTubeMolecularConductanceLps,
} from "@/analysis/calculators/conductance";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("isentropic choked flow of an ideal gas (Anderson, 'Modern Compressible Flow', ch. 5)", () => {
  it("chokes below p_d/p_u = (2/(γ+1))^(γ/(γ−1)) = 0.52828 for γ = 1.4 (Anderson, isentropic tables)", () => {
    // Tables print 0.5283; 0.528282 computed. Tolerance: the 6th digit.
    expect(Math.abs(criticalPressureRatio() - 0.528282)).toBeLessThan(1e-6);
  });

  it("passes 19.86 L/s per cm² of opening at upstream conditions for air at 20 °C (computed; O'Hanlon gives about 20 A L/s, from memory)", () => {
    // √(1.4 × 287.05287 × 293.15) × (2/2.4)^3 = 343.23 × 0.578704 = 198.63 m/s → 19.863 L/s per cm².
    expect(Math.abs(chokedSpeedLpsPerCm2() - 19.863)).toBeLessThan(0.001);
    expect(Math.abs(chokedSpeedLpsPerCm2() - 20) / 20).toBeLessThan(0.01);
  });

  it("is continuous at the critical ratio, falls to 0 as the drop vanishes, and is flat in the downstream pressure once choked", () => {
    const a = 0.1;
    const up = 1000;
    const rStar = criticalPressureRatio();
    const choked = nozzleThroughput(a, up, 0);
    // Subsonic formula at r* equals the choked value (the isentropic relations are continuous there).
    expect(rel(nozzleThroughput(a, up, up * rStar * (1 + 1e-9)), choked)).toBeLessThan(1e-6);
    expect(nozzleThroughput(a, up, up * 0.3)).toBe(choked);
    expect(nozzleThroughput(a, up, up * 0.999999)).toBeLessThan(choked * 0.01);
    expect(nozzleThroughput(a, up, up)).toBe(0);
    // Throughput rises with the upstream pressure in proportion when choked.
    expect(rel(nozzleThroughput(a, 2 * up, 0), 2 * choked)).toBeLessThan(1e-12);
  });

  it("two depressed Schrader cores (1.5 mm effective opening) pass at most 0.70 L/s at atmosphere, 4× below a 6 CFM pump (computed)", () => {
    const area = (Math.PI * 0.15 ** 2) / 4;
    const speed = (2 * nozzleThroughput(area, 1013.25, 100)) / 1013.25;
    expect(Math.abs(speed - 0.702)).toBeLessThan(0.002);
    // 6 CFM = 2.832 L/s.
    expect((6 * 28.316846592) / 60 / speed).toBeGreaterThan(3.7);
  });
});

describe("short-tube conductance (Dushman, 'Scientific Foundations of Vacuum Technique'; O'Hanlon, 'A User's Guide to Vacuum Technology')", () => {
  it("an aperture passes 11.6 L/s per cm² of air at 20 °C in molecular flow (O'Hanlon, ch. 3)", () => {
    expect(apertureConductanceLps(2 / Math.sqrt(Math.PI))).toBeCloseTo(11.6, 12);
  });

  it("Dushman's correction lies within 12 % above Clausing's factors for L/R = 1, 2 and 10 (Clausing values from memory: 0.672, 0.514, 0.191)", () => {
    const clausing: [number, number][] = [
      [1, 0.672],
      [2, 0.514],
      [10, 0.191],
    ];
    for (const [lOverR, factor] of clausing) {
      const d = 1;
      const transmission = shortTubeMolecularConductanceLps(d, (lOverR * d) / 2) / apertureConductanceLps(d);
      expect(transmission, `L/R ${lOverR}`).toBeGreaterThan(factor);
      expect(transmission / factor - 1, `L/R ${lOverR}`).toBeLessThan(0.12);
    }
  });

  it("tends to the long-tube 12.1 d³/L for a hose (L/d = 190, within 1 %) and is lower than it for a valve core (Roth; Dushman)", () => {
    const hose = shortTubeMolecularConductanceLps(0.9525, 182.88);
    expect(rel(hose, molecularConductanceLps(0.9525, 182.88))).toBeLessThan(0.01);
    const core = shortTubeMolecularConductanceLps(0.15, 1.5);
    // L/d = 10: the long-tube formula overstates a short tube by 1 + 1/(0.753 × 10) ≈ 13 %.
    expect(molecularConductanceLps(0.15, 1.5) / core - 1).toBeGreaterThan(0.11);
    // Whole-range: the short-tube form is never above Knudsen's long-tube form.
    for (const p of [0.01, 0.5, 5, 50]) expect(shortTubeConductanceLps(0.15, 1.5, p)).toBeLessThanOrEqual(knudsenConductanceLps(0.15, 1.5, p));
  });

  it("an element's throughput is the lesser of the tube and the choked opening: at atmosphere the core chokes, at 500 microns the tube governs", () => {
    const core = { name: "core", diameterCm: 0.15, lengthCm: 1.5, parallel: 1, assumed: true };
    const area = (Math.PI * 0.15 ** 2) / 4;
    expect(elementThroughput(core, 1013.25, 400)).toBeCloseTo(nozzleThroughput(area, 1013.25, 400), 9);
    const low = elementThroughput(core, 0.6666, 0.3);
    expect(low).toBeCloseTo(shortTubeConductanceLps(0.15, 1.5, (0.6666 + 0.3) / 2) * (0.6666 - 0.3), 12);
  });
});
