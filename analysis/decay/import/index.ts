/**
 * importLog: a gauge's CSV export → sorted times (seconds from the first data row) and
 * pressures in microns, with what was read and what had to be assumed.
 *
 * One papaparse pass over the data, a chunk of rows at a time (each chunk's cells are read into
 * numbers and dropped, so no table of all rows is held); everything else (delimiter, line end,
 * header row, columns, units, time format) is decided from the first lines only and then fixed
 * for the parse. A second pass only when the day/month order was a guess that the first proved wrong.
 */
import Papa from "papaparse";
import { LogError } from "../../shared/errors";
import { groupedInteger } from "../../shared/format";
import type { Finding, ImportedLog, ImportOptions, ImportSummary, PressureUnit } from "../types";
import { UNITS_UNDERSTOOD } from "../../shared/units";
import { chooseColumns } from "./columns";
import { duplicatesFinding, reorderedFinding } from "./findings";
import { RowReader, type NumberSettings, type RowsRead, type RowsResult } from "./rows";
import type { TimeSpec } from "./timespec";
import { sniffLayout } from "./sniff";

/** 64 MiB: a 24-hour 1 Hz log is about 2.5 MB, so this leaves a wide margin. */
export const DEFAULT_MAX_BYTES = 64 * 1024 * 1024;
/** 1,000,000 data rows: a 24-hour 1 Hz log is 86,400. */
export const DEFAULT_MAX_ROWS = 1_000_000;
/**
 * Characters handed to papaparse at a time (it carries a row cut at a chunk's end over to the
 * next). 256 Ki characters is about 10,000 rows of a two-column log.
 */
const PARSE_CHUNK_CHARS = 1 << 18;
/** papaparse reads the next chunk from inside the last one's call: chunks are made larger so a file needs at most this many (bounded stack depth). */
const MAX_PARSE_CHUNKS = 256;
/** Fewest usable readings the analysis can work with. */
export const MIN_READINGS = 5;
/** Fewest when over-range rows follow the last reading: a gross leak leaves the gauge's range after isolation and two readings. */
export const MIN_READINGS_LEFT_RANGE = 3;
/** With no unit named, readings all below this look like Torr or mbar rather than microns. */
const SMALL_VALUES_LIMIT = 30;

const PRESSURE_UNITS: readonly PressureUnit[] = ["micron", "mtorr", "torr", "mmhg", "pa", "kpa", "mbar", "hpa", "psia", "inhg"];

function formatCount(n: number): string {
  return groupedInteger(n);
}

function checkOptions(options: ImportOptions): { maxBytes: number; maxRows: number } {
  if (options === null || typeof options !== "object") throw new LogError("invalid_option", "options must be an object");
  const positive = (v: unknown, name: string, fallback: number) => {
    if (v === undefined) return fallback;
    if (typeof v !== "number" || !(v > 0) || !Number.isFinite(v)) throw new LogError("invalid_option", `${name} must be a positive number, got ${String(v)}`);
    return v;
  };
  if (options.unit !== undefined && !PRESSURE_UNITS.includes(options.unit))
    throw new LogError("invalid_option", `unit '${String(options.unit)}' is not one of ${PRESSURE_UNITS.join(", ")}`);
  if (options.timeUnit !== undefined && options.timeUnit !== "s" && options.timeUnit !== "min")
    throw new LogError("invalid_option", `timeUnit '${String(options.timeUnit)}' must be "s" or "min"`);
  if (options.decimalMark !== undefined && options.decimalMark !== "point" && options.decimalMark !== "comma")
    throw new LogError("invalid_option", `decimalMark '${String(options.decimalMark)}' must be "point" or "comma"`);
  for (const key of ["timeColumn", "pressureColumn"] as const) {
    const v = options[key];
    if (v !== undefined && typeof v !== "string" && typeof v !== "number")
      throw new LogError("invalid_option", `${key} must be a header name or a 0-based column index`);
  }
  return { maxBytes: positive(options.maxBytes, "maxBytes", DEFAULT_MAX_BYTES), maxRows: positive(options.maxRows, "maxRows", DEFAULT_MAX_ROWS) };
}

/** Lines after the header line (a last line without a line end counts too). */
function countDataLines(text: string, headerOffset: number): number {
  const headerEnd = text.indexOf("\n", headerOffset);
  if (headerEnd === -1) return 0;
  let n = 0;
  for (let i = text.indexOf("\n", headerEnd + 1); i !== -1; i = text.indexOf("\n", i + 1)) n++;
  return text.endsWith("\n") ? n : n + 1;
}

