/**
 * Which column is the time, the pressure, a unit, an ambient temperature — from header words
 * and the first rows' cells — and what unit the pressure is in.
 */
import { median } from "simple-statistics";
import { LogError } from "../../shared/errors";
import type { ImportOptions, PressureUnit, UnsureReason } from "../types";
import { type GaugeUnit, namesAmbiguousUnit, parsePressureUnit, UNITS_UNDERSTOOD, unitTokens } from "../../shared/units";
import { classifyNonNumber, parseReading } from "./numbers";
import type { Layout } from "./sniff";
import { detectTimeSpec, detectTimeSpecLoosely, type TimeSpec } from "./timespec";

export interface ColumnChoice {
  timeIndex: number;
  /** Separate date column (format date_and_time), else -1. */
  dateIndex: number;
  pressureIndex: number;
  /** Column holding a unit per row, else -1 (only used when the unit is not fixed). */
  unitIndex: number;
  temperatureIndex: number;
  temperatureFahrenheit: boolean;
  /** Fixed pressure unit, or null when the unit column decides per row. */
  unit: PressureUnit | null;
  /** Unit assumed (microns) because nothing named one. */
  unitAssumed: boolean;
  time: TimeSpec;
  assumptions: string[];
  unsure: boolean;
  /** The guesses behind `unsure` made here (columns, unit) and by the time format (time, date order). */
  unsureReasons: UnsureReason[];
}

const TIME_WORDS = new Set(["time", "timestamp", "datetime", "date", "elapsed", "clock", "stamp", "ts", "t", "runtime", "duration", "zeit", "hora", "utc", "local", "sec", "secs", "seconds", "min", "mins", "minute", "minutes", "hour", "hours", "epoch", "unix", "excel", "serial", "uhrzeit", "datum", "heure", "tiempo", "fecha"]);
const DATE_WORDS = new Set(["date", "datum", "fecha"]);
const CLOCK_WORDS = new Set(["time", "zeit", "uhrzeit", "hora", "heure"]);
const PRESSURE_WORDS = new Set(["pressure", "vacuum", "vac", "reading", "readings", "value", "gauge", "level", "p", "press", "abs", "absolute", "druck", "vakuum", "pression", "vide", "vacio", "presion"]);
const TEMPERATURE_WORDS = new Set(["temp", "temperature", "ambient", "degf", "degc", "fahrenheit", "celsius", "tamb", "oat"]);
const UNIT_WORDS = new Set(["unit", "units", "uom"]);
const IGNORED_WORDS = new Set(["battery", "batt", "sensor", "id", "serial", "rssi", "signal", "status", "humidity", "rh", "voltage", "volts", "note", "notes", "comment", "event", "index", "record", "channel", "name", "device", "model", "flag", "flags", "alarm"]);

function hasWord(tokens: string[], words: Set<string>): boolean {
  return tokens.some((t) => words.has(t));
}

function columnCells(layout: Layout, index: number): string[] {
  const out: string[] = [];
  for (const row of layout.sampleRows) {
    const c = row[index];
    if (c !== undefined && c.trim().length > 0) out.push(c.trim());
  }
  return out;
}

/**
 * At least half the cells are numbers, gauge markers (">25000", "OR", "---", "<20") left out of
 * the count: a column of readings that starts above the gauge's range is still numeric.
 */
function mostlyNumeric(cells: string[], decimalComma: boolean): boolean {
  let n = 0;
  let counted = 0;
  for (const c of cells) {
    const v = parseReading(c, decimalComma);
    if (v === v) { n++; counted++; continue; }
    const kind = classifyNonNumber(c);
    if (kind !== "over_range" && kind !== "dashes" && kind !== "under_range") counted++;
  }
  return n > 0 && n * 2 >= counted;
}

function describeColumns(header: string[]): string {
  return header.map((h, i) => (h.length > 0 ? `'${h}'` : `#${i}`)).join(", ");
}

