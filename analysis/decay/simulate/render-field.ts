/**
 * The layouts field exports have, for the simulator: separate date and time columns, US dates with
 * AM/PM and a unit column, European dates with semicolons and decimal commas, spreadsheet serial days,
 * Unix seconds and milliseconds, stopwatch h:mm:ss and mm:ss (minutes past 59), ISO 8601 with an
 * offset, quoted TSV with thousands separators, a µ header, and hand-typed minute readings.
 * Invented data. Over-range rows write the log's marker ("OL", "HI", "----", ">25000", or nothing).
 */
import type { PressureUnit } from "../types";
import { micronsTo } from "../../shared/units";
import type { RenderRow, RenderSpec } from "./render";

export const FIELD_LAYOUTS = [
  "date_time_columns",
  "us_ampm_units",
  "eu_semicolon_dates",
  "serial_days",
  "epoch_s",
  "epoch_ms",
  "elapsed_hms",
  "elapsed_mmss",
  "iso_offset",
  "tsv_quoted_thousands",
  "micro_sign",
  "typed_minutes",
] as const;
export type FieldLayout = (typeof FIELD_LAYOUTS)[number];

/** Units each field layout writes in (the first is the default). */
export const FIELD_LAYOUT_UNITS: Record<FieldLayout, readonly PressureUnit[]> = {
  date_time_columns: ["micron", "torr", "pa"],
  us_ampm_units: ["micron", "mtorr"],
  eu_semicolon_dates: ["mbar", "pa", "hpa", "torr"],
  serial_days: ["mtorr", "micron", "kpa"],
  epoch_s: ["micron", "mbar"],
  epoch_ms: ["micron", "psia"],
  elapsed_hms: ["micron", "inhg"],
  elapsed_mmss: ["micron", "torr"],
  iso_offset: ["kpa", "micron", "mbar"],
  tsv_quoted_thousands: ["micron"],
  micro_sign: ["micron"],
  typed_minutes: ["micron"],
};

const HEADER_WORD: Record<PressureUnit, string> = {
  micron: "microns", mtorr: "mTorr", torr: "Torr", mmhg: "mmHg", pa: "Pa", kpa: "kPa abs", mbar: "mbar", hpa: "hPa", psia: "psia", inhg: "inHg abs",
};

const pad2 = (n: number) => (n < 10 ? "0" + n : String(n));

/** A reading in the unit with about five significant digits; microns and mTorr as whole numbers. */
function reading(microns: number, unit: PressureUnit, comma: boolean): string {
  let text: string;
  if (unit === "micron" || unit === "mtorr") text = String(Math.round(microns));
  else {
    const v = micronsTo(microns, unit);
    text = Number(v.toPrecision(5)).toString();
    if (text.includes("e")) text = v.toFixed(8);
  }
  return comma ? text.replace(".", ",") : text;
}

/** "24,500": thousands separated by commas, as spreadsheets write them. */
function grouped(microns: number): string {
  return String(Math.round(microns)).replace(/\B(?=(\d{3})+(?!\d))/g, ",");
}

function cell(r: RenderRow, unit: PressureUnit, comma = false): string {
  return r.microns === null ? (r.marker ?? "") : reading(r.microns, unit, comma);
}

function clock12(d: Date): string {
  const h = d.getUTCHours();
  return `${h % 12 === 0 ? 12 : h % 12}:${pad2(d.getUTCMinutes())}:${pad2(d.getUTCSeconds())} ${h < 12 ? "AM" : "PM"}`;
}

function stopwatch(seconds: number, withHours: boolean): string {
  const s = Math.round(seconds);
  return withHours ? `${Math.floor(s / 3600)}:${pad2(Math.floor(s / 60) % 60)}:${pad2(s % 60)}` : `${pad2(Math.floor(s / 60))}:${pad2(s % 60)}`;
}