function isoOf(seconds: number, zoned: boolean): string | null {
  const ms = seconds * 1000;
  if (!Number.isFinite(ms) || Math.abs(ms) > 8.64e15) return null;
  const iso = new Date(ms).toISOString();
  return zoned ? iso : iso.slice(0, -1); // no zone in the file: local wall time, no "Z"
}

/**
 * Read a gauge log. Throws LogError only (empty_file, file_too_large, too_many_rows, no_header,
 * no_time_column, no_pressure_column, unknown_unit, bad_time, too_few_readings, invalid_option).
 * Anything else escaping is a bug; see importLog for the guarded entry. `chunkChars` (characters
 * parsed at a time) changes only speed, never the result; tests vary it.
 */
export function importLogStrict(text: string, options: ImportOptions = {}, chunkChars: number = PARSE_CHUNK_CHARS): ImportedLog {
  const { maxBytes, maxRows } = checkOptions(options);
  if (typeof text !== "string") throw new LogError("invalid_option", "the log must be text");
  if (text.length > maxBytes)
    throw new LogError("file_too_large", `the file is ${formatCount(text.length)} characters; the limit is ${formatCount(maxBytes)} (${(maxBytes / 1048576).toFixed(0)} MiB)`);
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (!/\S/.test(text.slice(0, 65536)) && text.trim().length === 0) throw new LogError("empty_file", "the file is empty");

  const layout = sniffLayout(text);
  if (layout.sampleRows.length === 0)
    throw new LogError("too_few_readings", `only 0 usable readings: the file has a header (line ${layout.headerLine + 1}) but no data rows; at least ${MIN_READINGS} are needed`, { line: layout.headerLine + 1 });
  const choice = chooseColumns(layout, options);
  const body = layout.headerOffset === 0 ? text : text.slice(layout.headerOffset);
  // a header quoted cell by cell: try papaparse's fast path, the row reader taking the quotes off and
  // giving up (for the quote-aware path) at the first row that shows a quote carried something (rows.ts)
  let fast = body.charCodeAt(0) === 34 && layout.delimiter.length === 1;
  const firstLine = layout.headerLine + 1;
  const numbers: NumberSettings = {
    hint: layout.decimalHint,
    decimalMark: options.decimalMark,
    // a point may group thousands ("12.500") only where the comma is the decimal mark
    pointMayGroup: options.decimalMark === "comma" || (options.decimalMark === undefined && layout.decimalHint?.decimal === ","),
  };
  const readWith = (timeSpec: TimeSpec): RowsResult => {
    const result = readOnce(timeSpec, fast);
    if (result !== null) return result;
    fast = false;
    return readOnce(timeSpec, false)!;
  };
  /** One pass; null when the fast path met a row whose quotes carried something. */
  const readOnce = (timeSpec: TimeSpec, quotedFast: boolean): RowsResult | null => {
    const reader = new RowReader(choice, timeSpec, layout.decimalComma, firstLine, layout.header.length, numbers, quotedFast);
    // Rows are read a chunk at a time and dropped after, so the parsed cells die young (cheap
    // to collect) instead of a table of every row being held to the end. At most maxRows + 2
    // rows (header and one over the limit) are read, as with a whole-text parse with `preview`.
    let rowsLeft = maxRows + 2;
    const chunk = (results: Papa.ParseResult<string[]>, parser: Papa.Parser): void => {
      const rows = results.data;
      if (reader.notPlain) return;
      if (rows.length >= rowsLeft) {
        reader.addRows(rows.length > rowsLeft ? rows.slice(0, rowsLeft) : rows);
        rowsLeft = 0;
        parser.abort();
        return;
      }
      rowsLeft -= rows.length;
      reader.addRows(rows);
      if (reader.notPlain) parser.abort();
    };
    // papaparse's string streamer honours chunkSize and calls `chunk` synchronously, before
    // parse returns; its typings only list chunked parsing for files, hence the widened type.
    const config: Papa.ParseConfig<string[]> & { chunkSize: number; chunk: typeof chunk } = {
      delimiter: layout.delimiter,
      newline: layout.newline,
      header: false,
      skipEmptyLines: false,
      ...(quotedFast ? { fastMode: true } : {}),
      preview: rowsLeft,
      chunkSize: Math.max(chunkChars, Math.ceil(body.length / MAX_PARSE_CHUNKS)),
      chunk,
    };
    Papa.parse<string[]>(body, config);
    return reader.notPlain ? null : reader.finish();
  };

  let spec = choice.time;
  let result = readWith(spec);
  const strays = (r: RowsResult) => (r.ok ? r.read.footerRows + r.read.badTimeRows : Infinity);
  if (spec.alternate && strays(result) > 0) {
    // The day/month order (or clock against stopwatch) was a guess from the first rows: a later row may prove the other.
    const other = readWith(spec.alternate);
    if (other.ok && strays(other) < strays(result)) {
      spec = spec.alternate;
      result = other;
    }
  }
  if (!result.ok) {
    const column = layout.header[choice.timeIndex] ?? String(choice.timeIndex);
    throw new LogError("bad_time", `line ${result.line}: time '${result.cell.trim().slice(0, 40)}' in column '${column}' is not a time (expected ${spec.description})`, { line: result.line, column });
  }
  const read = result.read;
  if (read.rows > maxRows) {
    const found = countDataLines(text, layout.headerOffset);
    throw new LogError("too_many_rows", `the file has about ${formatCount(found)} data rows; the limit is ${formatCount(maxRows)}`);
  }
  const leftRange = read.overRangeRaw.length > 0 && read.rawSeconds.length > 0 && maxOf(read.overRangeRaw) > maxOf(read.rawSeconds);
  if (read.microns.length < (leftRange ? MIN_READINGS_LEFT_RANGE : MIN_READINGS))
    throw new LogError("too_few_readings", `only ${read.microns.length} usable reading${read.microns.length === 1 ? "" : "s"} (of ${read.rows} rows); at least ${MIN_READINGS} are needed`);

  return assemble(read, layout, choice, spec);
}

