import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeLog } from "@/analysis";

// Golden set: simulated logs with fixed seeds (scripts/make-fixtures.ts); expected values are the
// simulation's truth, not earlier outputs of the analysis.
const dir = path.resolve(import.meta.dirname, "../../fixtures/golden");
const expected = JSON.parse(readFileSync(path.join(dir, "expected.json"), "utf8")) as {
  file: string;
  verdict: string;
  isolationAtSeconds: number | null;
  isolationToleranceSeconds: number;
  leakRateMicronsPerMinute: number;
  plateauMicrons: number | null;
  findings: string[];
}[];

describe("golden fixtures (simulator truth, fixed seeds)", () => {
  it("covers every scenario and every layout", () => {
    expect(expected.filter((e) => e.file.startsWith("scenario-")).length).toBe(13);
    expect(expected.filter((e) => e.file.startsWith("layout-")).length).toBe(8);
  });

  it.each(expected)("$file → $verdict with its findings, isolation and key numbers", (e) => {
    const r = analyzeLog(readFileSync(path.join(dir, e.file), "utf8"));
    expect(r.verdict).toBe(e.verdict);
    if (e.isolationAtSeconds === null) expect(r.isolationAt).toBeNull();
    else expect(Math.abs(r.isolationAt! - e.isolationAtSeconds)).toBeLessThanOrEqual(e.isolationToleranceSeconds);
    const codes = r.findings.map((f) => f.code);
    for (const code of e.findings) expect(codes).toContain(code);
    if (e.verdict === "pass") expect(codes).not.toContain("leak");
    // product goals: leak rate within 5 %, plateau within 10 %, on decided holds
    if (e.verdict === "leak" || e.verdict === "leak_and_moisture") {
      expect(Math.abs(r.decay!.leakRateMicronsPerMinute - e.leakRateMicronsPerMinute) / e.leakRateMicronsPerMinute).toBeLessThan(0.05);
    }
    if ((e.verdict === "moisture" || e.verdict === "leak_and_moisture") && e.plateauMicrons !== null) {
      expect(Math.abs(r.decay!.plateauMicrons! - e.plateauMicrons) / e.plateauMicrons).toBeLessThan(0.1);
    }
  });
});
