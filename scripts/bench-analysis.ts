/**
 * Analysis benchmark: generated 1 Hz logs (ISO time + microns, a pull-down then a hold) of
 * 3,600 (one hour), 10k, 100k and 1M rows. Each size runs in a fresh child process so peak
 * RSS belongs to that size alone. Times a bare Papa.parse(text), importLog(text) and the full
 * analyzeLog(text) (median of several runs after a JIT warm-up) and prints a markdown table; the first,
 * cold analyzeLog call of each process is reported in its own column.
 *
 *   npm run bench:analysis            (all sizes)
 *   tsx scripts/bench-analysis.ts --child 100000     (one size, JSON on stdout)
 *
 * Then every shape of field export (bench-shapes.ts: US dates with AM/PM and a unit column, European
 * semicolons with decimal commas, quoted TSV with thousands separators, serial days, Unix ms, ISO with
 * an offset, a multi-day pull-down) at 500,000 rows, each in its own child, against a bare Papa.parse.
 *
 *   tsx scripts/bench-analysis.ts --shape "Unix ms, µmHg"   (one shape, JSON on stdout)
 *
 * Goals: analysis ≤ 1.5 × bare parse for every shape, linear growth, the 1-hour log in < 100 ms.
 */
import { spawnSync } from "node:child_process";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import Papa from "papaparse";
import { importLog } from "../analysis/decay/import";
import { SHAPES, shapeTable, timeShape, type ShapeResult } from "./bench-shapes";

/** Rows of each field-export shape (goal: analysis ≤ 1.5 × a bare parse of the same file, for any shape). */
const SHAPE_ROWS = 500_000;

const SIZES = [3_600, 10_000, 100_000, 1_000_000];
const START_MS = Date.UTC(2026, 5, 14, 13, 5, 0);

/** Deterministic LCG (Park–Miller), so every run benchmarks the same text. */
function lcg(seed: number): () => number {
  let s = seed;
  return () => (s = (s * 48271) % 2147483647) / 2147483647;
}

const pad2 = (n: number) => (n < 10 ? "0" + n : String(n));

/**
 * A 1 Hz log: pump-down from 25,000 microns toward 300 (time constant 240 s) for up to 30 min,
 * then isolation and a hold that rises to a 250-micron plateau (time constant 300 s) plus a
 * 1 micron/min climb, with ±3 microns of gauge noise, rounded to whole microns.
 */