/*
 * The passes over every reading are small functions of their own: assemble runs once per log, so a
 * long loop inside it would start in the interpreter each time; these compile once, with the arrays' types.
 */

/** Subtract t0 (seconds) from every time in place; returns how many times fall below an earlier one (reordered rows). */
function shiftToFirst(tSeconds: number[], t0: number): number {
  let reordered = 0;
  let runningMax = -Infinity;
  for (let i = 0; i < tSeconds.length; i++) {
    const t = tSeconds[i] - t0;
    tSeconds[i] = t;
    if (t < runningMax) reordered++;
    else runningMax = t;
  }
  return reordered;
}

/** Times equal to the one before (sorted times, seconds) and the first such time. */
function repeatedStamps(tSeconds: number[]): { duplicates: number; firstDuplicateAt: number } {
  let duplicates = 0;
  let firstDuplicateAt = NaN;
  for (let i = 1; i < tSeconds.length; i++)
    if (tSeconds[i] === tSeconds[i - 1]) {
      if (duplicates === 0) firstDuplicateAt = tSeconds[i];
      duplicates++;
    }
  return { duplicates, firstDuplicateAt };
}

/** The largest value (−Infinity for none), in one loop. */
function maxOf(values: number[]): number {
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) if (values[i] > max) max = values[i];
  return max;
}

/** The largest reading, or 0 when none is above zero. */
function largestAboveZero(microns: number[]): number {
  let max = 0;
  for (let i = 0; i < microns.length; i++) if (microns[i] > max) max = microns[i];
  return max;
}

