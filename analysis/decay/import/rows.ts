/**
 * The one pass over the parsed rows: time and pressure of each row, skipped and over-range
 * cells, temperature, per-row unit. Rows are taken a chunk at a time as the parser yields them;
 * nothing is allocated beyond the output arrays.
 */
import { LogError } from "../../shared/errors";
import type { PressureUnit } from "../types";
import { micronsPerUnit, parsePressureUnit } from "../../shared/units";
import type { ColumnChoice } from "./columns";
import { gaugeError, unknownUnitError } from "./columns";
import { AmbiguousCells, readWatched, settleGrouping, type GroupingDecision } from "./grouping";
import { classifyNonNumber, parseReading } from "./numbers";
import type { FileDecimalHint } from "./decimal";
import type { TimeSpec } from "./timespec";

/** A dash cell ("---") is taken as over-range when the nearest reading is at least this high (microns). */
export const DASH_OVER_RANGE_MICRONS = 5000;
/** A dash or blank cell is over range only when that reading is also at least this share of the log's highest reading (the gauge's top). */
const DASH_SHARE_OF_TOP = 0.5;
/** Rows at the end whose time is not a time are taken as a footer (and ignored) up to this many. */
const MAX_FOOTER_ROWS = 10;
/** Rows elsewhere whose time is not a time are skipped, and said, up to this many or this share of the rows; more refuse the log. */
const MAX_BAD_TIME_ROWS = 10;
const MAX_BAD_TIME_SHARE = 0.02;
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
  /** Rows skipped because their time was not a time (a few garbled rows), and the first such line and cell. */
  badTimeRows: number;
  firstBadTime: { line: number; cell: string } | null;
  /** How an ambiguous "4,150" was settled for the pressure column, or null when no cell was ambiguous. */
  grouping: GroupingDecision | null;
}

/** How the pressure column's numbers are to be settled: the file's lean, a forced answer, and whether a point may group thousands. */
export interface NumberSettings {
  hint: FileDecimalHint | null;
  /** From the caller: "point" (a comma groups thousands) or "comma" (a comma is the decimal mark). */
  decimalMark?: "point" | "comma";
  pointMayGroup: boolean;
}

const UNIT_WORDS: Record<PressureUnit, string> = { micron: "microns", mtorr: "mTorr", torr: "Torr", mmhg: "mmHg", pa: "Pa", kpa: "kPa", mbar: "mbar", hpa: "hPa", psia: "psia", inhg: "inHg" };

export type RowsResult = { ok: true; read: RowsRead } | { ok: false; line: number; cell: string };

/**
 * Reads the parsed rows a chunk at a time, as papaparse hands them over (row 0 of the first chunk
 * is the header), so that no table of all rows is ever held: each chunk's cells die young.
 * `firstLine` is the 1-based file line of row 0; rows map one-to-one onto lines (quoted line breaks
 * inside a cell would shift the numbers). Call addRows() for every chunk in file order, then finish().
 */
export class RowReader {
  private readonly rawSeconds: number[] = [];
  private readonly microns: number[] = [];
  private readonly temperatureC: number[] | null;
  private readonly overRangeRaw: number[] = [];
  // Dash cells: raw seconds and the count of readings before them, decided after the pass.
  private readonly dashRaw: number[] = [];
  private readonly dashBefore: number[] = [];
  private header: string[] = [];
  private index = 0;
  private factor: number;
  private firstUnit: PressureUnit | null;
  private lastUnitCell: string | null = null;
  private unitsSeen: number;
  private firstRaw = NaN;
  private prevRaw = NaN;
  private dayOffset = 0;
  private count = 0;
  private skipped = 0;
  private ignoredLines = 0;
  private firstBad = -1;
  private firstBadCell = "";
  private badRows = 0;
  private lastGood = -1;
  private underRange = 0;
  private readonly ambiguous = new AmbiguousCells();
  /** On the fast path, a row showed that the quotes carry something: read the file again the quote-aware way. */
  notPlain = false;

