import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");
const tsx = path.join(root, "node_modules/.bin/tsx");

function cli(...args: string[]) {
  const r = spawnSync(tsx, ["analysis/cli.ts", ...args], { cwd: root, encoding: "utf8", timeout: 100_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

// The CLI contract (stdout shape and exit codes) is ours: common practice, no published source.
// Each case starts tsx processes (a few seconds each on a loaded machine): allow 2 minutes per case.
describe("analysis CLI (tsx analysis/cli.ts)", { timeout: 120_000 }, () => {
  it("--json prints exactly one AnalysisResult object with the required keys", () => {
    const r = cli("fixtures/samples/sample-1-iso-microns.csv", "--json");
    expect(r.stderr).toBe("");
    expect(r.code).toBe(0);
    expect(r.stdout.trim().split("\n")).toHaveLength(1);
    const result = JSON.parse(r.stdout);
    for (const key of ["verdict", "confidence", "isolationAt", "decay", "meetsProfile", "forecast", "holds", "findings", "import"]) expect(result).toHaveProperty(key);
    expect(["pass", "leak", "moisture", "leak_and_moisture", "inconclusive"]).toContain(result.verdict);
    expect(result.confidence).toBeGreaterThanOrEqual(0);
    expect(result.confidence).toBeLessThanOrEqual(1);
    expect(Array.isArray(result.holds)).toBe(true);
    expect(Array.isArray(result.findings)).toBe(true);
    expect(result.decay).not.toBeNull(); // sample-1 has a pull-down and a hold
    for (const key of ["startMicrons", "endMicrons", "riseMicrons", "holdSeconds", "leakRateMicronsPerMinute", "plateauMicrons", "timeConstantSeconds"]) expect(result.decay).toHaveProperty(key);
    expect(result.import).toMatchObject({ rows: 238, skipped: 0, unit: "micron", timeFormat: "iso" });
  });

  it("--unit and --time-unit reach the importer", () => {
    const r = cli("fixtures/layouts/overrides.csv", "--json", "--unit", "pa", "--time-unit", "min");
    // overrides.csv has no time column by name, so the flags alone cannot rescue it: the import fails with exit 2.
    expect(r.code).toBe(2);
    const r2 = cli("fixtures/samples/sample-2-elapsed-mtorr.csv", "--json", "--time-unit", "min", "--unit", "torr");
    expect(r2.code).toBe(0);
    const result = JSON.parse(r2.stdout);
    expect(result.import).toMatchObject({ unit: "torr", timeFormat: "elapsed_min" });
  });

  it("readable summary without --json names the verdict and what was read", () => {
    const r = cli("fixtures/samples/sample-3-clock-microns-preamble.csv", "--volume-l", "4.5");
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^Verdict: /m);
    expect(r.stdout).toMatch(/Read: 79 rows \(6 skipped, 6 over range\)/);
  });

  it("a bad file → exit 2 and one line on stderr naming the error code", () => {
    const r = cli("fixtures/bad/bad-time.csv", "--json");
    expect(r.code).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderr.trim().split("\n")).toHaveLength(1);
    expect(r.stderr).toMatch(/bad_time: line 13/);
  });

  it("a missing file and bad flags → exit 2 with a reason on stderr", () => {
    const missing = cli("fixtures/does-not-exist.csv");
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/cannot read 'fixtures\/does-not-exist.csv' \(ENOENT\)/);
    const dir = mkdtempSync(path.join(tmpdir(), "riseline-cli-"));
    const file = path.join(dir, "log.csv");
    writeFileSync(file, "time,microns\n");
    for (const args of [["--unit", "furlong", file], ["--time-unit", "h", file], ["--volume-l", "-3", file], ["--frobnicate", file], []]) {
      const r = cli(...args);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(/^riseline: /);
    }
  });
});
