/**
 * Logs of the shapes field exports have, for `npm run bench:analysis`: the same 1 Hz curve (an
 * over-range start, a pull-down, a hold that levels off) written as each layout writes it. Invented data.
 */

/** Deterministic LCG (Park–Miller), so every run benchmarks the same text. */
function lcg(seed: number): () => number {
  let s = seed;
  return () => (s = (s * 48271) % 2147483647) / 2147483647;
}

const START_MS = Date.UTC(2026, 10, 18, 14, 47, 0);
const pad2 = (n: number) => (n < 10 ? "0" + n : String(n));

/** The reading (microns) at second i of a log of `rows` seconds, or null while over the gauge's range. */
function curve(rows: number, leadOverRange: number, longPulldown: boolean): (i: number, noise: number) => number | null {
  const pulldownEnd = Math.floor(rows * (longPulldown ? 0.97 : 0.6));
  let iso = 0;
  return (i, noise) => {
    if (i < leadOverRange) return null;
    let v: number;
    if (i <= pulldownEnd) {
      const s = i - leadOverRange;
      v = longPulldown ? 600 + 24000 * Math.exp(-s / 2000) + 300 * Math.exp(-s / 300000) : 300 + 24_700 * Math.exp(-s / 240);
      iso = v;
    } else {
      const s = i - pulldownEnd;
      v = iso + 2500 * (1 - Math.exp(-s / 300)) + s / 600;
    }
    return Math.max(1, Math.round(v * (1 + noise)));
  };
}

interface Writer {
  header: string;
  row(ms: number, i: number, microns: number | null): string;
}

const micronsText = (v: number | null, over = "OL") => (v === null ? over : String(v));
const grouped = (v: number) => (v >= 1000 ? `${Math.floor(v / 1000)},${String(v % 1000).padStart(3, "0")}` : String(v));

const WRITERS: Record<string, Writer> = {
  "ISO 8601 Z, microns": { header: "timestamp,microns", row: (ms, _i, v) => `${new Date(ms).toISOString().slice(0, 19)}Z,${micronsText(v)}` },
  "US date + AM/PM time, unit column": {
    header: "Date,Time,Reading,Units",
    row: (ms, _i, v) => {
      const d = new Date(ms);
      const h = d.getUTCHours();
      return `${d.getUTCMonth() + 1}/${d.getUTCDate()}/${d.getUTCFullYear()},${h % 12 === 0 ? 12 : h % 12}:${pad2(d.getUTCMinutes())}:${pad2(d.getUTCSeconds())} ${h < 12 ? "AM" : "PM"},${v === null ? "" : v},microns`;
    },
  },
  "EU date;time;mbar decimal comma": {
    header: "Datum;Zeit;Vakuum [mbar]",
    row: (ms, _i, v) => {
      const d = new Date(ms);
      return `${pad2(d.getUTCDate())}.${pad2(d.getUTCMonth() + 1)}.${d.getUTCFullYear()};${d.toISOString().slice(11, 19)};${v === null ? "----" : (v / 750.061683).toFixed(4).replace(".", ",")}`;
    },
  },
  "TSV quoted, mm:ss past 59, thousands": {
    header: '"Elapsed (mm:ss)"\t"Vacuum (microns)"',
    row: (_ms, i, v) => `"${pad2(Math.floor(i / 60))}:${pad2(i % 60)}"\t"${v === null ? ">25,000" : grouped(v)}"`,
  },
  "spreadsheet serial days, mTorr": { header: "Timestamp,Pressure (mTorr)", row: (ms, _i, v) => `${(ms / 86_400_000 + 25569).toFixed(8)},${micronsText(v, "HI")}` },
  "Unix ms, µmHg": { header: "time_ms,vacuum (µmHg)", row: (ms, _i, v) => `${ms},${micronsText(v, "")}` },
  "ISO 8601 -05:00, kPa abs": {
    header: "Time,Pressure (kPa abs)",
    row: (ms, _i, v) => `${new Date(ms - 5 * 3_600_000).toISOString().slice(0, 19)}-05:00,${v === null ? ">3.333" : (v / 7500.61683).toPrecision(4)}`,
  },
  "elapsed h:mm:ss, multi-day pull-down": {
    header: "Elapsed,Vacuum (microns)",
    row: (_ms, i, v) => `${Math.floor(i / 3600)}:${pad2(Math.floor(i / 60) % 60)}:${pad2(i % 60)},${micronsText(v)}`,
  },
};