  constructor(
    private readonly choice: ColumnChoice,
    private readonly spec: TimeSpec,
    private readonly decimalComma: boolean,
    private readonly firstLine: number,
    private readonly fieldCount: number,
    private readonly numbers: NumberSettings = { hint: null, pointMayGroup: false },
    /**
     * Cells arrive with their quotes on (papaparse's fast path, a plain split, on a file quoted cell by
     * cell): take them off, and stop (`notPlain`) at the first row that shows a quote carried something —
     * a delimiter or line break inside a cell gives a row of another length or a last cell not closed.
     */
    private readonly unwrap = false,
  ) {
    this.temperatureC = choice.temperatureIndex >= 0 ? [] : null;
    this.factor = choice.unit ? micronsPerUnit(choice.unit) : NaN;
    this.firstUnit = choice.unit;
    this.unitsSeen = choice.unit ? 1 : 0;
  }

  /**
   * Take the next rows, in file order (throws LogError on a unit cell that is unknown or a gauge
   * unit). The loop works on local copies of the running state, written back at the end.
   */
  addRows(rows: string[][]): void {
    const { timeIndex, dateIndex, pressureIndex, unitIndex, temperatureIndex, temperatureFahrenheit } = this.choice;
    const { rawSeconds, microns, temperatureC, overRangeRaw, dashRaw, dashBefore, decimalComma, fieldCount, firstLine, ambiguous } = this;
    const pointMayGroup = this.numbers.pointMayGroup;
    const parse = this.spec.parse;
    const rollover = this.spec.rollover;
    const base = this.index; // row index (0 = header) of rows[0]
    let k = 0;
    const unwrap = this.unwrap;
    if (base === 0 && rows.length > 0) {
      if (unwrap && !plainQuotedRow(rows[0], fieldCount)) {
        this.notPlain = true;
        return;
      }
      this.header = unwrap ? rows[0].map((c) => unquote(c) ?? "") : rows[0];
      k = 1;
    }
    const header = this.header;
    let { factor, firstUnit, lastUnitCell, unitsSeen, firstRaw, prevRaw, dayOffset, count, skipped, ignoredLines, firstBad, badRows, lastGood, underRange } = this;

    for (; k < rows.length; k++) {
      const row = rows[k];
      const i = base + k;
      if (unwrap && !plainQuotedRow(row, fieldCount)) {
        this.notPlain = true;
        return;
      }
      if (row.length === 1 && fieldCount > 1) {
        if (row[0].trim().length > 0) ignoredLines++;
        continue;
      }
      const timeCell = unwrap ? unquote(row[timeIndex]) : row[timeIndex];
      if (timeCell === undefined || (timeCell.length === 0 && (dateIndex < 0 || row[dateIndex] === ""))) {
        // A row with no time at all cannot be placed; count it as read and skipped.
        if (row.join("").trim().length === 0) continue;
        count++;
        skipped++;
        continue;
      }
      const dateCell = dateIndex >= 0 ? (unwrap ? unquote(row[dateIndex]) : row[dateIndex]) ?? "" : "";
      let t = parse(timeCell, dateCell);
      if (t !== t) {
        const trimmed = timeCell.trim();
        if (trimmed !== timeCell) t = parse(trimmed, dateCell.trim());
        if (t !== t) {
          // The header again (logs joined from two exports): not data.
          if (trimmed === (header[timeIndex] ?? "").trim()) {
            ignoredLines++;
            continue;
          }
          if (firstBad < 0) {
            firstBad = i;
            this.firstBadCell = timeCell;
          }
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
        const unitCell = (unwrap ? unquote(row[unitIndex]) : row[unitIndex]) ?? "";
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

      const cell = unwrap ? unquote(row[pressureIndex]) : row[pressureIndex];
      const v = cell === undefined ? NaN : readWatched(cell, ambiguous, pointMayGroup);
      if (v === v && v >= 0 && factor === factor) {
        if (ambiguous.last) ambiguous.note(microns.length, cell as string);
        rawSeconds.push(t);
        microns.push(v * factor);
        if (temperatureC !== null) {
          const tc = parseReading((unwrap ? unquote(row[temperatureIndex]) : row[temperatureIndex]) ?? "", decimalComma);
          temperatureC.push(temperatureFahrenheit ? ((tc - 32) * 5) / 9 : tc);
        }
      } else {
        skipped++;
        const kind = cell === undefined ? "blank" : classifyNonNumber(cell);
        if (kind === "over_range") overRangeRaw.push(t);
        else if (kind === "dashes" || kind === "blank") { dashRaw.push(t); dashBefore.push(microns.length); }
        else if (kind === "under_range") underRange++;
      }
    }
    this.index = base + rows.length;
    this.factor = factor;
    this.firstUnit = firstUnit;
    this.lastUnitCell = lastUnitCell;
    this.unitsSeen = unitsSeen;
    this.firstRaw = firstRaw;
    this.prevRaw = prevRaw;
    this.dayOffset = dayOffset;
    this.count = count;
    this.skipped = skipped;
    this.ignoredLines = ignoredLines;
    this.firstBad = firstBad;
    this.badRows = badRows;
    this.lastGood = lastGood;
    this.underRange = underRange;
  }

  /** What was read, or the first row whose time is not a time (unless those rows are a footer or a few garbled rows). */
  finish(): RowsResult {
    const { microns, overRangeRaw, dashRaw, dashBefore, firstBad, badRows } = this;
    let footerRows = 0;
    let badTimeRows = 0;
    if (firstBad >= 0) {
      if (this.lastGood < firstBad && badRows <= MAX_FOOTER_ROWS) footerRows = badRows;
      else if (badRows <= Math.max(MAX_BAD_TIME_ROWS, MAX_BAD_TIME_SHARE * this.count)) badTimeRows = badRows;
      else return { ok: false, line: this.firstLine + firstBad, cell: this.firstBadCell };
    }
    const grouping = this.settleNumbers();

    // dashes and blanks: over range when the reading before them (the first reading when none is) is near the gauge's top
    let top = 0;
    for (let i = 0; i < microns.length; i++) if (microns[i] > top) top = microns[i];
    const threshold = Math.max(DASH_OVER_RANGE_MICRONS, DASH_SHARE_OF_TOP * top);
    for (let k = 0; k < dashRaw.length; k++) {
      const before = dashBefore[k];
      const near = before > 0 ? microns[before - 1] : microns.length > 0 ? microns[0] : NaN;
      if (near >= threshold) overRangeRaw.push(dashRaw[k]);
    }

    return {
      ok: true,
      read: {
        rawSeconds: this.rawSeconds,
        microns,
        temperatureC: this.temperatureC,
        overRangeRaw,
        firstRaw: this.firstRaw,
        rows: this.count,
        skipped: this.skipped,
        ignoredLines: this.ignoredLines,
        footerRows,
        unit: this.firstUnit ?? "micron",
        unitsSeen: this.unitsSeen,
        underRange: this.underRange,
        badTimeRows,
        firstBadTime: badTimeRows > 0 ? { line: this.firstLine + firstBad, cell: this.firstBadCell } : null,
        grouping,
      },
    };
  }

  /** Settle an ambiguous "4,150" for the whole pressure column (grouping.ts), or as the caller said. */
  private settleNumbers(): GroupingDecision | null {
    const { ambiguous, numbers } = this;
    if (ambiguous.index.length === 0) return null;
    const unitWord = UNIT_WORDS[this.firstUnit ?? "micron"];
    const forced = numbers.decimalMark;
    if (forced) {
      // "point": a comma groups thousands; "comma": a point does
      const large = (forced === "point") === (ambiguous.mark === ",");
      const d = settleGrouping(this.microns, ambiguous, null, unitWord, large);
      return d && { ...d, why: `'${ambiguous.example}' read with ${forced === "point" ? "a decimal point (a comma groups thousands)" : "a decimal comma (a point groups thousands)"}, as asked` };
    }
    return settleGrouping(this.microns, ambiguous, numbers.hint, unitWord);
  }
}

/**
 * A row of a quoted-cell file split plainly that a quote-aware parse would give the same: as many cells
 * as the header, each opening and closing with a quote and holding none (a blank line is fine).
 */
function plainQuotedRow(row: string[], fieldCount: number): boolean {
  if (row.length === 1 && row[0].length === 0) return true;
  if (row.length !== fieldCount) return false;
  for (let j = 0; j < row.length; j++) {
    const c = row[j];
    const n = c.length;
    if (n < 2 || c.charCodeAt(0) !== 34 || c.charCodeAt(n - 1) !== 34 || c.indexOf('"', 1) !== n - 1) return false;
  }
  return true;
}

/** A cell without its surrounding quotes ('"4,150"' → "4,150"); undefined stays undefined. */
function unquote(cell: string | undefined): string | undefined {
  return cell !== undefined && cell.length >= 2 && cell.charCodeAt(0) === 34 ? cell.slice(1, -1) : cell;
}

function lineError(e: LogError, line: number): LogError {
  return new LogError(e.code, `line ${line}: ${e.message}`, { line, column: e.column ?? undefined });
}