export function generateLog(rows: number, seed = 20260614): string {
  const random = lcg(seed);
  const pulldownSeconds = Math.min(1800, Math.floor(rows / 4));
  const parts: string[] = new Array(rows + 1);
  parts[0] = "timestamp,microns";
  let lowest = 0;
  let dayText = "";
  let dayIndex = -1;
  for (let i = 0; i < rows; i++) {
    const ms = START_MS + i * 1000;
    const day = Math.floor(ms / 86_400_000);
    if (day !== dayIndex) {
      dayIndex = day;
      dayText = new Date(day * 86_400_000).toISOString().slice(0, 10);
    }
    const secOfDay = Math.floor((ms % 86_400_000) / 1000);
    const stamp = `${dayText}T${pad2(Math.floor(secOfDay / 3600))}:${pad2(Math.floor(secOfDay / 60) % 60)}:${pad2(secOfDay % 60)}Z`;
    let microns: number;
    if (i <= pulldownSeconds) {
      microns = 300 + 24_700 * Math.exp(-i / 240);
      lowest = microns;
    } else {
      const t = i - pulldownSeconds;
      microns = lowest + 250 * (1 - Math.exp(-t / 300)) + t / 60;
    }
    microns += (random() - 0.5) * 6;
    parts[i + 1] = `${stamp},${Math.round(microns)}`;
  }
  return parts.join("\n") + "\n";
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/**
 * Median wall and CPU milliseconds of each task, run interleaved (parse, import, analyze,
 * parse, …) so that machine load and garbage collection fall on all of them alike.
 */
function timeInterleaved(tasks: (() => unknown)[], repeats: number): { wallMs: number; cpuMs: number }[] {
  const wall: number[][] = tasks.map(() => []);
  const cpu: number[][] = tasks.map(() => []);
  for (let k = 0; k < repeats; k++)
    tasks.forEach((task, j) => {
      const c0 = process.cpuUsage();
      const t0 = performance.now();
      task();
      wall[j].push(performance.now() - t0);
      const c = process.cpuUsage(c0);
      cpu[j].push((c.user + c.system) / 1000);
    });
  return tasks.map((_, j) => ({ wallMs: median(wall[j]), cpuMs: median(cpu[j]) }));
}

interface ChildResult {
  rows: number;
  megabytes: number;
  parseMs: number;
  /** Papa.parse told the delimiter and line end (no guessing passes). */
  parseKnownMs: number;
  importMs: number;
  analyzeMs: number | null;
  /** The first analyzeLog call of the process, before any warm-up (wall ms). */
  coldAnalyzeMs: number | null;
  parseCpuMs: number;
  analyzeCpuMs: number;
  peakRssMb: number;
  retainedHeapMb: number;
  note: string | null;
}

async function child(rows: number): Promise<ChildResult> {
  const text = generateLog(rows);
  const gc = (globalThis as { gc?: () => void }).gc;
  let analyze: ((t: string) => unknown) | null = null;
  let note: string | null = null;
  try {
    // A variable specifier: the bench still runs (import only) while analysis/index.ts is missing.
    const entry = "../analysis/index";
    const mod = (await import(entry)) as { analyzeLog?: (t: string) => unknown };
    if (typeof mod.analyzeLog === "function") analyze = mod.analyzeLog;
  } catch (e) {
    note = `analyzeLog unavailable (${e instanceof Error ? e.message.split("\n")[0] : String(e)})`;
  }
  // Enough runs for a median on a shared, loaded machine (a 10k-row run is a few ms; a 1M-row one seconds).
  const repeats = rows >= 1_000_000 ? 3 : rows >= 100_000 ? 7 : 21;
  // The very first analyzeLog call in a fresh process (code not yet compiled by the JIT), reported apart.
  let coldAnalyzeMs: number | null = null;
  if (analyze) {
    const t0 = performance.now();
    analyze(text);
    coldAnalyzeMs = performance.now() - t0;
  }
  // Warm up the JIT on a small log first (every task ten times, so that the timed runs meet
  // optimised code rather than code still being compiled), then time.
  const warm = generateLog(2000, 7);
  for (let k = 0; k < 10; k++) {
    Papa.parse(warm);
    importLog(warm);
    analyze?.(warm);
  }
  const tasks: (() => unknown)[] = [() => Papa.parse(text), () => Papa.parse(text, { delimiter: ",", newline: "\n" }), () => importLog(text)];
  if (analyze) tasks.push(() => analyze!(text));
  const [parse, parseKnown, imported, analyzed] = timeInterleaved(tasks, repeats);
  const collect = () => { gc?.(); gc?.(); };
  collect();
  const before = process.memoryUsage().heapUsed;
  const kept = analyze ? analyze(text) : importLog(text);
  collect();
  const retained = process.memoryUsage().heapUsed - before;
  void kept;
  return {
    rows,
    megabytes: text.length / 1048576,
    parseMs: parse.wallMs,
    parseKnownMs: parseKnown.wallMs,
    importMs: imported.wallMs,
    analyzeMs: analyzed ? analyzed.wallMs : null,
    coldAnalyzeMs,
    parseCpuMs: parse.cpuMs,
    analyzeCpuMs: (analyzed ?? imported).cpuMs,
    peakRssMb: process.resourceUsage().maxRSS / 1024,
    retainedHeapMb: retained / 1048576,
    note,
  };
}

function parent(): void {
  const script = fileURLToPath(import.meta.url);
  const results: ChildResult[] = [];
  for (const rows of SIZES) {
    const r = spawnSync(process.execPath, ["--expose-gc", "--import", "tsx", script, "--child", String(rows)], { encoding: "utf8", maxBuffer: 1 << 20, cwd: path.resolve(path.dirname(script), "..") });
    if (r.status !== 0) {
      process.stderr.write(`size ${rows} failed (exit ${r.status}): ${r.stderr}\n`);
      process.exitCode = 1;
      continue;
    }
    results.push(JSON.parse(r.stdout.trim().split("\n").at(-1)!));
  }
  const f = (v: number | null, d = 1) => (v === null ? "—" : v.toFixed(d));
  const lines = [
    "| rows | MiB | bare Papa.parse ms | Papa.parse, delimiter given, ms | importLog ms | analyzeLog ms | first (cold) analyzeLog ms | analyzeLog rows/s | analyze / bare parse | analyze / bare parse (CPU) | import / delimiter-given parse | peak RSS MiB | retained result heap MiB |",
    "|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|",
  ];
  for (const r of results) {
    const total = r.analyzeMs ?? r.importMs;
    lines.push(
      `| ${r.rows.toLocaleString("en-US")} | ${f(r.megabytes, 2)} | ${f(r.parseMs)} | ${f(r.parseKnownMs)} | ${f(r.importMs)} | ${f(r.analyzeMs)} | ${f(r.coldAnalyzeMs)} | ${Math.round(r.rows / (total / 1000)).toLocaleString("en-US")} | ${r.analyzeMs === null ? "—" : f(r.analyzeMs / r.parseMs, 2)} | ${f(r.analyzeCpuMs / r.parseCpuMs, 2)} | ${f(r.importMs / r.parseKnownMs, 2)} | ${f(r.peakRssMb, 0)} | ${f(r.retainedHeapMb, 1)} |`,
    );
  }
  console.log(lines.join("\n"));
  const shapes: ShapeResult[] = [];
  for (const shape of SHAPES) {
    const r = spawnSync(process.execPath, ["--import", "tsx", script, "--shape", shape], { encoding: "utf8", maxBuffer: 1 << 20, cwd: path.resolve(path.dirname(script), "..") });
    if (r.status !== 0) {
      process.stderr.write(`shape '${shape}' failed (exit ${r.status}): ${r.stderr}\n`);
      process.exitCode = 1;
      continue;
    }
    shapes.push(JSON.parse(r.stdout.trim().split("\n").at(-1)!));
  }
  if (shapes.length > 0) console.log("\n" + shapeTable(shapes));
  const hour = results.find((r) => r.rows === 3_600);
  if (hour) console.log(`\n1-hour 1 Hz log (3,600 rows): analyzeLog ${f(hour.analyzeMs)} ms warm (${f(hour.coldAnalyzeMs)} ms cold, the first call in a fresh process), importLog ${f(hour.importMs)} ms (goal < 100 ms)`);
  const notes = [...new Set(results.map((r) => r.note).filter((n): n is string => n !== null))];
  for (const n of notes) console.log(`note: ${n}`);
  console.log(`node ${process.version}, ${process.platform}/${process.arch}; medians of 21 / 7 / 3 interleaved runs (≤10k / 100k / 1M rows) after a warm-up of 10 runs on a 2,000-row log; load average ${os.loadavg()[0].toFixed(1)} on ${os.cpus().length} cores`);
  console.log("(CPU ratio: process CPU time, which includes garbage-collector threads. A bare Papa.parse guesses the delimiter by parsing the text once per candidate, so the delimiter-given parse is the fairer floor for importLog. \"analyze\" columns fall back to importLog when analyzeLog is missing.)");
}

const isMain = process.argv[1] !== undefined && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url);
const childAt = process.argv.indexOf("--child");
const shapeAt = process.argv.indexOf("--shape");
if (isMain && shapeAt >= 0) {
  const shape = process.argv[shapeAt + 1];
  import("../analysis/index").then((mod) => console.log(JSON.stringify(timeShape(shape, SHAPE_ROWS, (t) => Papa.parse(t), mod.analyzeLog))));
} else if (isMain && childAt >= 0) child(Number(process.argv[childAt + 1])).then((r) => console.log(JSON.stringify(r)));
else if (isMain) parent();