/** Lines of a field layout (header first). */
export function renderFieldLines(rows: RenderRow[], layout: FieldLayout, spec: RenderSpec): string[] {
  const startMs = Date.parse(spec.startIso);
  const at = (t: number) => new Date(startMs + Math.round(t) * 1000);
  const unit = spec.unit;
  const word = HEADER_WORD[unit];
  const lines: string[] = [];
  switch (layout) {
    case "date_time_columns":
      lines.push(`Date,Time,Vacuum (${word})`);
      for (const r of rows) {
        const iso = at(r.tSeconds).toISOString();
        lines.push(`${iso.slice(0, 10)},${iso.slice(11, 19)},${cell(r, unit)}`);
      }
      break;
    case "us_ampm_units":
      lines.push("Date,Time,Reading,Units");
      for (const r of rows) {
        const d = at(r.tSeconds);
        lines.push(`${d.getUTCMonth() + 1}/${d.getUTCDate()}/${d.getUTCFullYear()},${clock12(d)},${cell(r, unit)},${unit === "micron" ? "microns" : "mTorr"}`);
      }
      break;
    case "eu_semicolon_dates":
      lines.push(`Datum;Uhrzeit;Vakuum [${word}]`);
      for (const r of rows) {
        const d = at(r.tSeconds);
        lines.push(`${pad2(d.getUTCDate())}.${pad2(d.getUTCMonth() + 1)}.${d.getUTCFullYear()};${d.toISOString().slice(11, 19)};${cell(r, unit, true)}`);
      }
      break;
    case "serial_days":
      // ECMA-376 Part 1 SpreadsheetML 1900 date system: serial 25569 = 1970-01-01
      lines.push(`Timestamp,Pressure (${word})`);
      for (const r of rows) lines.push(`${((startMs / 1000 + Math.round(r.tSeconds)) / 86400 + 25569).toFixed(8)},${cell(r, unit)}`);
      break;
    case "epoch_s":
      lines.push(`unix_time,vacuum (${word})`);
      for (const r of rows) lines.push(`${Math.round(startMs / 1000 + r.tSeconds)},${cell(r, unit)}`);
      break;
    case "epoch_ms":
      lines.push(`time_ms,pressure (${word})`);
      for (const r of rows) lines.push(`${startMs + Math.round(r.tSeconds) * 1000},${cell(r, unit)}`);
      break;
    case "elapsed_hms":
      lines.push(`Elapsed,Vacuum (${word})`);
      for (const r of rows) lines.push(`${stopwatch(r.tSeconds, true)},${cell(r, unit)}`);
      break;
    case "elapsed_mmss":
      lines.push(`Elapsed (mm:ss),Vacuum (${word})`);
      for (const r of rows) lines.push(`${stopwatch(r.tSeconds, false)},${cell(r, unit)}`);
      break;
    case "iso_offset":
      // ISO 8601 local time with its offset from UTC (here UTC−05:00)
      lines.push(`Time,Pressure (${word})`);
      for (const r of rows) lines.push(`${new Date(at(r.tSeconds).getTime() - 5 * 3_600_000).toISOString().slice(0, 19)}-05:00,${cell(r, unit)}`);
      break;
    case "tsv_quoted_thousands":
      lines.push(`"Elapsed (mm:ss)"\t"Vacuum (microns)"`);
      for (const r of rows) lines.push(`"${stopwatch(r.tSeconds, false)}"\t"${r.microns === null ? (r.marker ?? "") : grouped(r.microns)}"`);
      break;
    case "micro_sign":
      lines.push("timestamp,Vacuum (µ)");
      for (const r of rows) lines.push(`${at(r.tSeconds).toISOString().slice(0, 19)}Z,${cell(r, "micron")}`);
      break;
    case "typed_minutes":
      lines.push("minute,reading");
      for (const r of rows) lines.push(`${Math.round(r.tSeconds / 60)},${r.microns === null ? "" : Math.round(r.microns)}`);
      break;
  }
  return lines;
}
