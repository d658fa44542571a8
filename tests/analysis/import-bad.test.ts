import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { LogError, type LogErrorCode } from "@/analysis/shared/errors";
import { importLog } from "@/analysis/decay/import";
import { importLogStrict } from "@/analysis/decay/import/index";

const root = path.resolve(import.meta.dirname, "../..");
const bad = (name: string) => readFileSync(path.join(root, "fixtures/bad", name), "utf8");
const sample = (name: string) => readFileSync(path.join(root, "fixtures/samples", name), "utf8");

function errorOf(run: () => unknown): LogError {
  try {
    run();
  } catch (e) {
    if (e instanceof LogError) return e;
    throw new Error(`expected a LogError, got ${String(e)}`);
  }
  throw new Error("expected a LogError, nothing was thrown");
}

/** Each file of the bad-input corpus, its error code, and what the message must name. */
const corpus: { file: string; code: LogErrorCode; message: RegExp; line?: number; column?: string }[] = [
  { file: "empty.csv", code: "empty_file", message: /empty/ },
  { file: "blank-lines.csv", code: "empty_file", message: /empty/ },
  { file: "no-header.csv", code: "no_header", message: /line 1: '2026-06-14T13:05:00Z,900' holds data/, line: 1 },
  { file: "prose.txt", code: "no_header", message: /no row of column names/ },
  { file: "binary.bin", code: "no_header", message: /not text/ },
  { file: "no-time-column.csv", code: "no_time_column", message: /columns seen: 'sensor', 'microns'/ },
  { file: "no-pressure-column.csv", code: "no_pressure_column", message: /columns seen: 'timestamp', 'battery_pct', 'humidity'/ },
  { file: "gauge-unit.csv", code: "unknown_unit", message: /column 'pressure \(psig\)'.*gauge pressure.*not an absolute vacuum reading/, column: "pressure (psig)" },
  { file: "ambiguous-psi.csv", code: "unknown_unit", message: /'psi' does not say absolute \(psia\) or gauge \(psig\); units understood: .*mTorr/, column: "pressure (psi)" },
  { file: "unknown-unit-cell.csv", code: "unknown_unit", message: /line 4: column 'unit': 'furlongs'.*units understood/, line: 4, column: "unit" },
  { file: "gauge-unit-cell.csv", code: "unknown_unit", message: /line 4: .*'inHg vac' is inHg vacuum, a gauge pressure/, line: 4, column: "unit" },
  { file: "bad-time.csv", code: "bad_time", message: /^line 13: time '13:6x:00' in column 'time' is not a time/, line: 13, column: "time" },
  { file: "too-few-readings.csv", code: "too_few_readings", message: /only 3 usable readings \(of 6 rows\)/ },
  { file: "all-over-range.csv", code: "too_few_readings", message: /only 0 usable readings/ },
];

describe("bad-input corpus (fixtures/bad): each file gives its own LogError code and says where (common practice, no published source)", () => {
  for (const c of corpus) {
    it(`${c.file} → ${c.code}`, () => {
      const e = errorOf(() => importLog(bad(c.file)));
      expect(e.code).toBe(c.code);
      expect(e.message).toMatch(c.message);
      if (c.line !== undefined) expect(e.line).toBe(c.line);
      if (c.column !== undefined) expect(e.column).toBe(c.column);
    });
  }

  it("every file in fixtures/bad is covered by a case above", () => {
    const files = readdirSync(path.join(root, "fixtures/bad")).sort();
    expect(files).toEqual(corpus.map((c) => c.file).sort());
  });

  it("file_too_large names the limit and the size found", () => {
    const e = errorOf(() => importLog(sample("sample-1-iso-microns.csv"), { maxBytes: 1000 }));
    expect(e.code).toBe("file_too_large");
    expect(e.message).toMatch(/the file is [\d,]+ characters; the limit is 1,000/);
  });

  it("too_many_rows names the limit and about how many rows were found", () => {
    const e = errorOf(() => importLog(sample("sample-1-iso-microns.csv"), { maxRows: 100 }));
    expect(e.code).toBe("too_many_rows");
    expect(e.message).toMatch(/about 238 data rows; the limit is 100/);
  });

  it("the default limits take a 24-hour 1 Hz log with room to spare (64 MiB, 1,000,000 rows)", () => {
    // 86,400 rows of ~27 characters ≈ 2.3 MB: far below both limits.
    const rows = ["t (s),microns", ...Array.from({ length: 86_400 }, (_, i) => `${i},${500 + (i % 7)}`)];
    expect(importLog(rows.join("\n")).tSeconds).toHaveLength(86_400);
  });

  it("a header with no data rows → too_few_readings naming the header line", () => {
    const e = errorOf(() => importLog("note\ntime,microns\n"));
    expect(e.code).toBe("too_few_readings");
    expect(e.line).toBe(2);
  });

  it("an override naming a column that is not there → invalid_option listing the columns", () => {
    const e = errorOf(() => importLog(sample("sample-1-iso-microns.csv"), { pressureColumn: "vac" }));
    expect(e.code).toBe("invalid_option");
    expect(e.message).toMatch(/columns seen: 'timestamp', 'microns'/);
    expect(errorOf(() => importLog("a,b\n1,2", { unit: "furlong" as never })).code).toBe("invalid_option");
    expect(errorOf(() => importLog("a,b\n1,2", { maxRows: -1 })).code).toBe("invalid_option");
  });

  it("times that are not times in many later rows fail with the first one's line, even after 50 good rows", () => {
    const rows = ["timestamp,microns"];
    for (let i = 0; i < 200; i++) rows.push(`2026-06-14T13:${String(Math.floor(i / 60)).padStart(2, "0")}:${String(i % 60).padStart(2, "0")}Z,${500 + i}`);
    for (let i = 150; i < 162; i++) rows[i] = `2026-06-14T13:0x:${i - 140}Z,640`;
    rows.push("2026-06-14T14:00:00Z,700");
    const e = errorOf(() => importLog(rows.join("\n")));
    expect(e.code).toBe("bad_time");
    expect(e.line).toBe(151);
    expect(e.message).toMatch(/^line 151: time '2026-06-14T13:0x:10Z'/);
  });

  it("a few garbled times in an elapsed_s column are skipped and said, not a refused log (common practice, no published source)", () => {
    const rows = ["elapsed_s,microns"];
    for (let i = 0; i < 300; i++) rows.push(`${i * 10},${500 + i}`);
    rows[3] = "##,502"; // among the first rows the format is judged from
    rows[120] = "abc,619";
    rows[121] = "1O2O,620";
    const log = importLog(rows.join("\n"));
    expect(log.summary.timeFormat).toBe("elapsed_s");
    expect(log.microns).toHaveLength(297);
    expect(log.summary.badTimeRows).toBe(3);
    expect(log.summary.assumptions.join(" ")).toMatch(/3 rows whose time is not a time skipped \(first at line 4: '##'\)/);
  });
});

