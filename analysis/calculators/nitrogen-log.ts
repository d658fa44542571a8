/**
 * A pressure logger's CSV from a nitrogen standing-pressure test → gauge readings over time.
 *
 * The pressure unit and whether it is gauge or absolute come from the column header
 * (`nitrogen-units.ts`: psig, kPa g, bar (g) are gauge; psia, kPa abs, bara absolute). A header
 * that names only the unit (kPa, mbar, Pa, psi, bar) is never guessed: the caller passes the
 * technician's answer (`ambiguousAs`) or the log is refused with the column named. Absolute
 * readings become gauge by subtracting the atmosphere (entered, or the standard 101325 Pa).
 *
 * Layout, numbers and times are read by the decay importer's own reader (analysis/decay/import:
 * delimiter, preamble and header sniffing, the decimal comma decided per column, thousands groups,
 * every time form it knows including separate date and time columns), so both logs follow one set of
 * rules; only the pressure column and its unit are the nitrogen test's own.
 */
import Papa from "papaparse";
import { findTime } from "../decay/import/columns";
import { addEvidence, decideDecimalComma, emptyEvidence } from "../decay/import/decimal";
import { parseReading } from "../decay/import/numbers";
import { sniffLayout, type Layout } from "../decay/import/sniff";
import type { TimeSpec } from "../decay/import/timespec";
import { LogError } from "../shared/errors";
import { STANDARD_ATMOSPHERE, type NitrogenPressureUnit, type NitrogenReading, type TemperatureUnit } from "./nitrogen";
import { namesVacuumUnit, readNitrogenHeaderUnit, type NitrogenHeaderUnit, type PressureReference } from "./nitrogen-units";

export interface NitrogenLogOptions {
  /** Local atmosphere in the absolute unit that goes with the log's gauge unit (psia, kPa or bar). */
  atmosphereAbs?: number;
  /** The technician's answer for a header that does not say gauge or absolute. */
  ambiguousAs?: PressureReference;
  /** Temperature unit when the header does not say. */
  temperatureUnit?: TemperatureUnit;
}

export interface NitrogenLog {
  unit: NitrogenPressureUnit;
  /** The pressure column's header as the file wrote it ("Pressure (kPa g)"). */
  sourceUnitText: string;
  /** Whether the file's readings are gauge or absolute, and who said so. */
  readingsAre: PressureReference;
  referenceFrom: "header" | "technician";
  /** True when the file was in absolute units and the atmosphere was subtracted. */
  convertedFromAbsolute: boolean;
  atmosphereAbs: number;
  tSeconds: number[];
  pressureGauge: number[];
  /** 1-based file line of each reading (to name where the highest one is). */
  lines: number[];
  /** Clock time of the first reading (ms since the epoch) when the log's time column is a date and time. */
  startedAtMs: number | null;
  temperatureUnit: TemperatureUnit | null;
  temperature: number[] | null;
  assumptions: string[];
}

/** The pressure column a log's header names, before any reading: what the form asks about. */
export interface NitrogenLogHeader {
  column: string;
  unit: NitrogenHeaderUnit;
}

function isTemperatureHeader(h: string): boolean {
  return /temp|°|deg/i.test(h) || /(^|[^a-z])(f|c)\)?$/i.test(h.trim());
}

function temperatureUnitOf(h: string): TemperatureUnit | null {
  if (/°\s*f|degf|\(f\)|\bf\b|fahrenheit/i.test(h)) return "F";
  if (/°\s*c|degc|\(c\)|\bc\b|celsius/i.test(h)) return "C";
  return null;
}

/**
 * The log's layout by the decay importer's own sniffing (sniff.ts: delimiter, preamble, header row,
 * a units row under the names, sample rows), so both logs are read by one set of rules.
 */
function layoutOf(text: string): Layout {
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.trim() === "") throw new LogError("empty_file", "the file is empty");
  return sniffLayout(text);
}

/**
 * Decimal comma for one column, from its own sample cells by the importer's rule (decimal.ts), else
 * the file's: a logger may localise one column and not another.
 */
function columnDecimalComma(layout: Layout, index: number): boolean {
  const ev = emptyEvidence();
  for (const row of layout.sampleRows) if (row[index] !== undefined) addEvidence(ev, row[index].trim());
  return ev.commaProof > 0 || ev.pointProof > 0 || ev.ambiguousComma > 0 ? decideDecimalComma(ev, layout.delimiter) : layout.decimalComma;
}

