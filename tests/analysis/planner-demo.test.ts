/**
 * The planner against the demo month's recorded pull-downs (invented data, shaped by textbook
 * rules of thumb in scripts/seed-pulldowns.ts, independently of the planner's model), compared
 * the way the planner page compares a system's own tests. Goal (common practice, no published
 * source): within a factor of 2 of the recorded times.
 */
import { describe, expect, it } from "vitest";
import { evaluateDemoMonth, perSystem } from "@/scripts/evaluate-planner";

describe("planner beside the demo month's recorded pull-downs (common practice, no published source)", () => {
  const rows = evaluateDemoMonth();

  it("plans every test that has a pull-down and a kit, with its assumptions beside it", () => {
    const planned = rows.filter((r) => r.recorded.plan !== null);
    expect(planned.length).toBe(rows.length);
    for (const r of planned) {
      expect(r.recorded.assumptions.length).toBeGreaterThanOrEqual(4);
      expect(r.recorded.assumptions.join(" ")).toMatch(/Pump \d+ CFM/);
    }
  });

  it("each system's median recorded time is within a factor of 2 of the likely plan", () => {
    const systems = perSystem(rows);
    expect(systems.length).toBeGreaterThanOrEqual(10);
    for (const s of systems) {
      expect(s.median, s.name).toBeGreaterThanOrEqual(0.5);
      expect(s.median, s.name).toBeLessThanOrEqual(2);
    }
  });

  it("at least 80 % of the tests are within a factor of 2, and the one with a restriction in its rig is far slower than planned", () => {
    const ratios = rows.map((r) => r.recorded.ratio).filter((x): x is number => x !== null);
    const within = ratios.filter((x) => x >= 0.5 && x <= 2).length;
    expect(within / ratios.length).toBeGreaterThanOrEqual(0.8);
    const restricted = rows.find((r) => r.test.scenario === "slow_pulldown")!;
    expect(restricted.recorded.ratio!).toBeGreaterThan(3);
  });
}, 60_000);