/** Resolve a header name (case-insensitive) or 0-based index given in options. */
function resolveColumn(header: string[], want: string | number, what: string): number {
  if (typeof want === "number") {
    if (Number.isInteger(want) && want >= 0 && want < header.length) return want;
  } else if (typeof want === "string") {
    const i = header.findIndex((h) => h.toLowerCase() === want.trim().toLowerCase());
    if (i >= 0) return i;
  }
  throw new LogError("invalid_option", `${what} column ${JSON.stringify(want)} is not in the file; columns seen: ${describeColumns(header)}`, { column: String(want) });
}

const GAUGE_WORDS: Record<GaugeUnit, string> = { psig: "psig", kpa_gauge: "kPa gauge", bar_gauge: "bar gauge", inhg_vacuum: "inHg vacuum" };

function gaugeError(header: string, unitText: string, gaugeUnit: GaugeUnit): LogError {
  return new LogError(
    "unknown_unit",
    `column '${header}': '${unitText}' is ${GAUGE_WORDS[gaugeUnit]}, a gauge pressure (relative to the atmosphere), not an absolute vacuum reading; export the log in an absolute unit (${UNITS_UNDERSTOOD.join(", ")})`,
    { column: header },
  );
}

function unknownUnitError(header: string, unitText: string): LogError {
  const ambiguous = namesAmbiguousUnit(unitText);
  const why = ambiguous === "psi"
    ? "'psi' does not say absolute (psia) or gauge (psig)"
    : ambiguous === "bar"
      ? "bar is not read here (use mbar or kPa)"
      : `'${unitText}' is not a pressure unit known here`;
  return new LogError("unknown_unit", `column '${header}': ${why}; units understood: ${UNITS_UNDERSTOOD.join(", ")}`, { column: header });
}

/** Words in brackets after a pressure header that qualify it rather than name a unit ("Vacuum (system)"). */
const QUALIFIER_WORDS = new Set([
  "abs", "absolute", "avg", "average", "mean", "min", "max", "raw", "live", "actual", "system", "sensor", "probe", "gauge", "channel", "ch",
  "left", "right", "inlet", "outlet", "suction", "liquid", "discharge", "high", "low", "side", "port", "vacuum", "pressure", "reading", "value",
  "calibrated", "corrected", "filtered", "smoothed", "remote", "wireless", "main", "aux", "display", "a", "b", "c", "at", "core", "tool",
  "pump", "hose", "manifold", "unit", "units", "of", "the", "in", "on", "off", "rig", "indoor", "outdoor", "coil",
]);

/**
 * The text a pressure header names as its unit when that is no unit known here ("pressure (furlongs)",
 * "Vacuum [xyz]"), or null: bracketed words that are neither a unit, nor a label with digits, nor
 * words that only qualify the column.
 */
export function unknownUnitNamed(header: string): string | null {
  const m = /[([]\s*([^()[\]]+?)\s*[)\]]/.exec(header);
  if (!m) return null;
  const inside = m[1];
  if (/\d/.test(inside) || parsePressureUnit(inside)) return null;
  const words = unitTokens(inside);
  if (words.length === 0 || words.every((w) => QUALIFIER_WORDS.has(w))) return null;
  return inside;
}