describe("garbage never throws anything but LogError (property-style, seeded; common practice, no published source)", () => {
  // Park–Miller style LCG: deterministic, so a failure is reproducible from its index.
  let seed = 20260614;
  const random = () => (seed = (seed * 48271) % 2147483647) / 2147483647;
  const pieces = ["a", "Z", "0", "7", ",", ";", "\t", "\n", "\r\n", "\r", '"', ":", "-", ".", "T", " ", ">", "µ", "\uFEFF", "/", "+", "e",
    "Torr", "mbar", "psig", "time", "microns", "2026-06-14T13:05:00Z", "13:05:00", "23:59:59", "12/06/2026", "\u0000", "°F", "NaN", "1e309", "0x1F"];
  const samples = readdirSync(path.join(root, "fixtures/samples")).filter((f) => f.endsWith(".csv")).map(sample);

  function garbage(k: number): string {
    if (k % 2 === 0) {
      let s = "";
      const n = Math.floor(random() * 300);
      for (let i = 0; i < n; i++) s += pieces[Math.floor(random() * pieces.length)];
      return s;
    }
    // Mutate a real sample: delete, replace or insert a few pieces, then cut at a random length.
    const chars = samples[k % samples.length].split("");
    const edits = 1 + Math.floor(random() * 15);
    for (let i = 0; i < edits; i++) {
      const at = Math.floor(random() * chars.length);
      const op = random();
      const piece = pieces[Math.floor(random() * pieces.length)];
      if (op < 0.33) chars.splice(at, 1);
      else if (op < 0.66) chars[at] = piece;
      else chars.splice(at, 0, piece);
    }
    return chars.join("").slice(0, Math.floor(random() * chars.length * 1.2));
  }

  it("3,000 random and mutated logs: the unguarded importer throws only LogError (or returns a sorted log)", () => {
    for (let k = 0; k < 3000; k++) {
      const text = garbage(k);
      try {
        const log = importLogStrict(text);
        expect(log.tSeconds.length).toBe(log.microns.length);
        for (let i = 1; i < log.tSeconds.length; i++) if (log.tSeconds[i] < log.tSeconds[i - 1]) throw new Error(`case ${k}: not sorted`);
        for (const v of log.microns) if (!Number.isFinite(v) || v < 0) throw new Error(`case ${k}: bad reading ${v}`);
      } catch (e) {
        if (!(e instanceof LogError)) throw new Error(`case ${k}: ${String(e)} for ${JSON.stringify(text.slice(0, 200))}`);
      }
    }
  });

  it("non-string input and odd options are LogErrors too", () => {
    expect(errorOf(() => importLog(undefined as never)).code).toBe("invalid_option");
    expect(errorOf(() => importLog("a,b\n1,2", null as never)).code).toBe("invalid_option");
    expect(errorOf(() => importLog("a,b\n1,2", { timeColumn: {} as never })).code).toBe("invalid_option");
  });
});