function assemble(read: RowsRead, layout: ReturnType<typeof sniffLayout>, choice: ReturnType<typeof chooseColumns>, spec: typeof choice.time): ImportedLog {
  const assumptions = [...choice.assumptions];
  if (layout.unitsRow) assumptions.unshift(`units read from the row under the column names (line ${layout.headerLine + 1})`);
  if (spec !== choice.time && spec.assumptions.length > 0) assumptions.push(spec.assumptions[spec.assumptions.length - 1]);
  let unsure = choice.unsure;
  const n = read.microns.length;
  const t0 = read.firstRaw;

  // Seconds from the first data row, written over the raw stamps (one array fewer for a big log).
  let tSeconds = read.rawSeconds;
  const reordered = shiftToFirst(tSeconds, t0);
  let microns = read.microns;
  let temperatureC = read.temperatureC;
  if (reordered > 0) {
    const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => tSeconds[a] - tSeconds[b] || a - b);
    tSeconds = order.map((i) => tSeconds[i]);
    microns = order.map((i) => read.microns[i]);
    if (temperatureC) temperatureC = order.map((i) => read.temperatureC![i]);
  }
  const { duplicates, firstDuplicateAt } = repeatedStamps(tSeconds);
  const overRangeSeconds = read.overRangeRaw.map((r) => r - t0).sort((a, b) => a - b);

  const findings: Finding[] = [];
  if (reordered > 0) findings.push(reorderedFinding(reordered, n));
  if (duplicates > 0) findings.push(duplicatesFinding(duplicates, n, firstDuplicateAt));

  if (choice.unitAssumed) {
    const largest = largestAboveZero(microns);
    if (largest < SMALL_VALUES_LIMIT) {
      const column = layout.header[choice.pressureIndex];
      throw new LogError(
        "unknown_unit",
        `column '${column}' names no unit, and every reading is below ${SMALL_VALUES_LIMIT} (the highest is ${largest}): too small for microns, more like Torr, mbar or kPa; choose the unit (units understood: ${UNITS_UNDERSTOOD.join(", ")})`,
        { column },
      );
    }
  }
  const unsureReasons = [...choice.unsureReasons];
  if (spec !== choice.time && spec.unsure) unsureReasons.push({ code: "date_order", message: spec.assumptions[spec.assumptions.length - 1] });
  const grouping = read.grouping;
  if (grouping) {
    assumptions.push(grouping.why);
    if (grouping.unsure) {
      unsure = true;
      unsureReasons.push(grouping.unsure);
    }
  }
  if (read.firstBadTime)
    assumptions.push(`${read.badTimeRows} row${read.badTimeRows === 1 ? "" : "s"} whose time is not a time skipped (first at line ${read.firstBadTime.line}: '${read.firstBadTime.cell.trim().slice(0, 40)}')`);
  if (read.unitsSeen > 1) assumptions.push("the unit column changes between rows: each reading converted with its own unit");
  if (read.footerRows > 0) assumptions.push(`${read.footerRows} line${read.footerRows === 1 ? "" : "s"} at the end with no time ignored (footer)`);
  if (read.ignoredLines > 0) assumptions.push(`${read.ignoredLines} line${read.ignoredLines === 1 ? "" : "s"} with a single cell or a repeated header ignored (not data)`);
  if (read.skipped > 0 && read.overRangeRaw.length > 0)
    assumptions.push(`${read.overRangeRaw.length} reading${read.overRangeRaw.length === 1 ? "" : "s"} marked over range (gauge above its range)`);
  if (read.underRange > 0)
    assumptions.push(`${read.underRange} reading${read.underRange === 1 ? "" : "s"} marked below the gauge's range (such as '<20') skipped`);
  if (spec.unsure) unsure = true;

  const header = layout.header;
  const summary: ImportSummary = {
    rows: read.rows,
    skipped: read.skipped,
    overRange: read.overRangeRaw.length,
    unit: read.unit,
    timeFormat: spec.format,
    delimiter: layout.delimiter,
    decimalComma: grouping ? (grouping.large ? grouping.mark === "." : grouping.mark === ",") : layout.decimalComma,
    headerLine: layout.headerLine,
    columns: header,
    timeColumn: choice.dateIndex >= 0 ? `${header[choice.dateIndex]} + ${header[choice.timeIndex]}` : header[choice.timeIndex],
    pressureColumn: header[choice.pressureIndex],
    temperatureColumn: choice.temperatureIndex >= 0 ? header[choice.temperatureIndex] : null,
    unsure,
    unsureReasons,
    thousandsSeparator: grouping?.large ? grouping.mark : null,
    badTimeRows: read.badTimeRows,
    assumptions,
  };
  return {
    tSeconds,
    microns,
    overRangeSeconds,
    temperatureC,
    startedAt: spec.dated ? isoOf(t0, spec.zoned) : null,
    summary,
    findings,
  };
}

/**
 * Read a gauge log (CSV / semicolon / tab text, as exported) into seconds and microns.
 * Throws LogError only, for any input string: an unexpected failure inside is reported as
 * no_header ("could not be read as a table") rather than escaping as another error type.
 */
export function importLog(text: string, options: ImportOptions = {}): ImportedLog {
  try {
    return importLogStrict(text, options);
  } catch (e) {
    if (e instanceof LogError) throw e;
    throw new LogError("no_header", `the file could not be read as a table of readings (${e instanceof Error ? e.message : String(e)})`);
  }
}
