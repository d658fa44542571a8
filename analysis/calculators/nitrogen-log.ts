/**
 * A pressure logger's CSV from a nitrogen standing-pressure test → gauge readings over time.
 *
 * The pressure unit and whether it is gauge or absolute come from the column header
 * (`nitrogen-units.ts`: psig, kPa g, bar (g) are gauge; psia, kPa abs, bara absolute). A header
 * that names only the unit (kPa, mbar, Pa, psi, bar) is never guessed: the caller passes the
 * technician's answer (`ambiguousAs`) or the log is refused with the column named. Absolute
 * readings become gauge by subtracting the atmosphere (entered, or the standard 101325 Pa).
 */
import Papa from "papaparse";
import { LogError } from "../shared/errors";
import { unitTokens } from "../shared/units";
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

function num(cell: string | undefined): number {
  if (cell === undefined) return NaN;
  const s = cell.trim().replace(/\s/g, "");
  return s === "" ? NaN : Number(s.replace(/,(?=\d+$)/, "."));
}

function isTimeHeader(h: string): boolean {
  const t = unitTokens(h);
  return t.some((x) => ["time", "date", "timestamp", "elapsed", "t", "seconds", "s", "min", "minutes"].includes(x));
}

function isTemperatureHeader(h: string): boolean {
  return /temp|°|deg/i.test(h) || /(^|[^a-z])(f|c)\)?$/i.test(h.trim());
}

function temperatureUnitOf(h: string): TemperatureUnit | null {
  if (/°\s*f|degf|\(f\)|\bf\b|fahrenheit/i.test(h)) return "F";
  if (/°\s*c|degc|\(c\)|\bc\b|celsius/i.test(h)) return "C";
  return null;
}

function parseRows(text: string): { rows: string[][]; headerIndex: number; header: string[] } {
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.trim() === "") throw new LogError("empty_file", "the file is empty");
  const rows = Papa.parse<string[]>(text.trim(), { header: false, skipEmptyLines: true }).data;
  const headerIndex = rows.findIndex((r) => r.some((c) => /[a-z]/i.test(c)) && r.length >= 2);
  if (headerIndex < 0) throw new LogError("no_header", "no header row with column names was found");
  return { rows, headerIndex, header: rows[headerIndex].map((h) => h.trim()) };
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
  const { header } = parseRows(text);
  const { index, unit } = findPressureColumn(header);
  return { column: header[index], unit };
}

/**
 * Read a logger CSV of a nitrogen test: a time column, a pressure column with its unit in the
 * header, and optionally a temperature column. Throws LogError with the line and column.
 */
export function readNitrogenLog(text: string, options: NitrogenLogOptions = {}): NitrogenLog {
  const { rows, headerIndex, header } = parseRows(text);
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

  const tIdx = header.findIndex((h, i) => i !== pIdx && isTimeHeader(h));
  if (tIdx < 0) throw new LogError("no_time_column", `no time column: columns are ${header.join(", ")}`);
  const tempIdx = header.findIndex((h, i) => i !== pIdx && i !== tIdx && isTemperatureHeader(h));
  let temperatureUnit: TemperatureUnit | null = null;
  if (tempIdx >= 0) {
    temperatureUnit = temperatureUnitOf(header[tempIdx]) ?? options.temperatureUnit ?? null;
    if (!temperatureUnit) throw new LogError("unknown_unit", `column '${header[tempIdx]}': say whether the temperature is °F or °C`, { column: header[tempIdx] });
  }

  const absolute = readingsAre === "absolute";
  const atmosphereAbs = options.atmosphereAbs ?? STANDARD_ATMOSPHERE[unit.family];
  const minutes = /min/i.test(header[tIdx]);
  const tSeconds: number[] = [];
  const pressureGauge: number[] = [];
  const lines: number[] = [];
  const temperature: number[] = [];
  let t0: number | null = null;
  let startedAtMs: number | null = null;
  for (let r = headerIndex + 1; r < rows.length; r++) {
    const row = rows[r];
    const line = r + 1;
    const rawP = num(row[pIdx]);
    if (!Number.isFinite(rawP)) continue;
    const cell = (row[tIdx] ?? "").trim();
    let t = num(cell);
    if (Number.isFinite(t)) t = minutes ? t * 60 : t;
    else {
      const ms = Date.parse(cell.replace(" ", "T"));
      if (!Number.isFinite(ms)) throw new LogError("bad_time", `line ${line}: time '${cell.slice(0, 40)}' is not a time`, { line, column: header[tIdx] });
      t = ms / 1000;
      if (t0 === null) startedAtMs = ms;
    }
    t0 ??= t;
    tSeconds.push(t - t0);
    lines.push(line);
    const inFamily = rawP * unit.toFamily;
    pressureGauge.push(absolute ? inFamily - atmosphereAbs : inFamily);
    if (tempIdx >= 0) temperature.push(num(row[tempIdx]));
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
    startedAtMs,
    temperatureUnit,
    temperature: tempIdx >= 0 ? temperature : null,
    assumptions,
  };
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