/** A number cell by the importer's reader (numbers.ts: decimal comma, thousands groups, spaces); NaN when none. */
function num(cell: string | undefined, decimalComma: boolean): number {
  return cell === undefined ? NaN : parseReading(cell.trim(), decimalComma);
}

function findPressureColumn(header: string[]): { index: number; unit: NitrogenHeaderUnit } {
  for (let i = 0; i < header.length; i++) {
    const h = header[i];
    if (isTemperatureHeader(h) && !/press/i.test(h)) continue;
    let unit: NitrogenHeaderUnit | null;
    try {
      unit = readNitrogenHeaderUnit(h);
    } catch (err) {
      throw new LogError("unknown_unit", (err as Error).message, { column: h });
    }
    if (unit) return { index: i, unit };
  }
  const vacuum = header.find(namesVacuumUnit);
  if (vacuum) throw new LogError("unknown_unit", `column '${vacuum}' is a vacuum unit, not a nitrogen test pressure (psig, kPa g, bar g…)`, { column: vacuum });
  throw new LogError("no_pressure_column", `no column names a pressure unit (psig, psia, kPa g, kPa abs, bar g…): columns are ${header.join(", ")}`);
}

/**
 * The pressure column of a log and what its header says (gauge, absolute, or silent), read from
 * the header alone, so a form can ask the technician before reading the readings.
 */
export function inspectNitrogenLogHeader(text: string): NitrogenLogHeader {
  const { header } = layoutOf(text);
  const { index, unit } = findPressureColumn(header);
  return { column: header[index], unit };
}

/**
 * Read a logger CSV of a nitrogen test: a time column, a pressure column with its unit in the
 * header, and optionally a temperature column. Throws LogError with the line and column.
 */
export function readNitrogenLog(text: string, options: NitrogenLogOptions = {}): NitrogenLog {
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const layout = layoutOf(text);
  const { header } = layout;
  const assumptions: string[] = [];
  const { index: pIdx, unit } = findPressureColumn(header);
  const pHeader = header[pIdx];
  let readingsAre: PressureReference;
  let referenceFrom: NitrogenLog["referenceFrom"];
  if (unit.reference) {
    readingsAre = unit.reference;
    referenceFrom = "header";
    if (options.ambiguousAs && options.ambiguousAs !== unit.reference)
      assumptions.push(`The header '${pHeader}' says ${unit.reference}; the choice '${options.ambiguousAs}' was not used.`);
  } else if (options.ambiguousAs) {
    readingsAre = options.ambiguousAs;
    referenceFrom = "technician";
    assumptions.push(`'${pHeader}' does not say gauge or absolute: read as ${options.ambiguousAs}, as the technician chose.`);
  } else {
    throw new LogError("unknown_unit", `column '${pHeader}': ${unit.unitWord} does not say gauge or absolute; choose which the logger records`, { column: pHeader });
  }
  if (unit.toFamily !== 1) assumptions.push(`Readings in ${unit.unitWord} are shown in ${unit.family === "kpa_gauge" ? "kPa" : unit.family}.`);

  // time (and a separate date) column and how it is written: the decay importer's rules (columns.ts, timespec.ts)
  const time = findTime(layout, {}, new Set([pIdx]));
  const tIdx = time.timeIndex;
  const dIdx = time.dateIndex;
  const tempIdx = header.findIndex((h, i) => i !== pIdx && i !== tIdx && i !== dIdx && isTemperatureHeader(h));
  let temperatureUnit: TemperatureUnit | null = null;
  if (tempIdx >= 0) {
    temperatureUnit = temperatureUnitOf(header[tempIdx]) ?? options.temperatureUnit ?? null;
    if (!temperatureUnit) throw new LogError("unknown_unit", `column '${header[tempIdx]}': say whether the temperature is °F or °C`, { column: header[tempIdx] });
  }

  const absolute = readingsAre === "absolute";
  const atmosphereAbs = options.atmosphereAbs ?? STANDARD_ATMOSPHERE[unit.family];
  const pComma = columnDecimalComma(layout, pIdx);
  const tempComma = tempIdx >= 0 ? columnDecimalComma(layout, tempIdx) : false;
  const rows = Papa.parse<string[]>(text.slice(layout.headerOffset), { delimiter: layout.delimiter, newline: layout.newline, skipEmptyLines: false }).data;
  const read = (spec: TimeSpec) => readRows(rows, layout.headerLine + 1, spec, tIdx, dIdx, (row) => num(row[pIdx], pComma));
  let timed = read(time.spec);
  if ("badLine" in timed && time.spec.alternate) {
    const other = read(time.spec.alternate);
    if (!("badLine" in other)) timed = other;
  }
  if ("badLine" in timed)
    throw new LogError("bad_time", `line ${timed.badLine}: time '${timed.badCell.slice(0, 40)}' is not a time`, { line: timed.badLine, column: header[tIdx] });
  const { tSeconds, lines, rowIndex } = timed;
  const pressureGauge: number[] = [];
  const temperature: number[] = [];
  for (const r of rowIndex) {
    const inFamily = num(rows[r][pIdx], pComma) * unit.toFamily;
    pressureGauge.push(absolute ? inFamily - atmosphereAbs : inFamily);
    if (tempIdx >= 0) temperature.push(num(rows[r][tempIdx], tempComma));
  }
  if (pressureGauge.length < 2) throw new LogError("too_few_readings", `only ${pressureGauge.length} usable reading(s); at least 2 are needed`);
  if (absolute) assumptions.push(`Absolute readings turned into gauge by subtracting the atmosphere (${atmosphereAbs}).`);
  return {
    unit: unit.family,
    sourceUnitText: pHeader,
    readingsAre,
    referenceFrom,
    convertedFromAbsolute: absolute,
    atmosphereAbs,
    tSeconds,
    pressureGauge,
    lines,
    startedAtMs: time.spec.dated && timed.firstRaw === timed.firstRaw ? Math.round(timed.firstRaw * 1000) : null,
    temperatureUnit,
    temperature: tempIdx >= 0 ? temperature : null,
    assumptions,
  };
}