export function findTime(layout: Layout, options: ImportOptions, taken: Set<number>): { timeIndex: number; dateIndex: number; spec: TimeSpec } {
  const { header, decimalComma } = layout;
  const tokens = header.map((h) => unitTokens(h));
  const detect = (i: number, dateIndex = -1) =>
    detectTimeSpec(header[i], columnCells(layout, i), decimalComma, options.timeUnit,
      dateIndex >= 0 ? header[dateIndex] : null, dateIndex >= 0 ? columnCells(layout, dateIndex) : null);

  if (options.timeColumn !== undefined) {
    const i = resolveColumn(header, options.timeColumn, "time");
    const spec = detect(i);
    if (!spec) {
      const line = layout.sampleLines[0] ?? layout.headerLine + 2;
      throw new LogError("bad_time", `line ${line}: time '${columnCells(layout, i)[0] ?? ""}' in column '${header[i]}' is not a time`, { line, column: header[i] });
    }
    return { timeIndex: i, dateIndex: -1, spec };
  }

  // Separate date and time columns.
  const dateOnly = tokens.findIndex((t) => hasWord(t, DATE_WORDS) && !hasWord(t, CLOCK_WORDS));
  const timeOnly = tokens.findIndex((t, i) => i !== dateOnly && hasWord(t, CLOCK_WORDS) && !hasWord(t, DATE_WORDS));
  if (dateOnly >= 0 && timeOnly >= 0) {
    const spec = detect(timeOnly, dateOnly);
    if (spec) return { timeIndex: timeOnly, dateIndex: dateOnly, spec };
  }

  const named = header.map((_, i) => i).filter((i) => !taken.has(i) && hasWord(tokens[i], TIME_WORDS));
  for (const i of named) {
    const spec = detect(i);
    if (spec) return { timeIndex: i, dateIndex: -1, spec };
  }
  // No time word: the first column whose cells are dated or clock times.
  for (let i = 0; i < header.length; i++) {
    if (taken.has(i) || parsePressureUnit(header[i])) continue;
    const spec = detect(i);
    if (spec && (spec.dated || spec.format === "clock")) return { timeIndex: i, dateIndex: -1, spec };
  }
  if (named.length > 0) {
    const i = named[0];
    // blame the first cell that is not in the form most cells are written in (or the first cell)
    const loose = detectTimeSpecLoosely(header[i], columnCells(layout, i), decimalComma);
    const blamed = loose ? layout.sampleRows.findIndex((r) => (r[i] ?? "").trim().length > 0 && !(loose.parse((r[i] ?? "").trim(), "") === loose.parse((r[i] ?? "").trim(), ""))) : -1;
    const k = blamed >= 0 ? blamed : layout.sampleRows.findIndex((r) => (r[i] ?? "").trim().length > 0);
    const line = k >= 0 ? layout.sampleLines[k] : layout.headerLine + 2;
    const cell = k >= 0 ? layout.sampleRows[k][i].trim() : "";
    throw new LogError("bad_time", `line ${line}: time '${cell}' in column '${header[i]}' is not a time${loose ? ` (expected ${loose.description})` : ""}`, { line, column: header[i] });
  }
  throw new LogError("no_time_column", `no time column found; columns seen: ${describeColumns(header)}`);
}

