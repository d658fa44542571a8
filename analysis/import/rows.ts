/**
 * The one pass over the parsed rows: time and pressure of each row, skipped and over-range
 * cells, temperature, per-row unit. Kept free of allocation beyond the output arrays.
 */
import { LogError } from "../errors";
import type { PressureUnit } from "../types";
import { micronsPerUnit, parsePressureUnit } from "../units";
import type { ColumnChoice } from "./columns";
import { gaugeError, unknownUnitError } from "./columns";
import { classifyNonNumber, parseReading } from "./numbers";
import type { TimeSpec } from "./timespec";

/** A dash cell ("---") is taken as over-range when the nearest reading is at least this high (microns). */
export const DASH_OVER_RANGE_MICRONS = 5000;
/** Rows at the end whose time is not a time are taken as a footer (and ignored) up to this many. */
const MAX_FOOTER_ROWS = 10;
const HALF_DAY_SECONDS = 43200;

export interface RowsRead {
  /** Raw seconds (absolute, of day + rollover, or elapsed) of each usable reading, in file order. */
  rawSeconds: number[];
  microns: number[];
  temperatureC: number[] | null;
  /** Raw seconds of the rows marked over range. */
  overRangeRaw: number[];
  /** Raw seconds of the first data row. */
  firstRaw: number;
  rows: number;
  skipped: number;
  ignoredLines: number;
  footerRows: number;
  /** Unit of the first reading (or the fixed unit). */
  unit: PressureUnit;
  unitsSeen: number;
  /** Skipped cells marked below the gauge's range ("<20"). */
  underRange: number;
}

export type RowsResult = { ok: true; read: RowsRead } | { ok: false; line: number; cell: string };

/**
 * Read all data rows (rows[0] is the header). `firstLine` is the 1-based file line of rows[0];
 * rows map one-to-one onto lines (quoted line breaks inside a cell would shift the numbers).
 */
export function readRows(rows: string[][], choice: ColumnChoice, spec: TimeSpec, decimalComma: boolean, firstLine: number, fieldCount: number): RowsResult {
  const { timeIndex, dateIndex, pressureIndex, unitIndex, temperatureIndex, temperatureFahrenheit } = choice;
  const header = rows[0] ?? [];
  const parse = spec.parse;
  const rollover = spec.rollover;

  const rawSeconds: number[] = [];
  const microns: number[] = [];
  const temperatureC: number[] | null = temperatureIndex >= 0 ? [] : null;
  const overRangeRaw: number[] = [];
  // Dash cells: raw seconds and the count of readings before them, decided after the pass.
  const dashRaw: number[] = [];
  const dashBefore: number[] = [];

  let factor = choice.unit ? micronsPerUnit(choice.unit) : NaN;
  let firstUnit: PressureUnit | null = choice.unit;
  let lastUnitCell: string | null = null;
  let unitsSeen = choice.unit ? 1 : 0;

  let firstRaw = NaN;
  let prevRaw = NaN;
  let dayOffset = 0;
  let count = 0;
  let skipped = 0;
  let ignoredLines = 0;
  let firstBad = -1;
  let badRows = 0;
  let lastGood = -1;
  let underRange = 0;

  for (let i = 1; i < rows.length; i++) {
    const row = rows[i];
    if (row.length === 1 && fieldCount > 1) {
      if (row[0].trim().length > 0) ignoredLines++;
      continue;
    }
    const timeCell = row[timeIndex];
    if (timeCell === undefined || (timeCell.length === 0 && (dateIndex < 0 || row[dateIndex] === ""))) {
      // A row with no time at all cannot be placed; count it as read and skipped.
      if (row.join("").trim().length === 0) continue;
      count++;
      skipped++;
      continue;
    }
    let t = parse(timeCell, dateIndex >= 0 ? (row[dateIndex] ?? "") : "");
    if (t !== t) {
      const trimmed = timeCell.trim();
      if (trimmed !== timeCell) t = parse(trimmed, dateIndex >= 0 ? (row[dateIndex] ?? "").trim() : "");
      if (t !== t) {
        // The header again (logs joined from two exports): not data.
        if (trimmed === (header[timeIndex] ?? "").trim()) {
          ignoredLines++;
          continue;
        }
        if (firstBad < 0) firstBad = i;
        badRows++;
        continue;
      }
    }
    lastGood = i;
    if (rollover) {
      t += dayOffset;
      if (prevRaw === prevRaw) {
        if (t < prevRaw - HALF_DAY_SECONDS) { dayOffset += 86400; t += 86400; }
        else if (t > prevRaw + HALF_DAY_SECONDS) { dayOffset -= 86400; t -= 86400; }
      }
      prevRaw = t;
    }
    if (count === 0) firstRaw = t;
    count++;

    if (unitIndex >= 0) {
      const unitCell = row[unitIndex] ?? "";
      if (unitCell !== lastUnitCell && unitCell.trim().length > 0) {
        const parsed = parsePressureUnit(unitCell);
        if (!parsed) throw lineError(unknownUnitError(header[unitIndex] ?? "unit", unitCell.trim()), firstLine + i);
        if (parsed.gauge) throw lineError(gaugeError(header[unitIndex] ?? "unit", unitCell.trim(), parsed.gaugeUnit), firstLine + i);
        lastUnitCell = unitCell;
        factor = micronsPerUnit(parsed.unit);
        if (firstUnit === null) firstUnit = parsed.unit;
        else if (parsed.unit !== firstUnit) unitsSeen = 2;
        if (unitsSeen === 0) unitsSeen = 1;
      }
    }

    const cell = row[pressureIndex];
    const v = cell === undefined ? NaN : parseReading(cell, decimalComma);
    if (v === v && v >= 0 && factor === factor) {
      rawSeconds.push(t);
      microns.push(v * factor);
      if (temperatureC !== null) {
        const tc = parseReading(row[temperatureIndex] ?? "", decimalComma);
        temperatureC.push(temperatureFahrenheit ? ((tc - 32) * 5) / 9 : tc);
      }
    } else {
      skipped++;
      const kind = cell === undefined ? "blank" : classifyNonNumber(cell);
      if (kind === "over_range") overRangeRaw.push(t);
      else if (kind === "dashes") { dashRaw.push(t); dashBefore.push(microns.length); }
      else if (kind === "under_range") underRange++;
    }
  }

  if (firstBad >= 0) {
    const footer = lastGood < firstBad && badRows <= MAX_FOOTER_ROWS;
    if (!footer) return { ok: false, line: firstLine + firstBad, cell: rows[firstBad][timeIndex] };
  }

  for (let k = 0; k < dashRaw.length; k++) {
    const before = dashBefore[k];
    const near = before > 0 ? microns[before - 1] : microns.length > 0 ? microns[0] : NaN;
    if (near >= DASH_OVER_RANGE_MICRONS) overRangeRaw.push(dashRaw[k]);
  }

  return {
    ok: true,
    read: {
      rawSeconds,
      microns,
      temperatureC,
      overRangeRaw,
      firstRaw,
      rows: count,
      skipped,
      ignoredLines,
      footerRows: firstBad >= 0 ? badRows : 0,
      unit: firstUnit ?? "micron",
      unitsSeen,
      underRange,
    },
  };
}

function lineError(e: LogError, line: number): LogError {
  return new LogError(e.code, `line ${line}: ${e.message}`, { line, column: e.column ?? undefined });
}