export const SHAPES = Object.keys(WRITERS);

/**
 * A `rows`-row 1 Hz log of one shape: the first 10 % over range (an hour in a 36,000-row log), then
 * a pull-down and a hold with ±0.5 % noise ("multi-day pull-down": 97 % pull-down, no long over-range start).
 */
export function generateShapedLog(shape: string, rows: number, seed = 20261118): string {
  const w = WRITERS[shape];
  if (!w) throw new Error(`unknown shape '${shape}'`);
  const long = shape.includes("multi-day");
  const at = curve(rows, long ? 60 : Math.floor(rows * 0.1), long);
  const random = lcg(seed);
  const parts: string[] = new Array(rows + 1);
  parts[0] = w.header;
  for (let i = 0; i < rows; i++) parts[i + 1] = w.row(START_MS + i * 1000, i, at(i, (random() - 0.5) * 0.01));
  return parts.join("\n") + "\n";
}

/** One shape's figures at one size (a child process of `npm run bench:analysis`). */
export interface ShapeResult {
  shape: string;
  rows: number;
  megabytes: number;
  parseMs: number;
  analyzeMs: number;
  parseCpuMs: number;
  analyzeCpuMs: number;
  verdict: string;
}

function median(values: number[]): number {
  const s = values.slice().sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/**
 * Time a bare Papa.parse(text) against analyzeLog(text) on one shape, interleaved (parse, analyse,
 * parse, …) so machine load falls on both alike; medians of `repeats` runs after a warm-up of two.
 */
export function timeShape(shape: string, rows: number, parse: (t: string) => unknown, analyze: (t: string) => { verdict: string }, repeats = 5): ShapeResult {
  const text = generateShapedLog(shape, rows);
  let verdict = "";
  for (let k = 0; k < 2; k++) {
    parse(text);
    verdict = analyze(text).verdict;
  }
  const wall: number[][] = [[], []];
  const cpu: number[][] = [[], []];
  const tasks = [() => parse(text), () => analyze(text)];
  for (let k = 0; k < repeats; k++)
    tasks.forEach((task, j) => {
      const c0 = process.cpuUsage();
      const t0 = performance.now();
      task();
      wall[j].push(performance.now() - t0);
      const c = process.cpuUsage(c0);
      cpu[j].push((c.user + c.system) / 1000);
    });
  return { shape, rows, megabytes: text.length / 1048576, parseMs: median(wall[0]), analyzeMs: median(wall[1]), parseCpuMs: median(cpu[0]), analyzeCpuMs: median(cpu[1]), verdict };
}

/** The markdown table of shape results (goal: analyse / bare parse ≤ 1.5 for every shape). */
export function shapeTable(results: ShapeResult[]): string {
  const lines = [
    "| shape (500,000 rows unless said) | MiB | bare Papa.parse ms | analyzeLog ms | analyse / bare parse | same, CPU | verdict |",
    "|---|---:|---:|---:|---:|---:|---|",
  ];
  for (const r of results)
    lines.push(`| ${r.shape}${r.rows === 500_000 ? "" : ` (${r.rows.toLocaleString("en-US")} rows)`} | ${r.megabytes.toFixed(1)} | ${r.parseMs.toFixed(0)} | ${r.analyzeMs.toFixed(0)} | ${(r.analyzeMs / r.parseMs).toFixed(2)} | ${(r.analyzeCpuMs / r.parseCpuMs).toFixed(2)} | ${r.verdict} |`);
  return lines.join("\n");
}