/** Choose the columns and the unit. Throws LogError (no_time_column, no_pressure_column, unknown_unit, invalid_option, bad_time). */
export function chooseColumns(layout: Layout, options: ImportOptions): ColumnChoice {
  const { header, decimalComma } = layout;
  const tokens = header.map((h) => unitTokens(h));
  const assumptions: string[] = [];
  const reasons: UnsureReason[] = [];
  let unsure = false;

  let pressureIndex = -1;
  const taken = new Set<number>();
  if (options.pressureColumn !== undefined) {
    pressureIndex = resolveColumn(header, options.pressureColumn, "pressure");
    taken.add(pressureIndex);
  }
  const { timeIndex, dateIndex, spec } = findTime(layout, options, taken);
  taken.add(timeIndex);
  if (dateIndex >= 0) taken.add(dateIndex);

  const unitIndex = tokens.findIndex((t, i) => !taken.has(i) && hasWord(t, UNIT_WORDS) && !parsePressureUnit(header[i]));
  if (unitIndex >= 0) taken.add(unitIndex);

  const isTemperature = (i: number) => {
    const t = tokens[i];
    if (hasWord(t, TEMPERATURE_WORDS)) return true;
    return t.length <= 3 && (t.includes("f") || t.includes("c")) && !parsePressureUnit(header[i]);
  };

  if (pressureIndex < 0) {
    for (let i = 0; i < header.length && pressureIndex < 0; i++)
      if (!taken.has(i) && parsePressureUnit(header[i]) && !isTemperature(i)) pressureIndex = i;
    for (let i = 0; i < header.length && pressureIndex < 0; i++)
      if (!taken.has(i) && hasWord(tokens[i], PRESSURE_WORDS) && !isTemperature(i)) pressureIndex = i;
    if (pressureIndex < 0) {
      const numeric = header
        .map((_, i) => i)
        .filter((i) => !taken.has(i) && !isTemperature(i) && !hasWord(tokens[i], IGNORED_WORDS) && mostlyNumeric(columnCells(layout, i), decimalComma));
      if (numeric.length === 1) {
        pressureIndex = numeric[0];
        assumptions.push(`pressure read from column '${header[pressureIndex]}': the only other numeric column (its header does not say pressure)`);
        reasons.push({ code: "columns", message: assumptions[assumptions.length - 1] });
        unsure = true;
      }
    }
    if (pressureIndex < 0)
      throw new LogError("no_pressure_column", `no pressure column found; columns seen: ${describeColumns(header)}`);
  }
  taken.add(pressureIndex);

  // Unit: option, then the pressure header, then a unit column, else microns (a guess).
  const pressureHeader = header[pressureIndex];
  let unit: PressureUnit | null = null;
  let unitAssumed = false;
  if (options.unit) {
    unit = options.unit;
    assumptions.push(`pressure unit ${unit}, as asked`);
  } else {
    const parsed = parsePressureUnit(pressureHeader);
    if (parsed && parsed.gauge) throw gaugeError(pressureHeader, pressureHeader, parsed.gaugeUnit);
    if (parsed && !parsed.gauge) unit = parsed.unit;
    else if (namesAmbiguousUnit(pressureHeader)) throw unknownUnitError(pressureHeader, pressureHeader);
    else if (unknownUnitNamed(pressureHeader) !== null) throw unknownUnitError(pressureHeader, unknownUnitNamed(pressureHeader)!);
    else if (unitIndex < 0) {
      unit = "micron";
      unitAssumed = true;
      unsure = true;
      assumptions.push(`unit taken as microns: the header '${pressureHeader}' names none`);
      reasons.push({ code: "unit", message: assumptions[assumptions.length - 1] });
    }
  }

  let temperatureIndex = -1;
  for (let i = 0; i < header.length && temperatureIndex < 0; i++)
    if (!taken.has(i) && isTemperature(i) && mostlyNumeric(columnCells(layout, i), decimalComma)) temperatureIndex = i;
  let temperatureFahrenheit = false;
  if (temperatureIndex >= 0) {
    const t = tokens[temperatureIndex];
    if (t.some((w) => w === "f" || w === "degf" || w === "fahrenheit" || w === "of")) temperatureFahrenheit = true;
    else if (!t.some((w) => w === "c" || w === "degc" || w === "celsius" || w === "oc")) {
      const cells = columnCells(layout, temperatureIndex).map((c) => parseReading(c, decimalComma)).filter((v) => v === v);
      temperatureFahrenheit = cells.length > 0 && median(cells) > 50;
      assumptions.push(`temperature column '${header[temperatureIndex]}' names no unit: read as ${temperatureFahrenheit ? "°F (values above 50)" : "°C"}`);
    }
  }

  const all = spec.assumptions.concat(assumptions);
  return {
    timeIndex,
    dateIndex,
    pressureIndex,
    unitIndex: unit === null ? unitIndex : -1,
    temperatureIndex,
    temperatureFahrenheit,
    unit,
    unitAssumed,
    time: spec,
    assumptions: all,
    unsure: unsure || spec.unsure,
    unsureReasons: [...(spec.unsure ? [{ code: spec.dated ? "date_order" : "time", message: spec.assumptions[spec.assumptions.length - 1] ?? spec.description } as UnsureReason] : []), ...reasons],
  };
}

export { gaugeError, unknownUnitError };
