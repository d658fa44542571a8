import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeLog } from "@/analysis";
import { importLog } from "@/analysis/decay/import";

// Expected values: the samples' README (fixtures/samples/EXPECTED.md, a copy of it; invented logs
// generated from a physical model with known truth), read from its table so no number is typed twice.
const dir = path.resolve(import.meta.dirname, "../../fixtures/samples");
const readme = readFileSync(path.join(dir, "EXPECTED.md"), "utf8");

interface Case {
  file: string;
  verdict: string;
  isolation: number | null;
  leak: number;
  plateau: number | null;
}

function cases(): Case[] {
  const rows = readme.split("\n").filter((l) => /^\| sample-/.test(l));
  return rows.map((l) => {
    const [file, verdictCell, isolationCell, leakCell, plateauCell] = l.split("|").slice(1, 6).map((c) => c.trim());
    return {
      file,
      verdict: verdictCell.split(" ")[0],
      isolation: /^\d+ s$/.test(isolationCell) ? Number(isolationCell.split(" ")[0]) : null,
      leak: leakCell === "0" ? 0 : Number(leakCell.split(" ")[0]),
      plateau: /^\d+$/.test(plateauCell) ? Number(plateauCell) : null,
    };
  });
}

const text = (file: string) => readFileSync(path.join(dir, file), "utf8");
/** Median interval between the readings of a sample log (seconds), for the tolerance max(3 samples, 45 s). */
function stepOf(file: string): number {
  const t = importLog(text(file)).tSeconds;
  const d = t.slice(1).map((x, i) => x - t[i]).filter((x) => x > 0).sort((a, b) => a - b);
  return d[d.length >> 1];
}

describe("the ten example logs (samples README truth)", () => {
  const all = cases();

  it("reads all ten rows of the README's table", () => {
    expect(all).toHaveLength(10);
    expect(all.map((c) => c.verdict)).toEqual(["pass", "leak", "moisture", "leak_and_moisture", "leak", "leak", "moisture", "leak", "pass", "leak_and_moisture"]);
  });

  it.each(all)("$file: verdict $verdict, isolation within max(3 samples, 45 s), leak rate within 5 %, plateau within 10 % (samples README)", (c) => {
    const r = analyzeLog(text(c.file));
    expect(r.verdict).toBe(c.verdict);
    if (c.isolation === null) expect(r.isolationAt).toBeNull();
    else expect(Math.abs(r.isolationAt! - c.isolation)).toBeLessThanOrEqual(Math.max(3 * stepOf(c.file), 45));
    if (c.leak === 0) expect(r.decay!.leakRateMicronsPerMinute).toBe(0);
    else expect(Math.abs(r.decay!.leakRateMicronsPerMinute - c.leak) / c.leak).toBeLessThan(0.05);
    if (c.plateau === null) expect(r.decay!.plateauMicrons).toBeNull();
    else expect(Math.abs(r.decay!.plateauMicrons! - c.plateau) / c.plateau).toBeLessThan(0.1);
  });

  it("sample 5 climbs out of the gauge range: gross leak, its rate a lower bound (samples README: 6,504 microns/min)", () => {
    const r = analyzeLog(text("sample-5-semicolon-pa-comma.csv"));
    expect(r.findings.find((f) => f.code === "gross_leak")!.severity).toBe("danger");
    expect(r.decay!.leakRateAtLeast).toBe(true);
    expect(r.reasons.join(" ")).toMatch(/climbing at least 6,5\d\d microns per minute/);
  });

  it("sample 7: quoted '20,900' is 20,900 microns (a comma groups thousands: the curve would fall 1,000-fold between rows read as decimals), so the wet system is moisture, not a pass", () => {
    const r = analyzeLog(text("sample-7-tsv-quoted-thousands.csv"));
    expect(r.import).toMatchObject({ delimiter: "\t", decimalComma: false, thousandsSeparator: ",", unsure: false });
    expect(r.import.assumptions.join(" ")).toMatch(/'20,900' is 20,900 or 20\.9 microns: read as 20,900, because read the other way the curve would jump 1,000-fold/);
  });

  it("sample 8: the header 'minute,reading' is elapsed minutes; eleven typed readings; no unit named, microns assumed and said", () => {
    const r = analyzeLog(text("sample-8-typed-minutes.csv"));
    expect(r.import).toMatchObject({ timeFormat: "elapsed_min", rows: 11, unit: "micron" });
    expect(r.import.unsureReasons?.map((u) => u.code)).toEqual(["unit"]);
  });

  it("sample 9: the re-pull leaves two holds; the last complete one is judged and the reasons say so", () => {
    const r = analyzeLog(text("sample-9-us-ampm-repull.csv"));
    expect(r.holds.length).toBeGreaterThanOrEqual(2);
    expect(r.phases.primary).toBe(r.holds.length - 1);
    expect(r.holds[0].complete).toBe(false);
    expect(r.reasons.join(" ")).toMatch(/pump was opened again after an earlier hold .* the verdict is on the last complete hold/);
    expect(r.import.timeFormat).toBe("date_and_time");
  });

  it("sample 10: day.month.year dates, decimal comma, a four-reading drop-out that is a gap, not a break", () => {
    const r = analyzeLog(text("sample-10-eu-semicolon-dropouts.csv"));
    expect(r.import).toMatchObject({ delimiter: ";", decimalComma: true, unit: "mbar", timeFormat: "date_and_time" });
    expect(r.holds).toHaveLength(1);
    expect(r.holds[0].endedBy).toBe("end_of_log");
  });
});
