import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeLog } from "@/analysis";
import { FIELD_ARTIFACTS, FIELD_LAYOUTS } from "@/analysis/decay/simulate";

// Field-log fixtures: simulated logs with fixed seeds (scripts/make-field-fixtures.ts), one per export
// layout, per field artifact and per field scenario; expected values are the simulation's truth.
const dir = path.resolve(import.meta.dirname, "../../fixtures/field");
const expected = JSON.parse(readFileSync(path.join(dir, "expected.json"), "utf8")) as {
  file: string;
  verdict: string;
  isolationAtSeconds: number | null;
  isolationToleranceSeconds: number;
  leakRateMicronsPerMinute: number;
  plateauMicrons: number | null;
  findings: string[];
  holds: number;
}[];

describe("field-log fixtures (simulator truth, fixed seeds)", () => {
  it("has a fixture for every field layout, every artifact, typed minutes, a gross leak out of range and a re-pull", () => {
    for (const layout of FIELD_LAYOUTS) expect(expected.map((e) => e.file)).toContain(`layout-${layout}.csv`);
    for (const artifact of FIELD_ARTIFACTS) expect(expected.map((e) => e.file)).toContain(`artifact-${artifact}.csv`);
    for (const name of ["scenario-typed_minutes-leak.csv", "scenario-gross_out_of_range.csv", "scenario-repull.csv"]) expect(expected.map((e) => e.file)).toContain(name);
  });

  it.each(expected)("$file → $verdict, isolation within max(3 samples, 45 s), leak rate 5 %, plateau 10 %, every hold found (simulator truth)", (e) => {
    const r = analyzeLog(readFileSync(path.join(dir, e.file), "utf8"));
    expect(r.verdict).toBe(e.verdict);
    if (e.isolationAtSeconds === null) expect(r.isolationAt).toBeNull();
    else expect(Math.abs(r.isolationAt! - e.isolationAtSeconds)).toBeLessThanOrEqual(e.isolationToleranceSeconds);
    expect(r.holds).toHaveLength(e.holds);
    const codes = r.findings.map((f) => f.code);
    for (const code of e.findings) expect(codes).toContain(code);
    if ((e.verdict === "leak" || e.verdict === "leak_and_moisture") && !r.decay!.leakRateAtLeast)
      expect(Math.abs(r.decay!.leakRateMicronsPerMinute - e.leakRateMicronsPerMinute) / e.leakRateMicronsPerMinute).toBeLessThan(0.05);
    if ((e.verdict === "moisture" || e.verdict === "leak_and_moisture") && e.plateauMicrons !== null)
      expect(Math.abs(r.decay!.plateauMicrons! - e.plateauMicrons) / e.plateauMicrons).toBeLessThan(0.1);
  });

  it("the gross leak out of range gives its climb as a lower bound at or under the true rate (simulator truth)", () => {
    const e = expected.find((x) => x.file === "scenario-gross_out_of_range.csv")!;
    const r = analyzeLog(readFileSync(path.join(dir, e.file), "utf8"));
    expect(r.decay!.leakRateAtLeast).toBe(true);
    expect(r.decay!.leakRateMicronsPerMinute).toBeLessThanOrEqual(e.leakRateMicronsPerMinute * 1.05);
    expect(r.findings.find((f) => f.code === "gross_leak")?.severity).toBe("danger");
  });
});
