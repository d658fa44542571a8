/**
 * Renders simulated readings as a gauge-log CSV in one of the file layouts the importer reads.
 * Readings are microns; each layout writes them in its own unit with a sensible number of digits.
 */
import { micronsTo } from "../../shared/units";
import type { PressureUnit } from "../types";
import { FIELD_LAYOUTS, renderFieldLines, type FieldLayout } from "./render-field";

export { FIELD_LAYOUTS, FIELD_LAYOUT_UNITS, type FieldLayout } from "./render-field";

export type Layout = BaseLayout | FieldLayout;

/** The first layouts, drawn by the named scenarios (the field layouts are drawn only when asked). */
export type BaseLayout =
  | "iso"
  | "datetime"
  | "clock_preamble"
  | "elapsed_s"
  | "elapsed_min"
  | "semicolon_comma"
  | "tab"
  | "extra_columns";

export const LAYOUTS: readonly BaseLayout[] = [
  "iso",
  "datetime",
  "clock_preamble",
  "elapsed_s",
  "elapsed_min",
  "semicolon_comma",
  "tab",
  "extra_columns",
];

export const UNITS: readonly PressureUnit[] = ["micron", "mtorr", "torr", "pa", "mbar", "kpa", "psia", "inhg"];

/** Header word for each unit, as a gauge export might spell it. */
const UNIT_LABEL: Record<PressureUnit, string> = {
  micron: "microns",
  mtorr: "mTorr",
  torr: "Torr",
  mmhg: "mmHg",
  pa: "Pa",
  kpa: "kPa",
  mbar: "mbar",
  hpa: "hPa",
  psia: "psia",
  inhg: "inHg abs",
};

/** One row: time in seconds from the first row; microns, or a marker string when off-range/blank. */
export interface RenderRow {
  tSeconds: number;
  microns: number | null;
  marker?: string;
  temperatureC?: number;
}

export interface RenderSpec {
  layout: Layout;
  unit: PressureUnit;
  /** ISO time of the first row (UTC). */
  startIso: string;
}

/** Write a number with about five significant digits and no exponent (or an integer for microns). */
function formatReading(microns: number, unit: PressureUnit, decimalComma: boolean): string {
  let text: string;
  if (unit === "micron" || unit === "mtorr") text = String(Math.round(microns));
  else {
    const v = micronsTo(microns, unit);
    text = v === 0 ? "0" : Number(v.toPrecision(5)).toString();
    if (text.includes("e")) text = v.toFixed(8);
  }
  return decimalComma ? text.replace(".", ",") : text;
}

function pad2(n: number): string {
  return String(n).padStart(2, "0");
}

function isoAt(startMs: number, tSeconds: number): string {
  return new Date(startMs + Math.round(tSeconds) * 1000).toISOString().replace(".000Z", "Z");
}

function dateTimeAt(startMs: number, tSeconds: number): string {
  return isoAt(startMs, tSeconds).replace("T", " ").replace("Z", "");
}

function clockAt(startMs: number, tSeconds: number): string {
  const d = new Date(startMs + Math.round(tSeconds) * 1000);
  return `${pad2(d.getUTCHours())}:${pad2(d.getUTCMinutes())}:${pad2(d.getUTCSeconds())}`;
}

/** Render rows in the chosen layout. Returns the CSV text (LF line ends, trailing newline). */
export function renderLog(rows: RenderRow[], spec: RenderSpec): string {
  const startMs = Date.parse(spec.startIso);
  const label = UNIT_LABEL[spec.unit];
  const lines: string[] = [];
  // an over-range marker such as ">25000" names the gauge's top in the log's own unit
  const marker = (m: string | undefined, comma: boolean): string => {
    const top = /^>(\d+)$/.exec(m ?? "");
    return top ? `>${formatReading(Number(top[1]), spec.unit, comma)}` : (m ?? "");
  };
  const cell = (r: RenderRow, comma = false): string =>
    r.microns === null ? marker(r.marker, comma) : formatReading(r.microns, spec.unit, comma);
  if ((FIELD_LAYOUTS as readonly string[]).includes(spec.layout)) return renderFieldLines(rows, spec.layout as FieldLayout, spec).join("\n") + "\n";
  switch (spec.layout as BaseLayout) {
    case "iso":
      lines.push(`timestamp,pressure (${label})`);
      for (const r of rows) lines.push(`${isoAt(startMs, r.tSeconds)},${cell(r)}`);
      break;
    case "datetime":
      lines.push(`Date Time,Vacuum (${label})`);
      for (const r of rows) lines.push(`${dateTimeAt(startMs, r.tSeconds)},${cell(r)}`);
      break;
    case "clock_preamble":
      lines.push("Vacuum log export", "Job: simulated test bench", "Sampling interval: varies", "");
      lines.push(`Time,Vacuum (${label}),Ambient (C)`);
      for (const r of rows) lines.push(`${clockAt(startMs, r.tSeconds)},${cell(r)},${(r.temperatureC ?? 21).toFixed(1)}`);
      break;
    case "elapsed_s":
      lines.push(`elapsed_s,pressure_${label.replace(" ", "_")}`);
      for (const r of rows) lines.push(`${Math.round(r.tSeconds)},${cell(r)}`);
      break;
    case "elapsed_min":
      lines.push(`time (min),pressure (${label})`);
      for (const r of rows) lines.push(`${(r.tSeconds / 60).toFixed(4)},${cell(r)}`);
      break;
    case "semicolon_comma":
      lines.push(`time;pressure (${label})`);
      for (const r of rows) lines.push(`${isoAt(startMs, r.tSeconds)};${cell(r, true)}`);
      break;
    case "tab":
      lines.push(`time\tpressure (${label})`);
      for (const r of rows) lines.push(`${dateTimeAt(startMs, r.tSeconds)}\t${cell(r)}`);
      break;
    case "extra_columns":
      lines.push(`date_time,sensor,battery_pct,vacuum_${label.replace(" ", "_")}`);
      for (const r of rows) lines.push(`${isoAt(startMs, r.tSeconds)},S1,87,${cell(r)}`);
      break;
  }
  return lines.join("\n") + "\n";
}

/** Layouts whose time column has whole-second resolution (stamps or elapsed seconds). */
export function layoutTimeStepSeconds(layout: Layout): number {
  return layout === "elapsed_min" ? 0.006 : layout === "typed_minutes" ? 60 : 1;
}
