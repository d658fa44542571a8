import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeLog } from "@/analysis";

// Expected values: the samples' README (invented logs generated from a physical model with known truth).
const cases = [
  { file: "sample-1-iso-microns.csv", verdict: "pass", isolation: 1473, step: 10, leak: 0, plateau: 535 },
  { file: "sample-2-elapsed-mtorr.csv", verdict: "leak", isolation: 2229, step: 10, leak: 239, plateau: null },
  { file: "sample-3-clock-microns-preamble.csv", verdict: "moisture", isolation: 1357, step: 30, leak: 0, plateau: 2805 },
  { file: "sample-4-minutes-torr.csv", verdict: "leak_and_moisture", isolation: null, step: 10, leak: 170, plateau: 2974 },
  { file: "sample-5-semicolon-pa-comma.csv", verdict: "leak", isolation: null, step: 1, leak: 6504, plateau: null },
  { file: "sample-6-iso-mbar-extra.csv", verdict: "leak", isolation: null, step: 30, leak: 195, plateau: null },
] as const;

function sampleText(file: string): string {
  const local = path.resolve(import.meta.dirname, "../../fixtures/samples", file);
  return readFileSync(existsSync(local) ? local : path.join("/work/shared/samples", file), "utf8");
}

describe("example logs (samples README truth)", () => {
  it.each(cases)("$file: verdict $verdict, isolation within max(3 samples, 45 s), leak rate within 5 %, plateau within 10 %", (c) => {
    const r = analyzeLog(sampleText(c.file));
    expect(r.verdict).toBe(c.verdict);
    if (c.isolation === null) expect(r.isolationAt).toBeNull();
    else expect(Math.abs(r.isolationAt! - c.isolation)).toBeLessThanOrEqual(Math.max(3 * c.step, 45));
    if (c.leak === 0) expect(r.decay!.leakRateMicronsPerMinute).toBe(0);
    else expect(Math.abs(r.decay!.leakRateMicronsPerMinute - c.leak) / c.leak).toBeLessThan(0.05);
    if (c.plateau === null) expect(r.decay!.plateauMicrons).toBeNull();
    else expect(Math.abs(r.decay!.plateauMicrons! - c.plateau) / c.plateau).toBeLessThan(0.1);
  });

  it("sample 5 climbs out of the gauge range: gross leak, hold ended by the break (samples README: 6,504 microns/min)", () => {
    const r = analyzeLog(sampleText("sample-5-semicolon-pa-comma.csv"));
    expect(r.findings.map((f) => f.code)).toContain("gross_leak");
    expect(r.findings.find((f) => f.code === "gross_leak")!.severity).toBe("danger");
  });
});
