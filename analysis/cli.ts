/**
 * Command line: analyse one gauge log.
 *
 *   npx tsx analysis/cli.ts FILE [--json] [--unit U] [--time-unit s|min] [--volume-l V]
 *
 * Prints a readable summary, or with --json exactly one JSON object (the AnalysisResult).
 * Bad input (unreadable file, a log that cannot be read, bad flags): exit code 2 and one line
 * on stderr.
 */
import { readFileSync } from "node:fs";
import { LogError } from "./shared/errors";
import { analyzeLog } from "./index";
import type { AnalysisResult, AnalyzeOptions, PressureUnit } from "./decay/types";
import { micronsTo } from "./shared/units";

const USAGE = "usage: tsx analysis/cli.ts FILE [--json] [--unit micron|mtorr|torr|mmhg|pa|kpa|mbar|hpa|psia|inhg] [--time-unit s|min] [--volume-l LITRES]";
const UNITS: readonly PressureUnit[] = ["micron", "mtorr", "torr", "mmhg", "pa", "kpa", "mbar", "hpa", "psia", "inhg"];

class UsageError extends Error {}

export interface CliArgs {
  file: string;
  json: boolean;
  options: AnalyzeOptions;
}

/** Parse argv (without node and the script). Throws UsageError with a one-line reason. */
export function parseArgs(argv: string[]): CliArgs {
  let file: string | null = null;
  let json = false;
  const importOptions: NonNullable<AnalyzeOptions["import"]> = {};
  const options: AnalyzeOptions = {};
  const value = (i: number, flag: string) => {
    const v = argv[i + 1];
    if (v === undefined || v.startsWith("--")) throw new UsageError(`${flag} needs a value`);
    return v;
  };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const [flag, inline] = a.startsWith("--") && a.includes("=") ? [a.slice(0, a.indexOf("=")), a.slice(a.indexOf("=") + 1)] : [a, null];
    const take = () => (inline !== null ? inline : value(i++, flag));
    if (flag === "--json") json = true;
    else if (flag === "--unit") {
      const u = take().toLowerCase() as PressureUnit;
      if (!UNITS.includes(u)) throw new UsageError(`--unit must be one of ${UNITS.join(", ")}`);
      importOptions.unit = u;
    } else if (flag === "--time-unit") {
      const u = take();
      if (u !== "s" && u !== "min") throw new UsageError("--time-unit must be s or min");
      importOptions.timeUnit = u;
    } else if (flag === "--volume-l") {
      const raw = take();
      const v = Number(raw);
      if (!(v > 0) || !Number.isFinite(v)) throw new UsageError(`--volume-l must be a positive number of litres, got '${raw}'`);
      options.volume = { litres: v };
    } else if (flag === "--help" || flag === "-h") throw new UsageError(USAGE);
    else if (a.startsWith("-") && a !== "-") throw new UsageError(`unknown flag '${a}'`);
    else if (file === null) file = a;
    else throw new UsageError(`one file only (got '${file}' and '${a}')`);
  }
  if (file === null) throw new UsageError("no file given");
  if (Object.keys(importOptions).length > 0) options.import = importOptions;
  return { file, json, options };
}

function microns(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "—";
  return `${Math.round(v).toLocaleString("en-US")} microns (${micronsTo(v, "pa").toFixed(1)} Pa)`;
}

function minutes(seconds: number | null | undefined): string {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return "—";
  const m = Math.floor(seconds / 60);
  const s = Math.round(seconds - m * 60);
  return `${m} min ${String(s).padStart(2, "0")} s`;
}

/** The readable summary: verdict first, then the numbers, what to check, and what was assumed. */
export function formatSummary(r: AnalysisResult, file: string): string {
  const out: string[] = [];
  out.push(`${file}`);
  out.push(`Verdict: ${r.verdict.replace(/_/g, " ").toUpperCase()} (confidence ${Math.round(r.confidence * 100)} %)`);
  for (const reason of r.reasons) out.push(`  - ${reason}`);
  out.push(`Isolated at: ${r.isolationAt === null ? "not seen (log starts in the hold?)" : minutes(r.isolationAt)}`);
  if (r.decay) {
    const d = r.decay;
    out.push(`Hold: ${minutes(d.holdSeconds)}, ${microns(d.startMicrons)} → ${microns(d.endMicrons)} (rise ${Math.round(d.riseMicrons).toLocaleString("en-US")} microns)`);
    out.push(`Leak rate (steady climb): ${d.leakRateMicronsPerMinute.toFixed(1)} microns/min`);
    if (d.plateauMicrons !== null) out.push(`Plateau: ${microns(d.plateauMicrons)}${d.timeConstantSeconds !== null ? `, time constant ${Math.round(d.timeConstantSeconds)} s` : ""}`);
  }
  out.push(`Profile '${r.profile.name}': ${r.meetsProfile ? "met" : "not met"}`);
  for (const rule of r.profileRules) out.push(`  [${rule.met ? "x" : " "}] ${rule.rule}: ${rule.detail}`);
  if (r.forecast) {
    const f = r.forecast;
    out.push(`Forecast at ${minutes(f.atHoldSeconds)} of hold: ${microns(f.predictedMicrons)} (95 % ${Math.round(f.lowMicrons)}–${Math.round(f.highMicrons)})${f.earlyCall ? `, early call: ${f.earlyCall}` : ""}`);
  }
  if (r.leakRate) out.push(`Leak rate in a ${r.leakRate.volumeLitres} L system: ${r.leakRate.mbarLitresPerSecond.toExponential(2)} mbar·L/s`);
  if (r.findings.length > 0) {
    out.push("Findings:");
    for (const f of r.findings) {
      out.push(`  (${f.severity}) ${f.title}: ${f.message}`);
      for (const c of f.checks) out.push(`      check: ${c}`);
      for (const c of f.cautions) out.push(`      CAUTION: ${c}`);
    }
  }
  const im = r.import;
  out.push(`Read: ${im.rows} rows (${im.skipped} skipped, ${im.overRange} over range), unit ${im.unit}, time ${im.timeFormat}, columns '${im.timeColumn}' / '${im.pressureColumn}'${im.unsure ? " — please confirm" : ""}`);
  for (const a of im.assumptions) out.push(`  assumed: ${a}`);
  return out.join("\n");
}

function oneLine(message: string): string {
  return message.replace(/\s*\n\s*/g, " ");
}

export function main(argv: string[]): number {
  let args: CliArgs;
  try {
    args = parseArgs(argv);
  } catch (e) {
    process.stderr.write(`riseline: ${oneLine(e instanceof Error ? e.message : String(e))}\n${e instanceof UsageError && e.message !== USAGE ? USAGE + "\n" : ""}`);
    return 2;
  }
  let text: string;
  try {
    text = readFileSync(args.file, "utf8");
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    process.stderr.write(`riseline: cannot read '${args.file}'${code ? ` (${code})` : ""}\n`);
    return 2;
  }
  try {
    const result = analyzeLog(text, args.options);
    process.stdout.write(args.json ? JSON.stringify(result) + "\n" : formatSummary(result, args.file) + "\n");
    return 0;
  } catch (e) {
    if (e instanceof LogError) {
      process.stderr.write(`riseline: ${args.file}: ${e.code}: ${oneLine(e.message)}\n`);
      return 2;
    }
    process.stderr.write(`riseline: internal error: ${oneLine(e instanceof Error ? e.message : String(e))}\n`);
    return 1;
  }
}

if (process.argv[1] && /cli\.[cm]?[jt]s$/.test(process.argv[1])) process.exitCode = main(process.argv.slice(2));