const HALF_DAY_SECONDS = 43_200;

type TimedRows = { tSeconds: number[]; lines: number[]; rowIndex: number[]; firstRaw: number } | { badLine: number; badCell: string };

/**
 * Times of the rows that carry a pressure reading (seconds from the first such row), by the time
 * spec; clock times roll over midnight as in the importer (rows.ts). Row 0 is the header; `headerLine`
 * is its 1-based file line.
 */
function readRows(rows: string[][], headerLine: number, spec: TimeSpec, tIdx: number, dIdx: number, pressureOf: (row: string[]) => number): TimedRows {
  const tSeconds: number[] = [];
  const lines: number[] = [];
  const rowIndex: number[] = [];
  let firstRaw = NaN;
  let prevRaw = NaN;
  let dayOffset = 0;
  for (let r = 1; r < rows.length; r++) {
    const row = rows[r];
    if (row.length === 1 && row[0].trim() === "") continue;
    if (!Number.isFinite(pressureOf(row))) continue;
    const cell = (row[tIdx] ?? "").trim();
    let t = spec.parse(cell, dIdx >= 0 ? (row[dIdx] ?? "").trim() : "");
    if (!Number.isFinite(t)) return { badLine: headerLine + r, badCell: cell };
    if (spec.rollover) {
      t += dayOffset;
      if (prevRaw === prevRaw) {
        if (t < prevRaw - HALF_DAY_SECONDS) { dayOffset += 86400; t += 86400; }
        else if (t > prevRaw + HALF_DAY_SECONDS) { dayOffset -= 86400; t -= 86400; }
      }
      prevRaw = t;
    }
    if (firstRaw !== firstRaw) firstRaw = t;
    tSeconds.push(t - firstRaw);
    lines.push(headerLine + r);
    rowIndex.push(r);
  }
  return { tSeconds, lines, rowIndex, firstRaw };
}

/**
 * Start and end readings of a log: the first and last rows. Temperatures come from the log's
 * column, or from `fallback` when the log has none (typed by the technician).
 */
export function endReadingsOfNitrogenLog(
  log: NitrogenLog,
  fallback?: { startTemperature: number; endTemperature: number },
): { start: NitrogenReading; end: NitrogenReading; durationSeconds: number } {
  const last = log.pressureGauge.length - 1;
  const tStart = log.temperature?.[0];
  const tEnd = log.temperature?.[last];
  const startTemperature = Number.isFinite(tStart) ? tStart! : fallback?.startTemperature;
  const endTemperature = Number.isFinite(tEnd) ? tEnd! : fallback?.endTemperature;
  if (startTemperature === undefined || endTemperature === undefined)
    throw new LogError("invalid_option", "the log has no temperature: enter the start and end temperatures");
  return {
    start: { pressureGauge: log.pressureGauge[0], temperature: startTemperature },
    end: { pressureGauge: log.pressureGauge[last], temperature: endTemperature },
    durationSeconds: log.tSeconds[last] - log.tSeconds[0],
  };
}
