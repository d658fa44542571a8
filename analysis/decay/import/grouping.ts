/**
 * Thousands separator or decimal mark, decided for the whole pressure column after it has been read,
 * never per cell. A cell such as "4,150" (or "12.500" in a decimal-comma export) is ambiguous: 4,150
 * or 4.15. Misreading it changes the value 1,000-fold, and reading a wet system's 4,150 microns as 4.15
 * would pass it, so the choice is made from the whole column:
 *
 *  1. proof in the column itself: a separator followed by other than three digits ("0,58", "12.5"), a
 *     leading zero ("0,535"), four digits before it ("1234,567"): a decimal mark; several groups
 *     ("1,234,567") or groups before the other mark ("1,234.5"): a thousands separator;
 *  2. continuity of the curve: a gauge reading does not change 100-fold between two successive
 *     readings, so the reading under which fewer such jumps appear wins ("998" beside "1,010" is a
 *     1,000-fold fall if the comma is decimal, none if it groups thousands);
 *  3. physics: a reading above 1.1 atmospheres (825,000 microns), a log that never comes below 30,000
 *     microns, or a median below 5 microns (deeper than HVAC pumps reach) is not a vacuum-decay log;
 *  4. the file's other separators (sniffed from the first lines, see decimal.ts): a comma delimiter,
 *     US dates or point decimals elsewhere say the comma groups thousands.
 * Where none of these decides, the larger reading is taken and the import is marked unsure with the
 * reason: a larger reading can fail a tight system but never pass a leaking or wet one.
 * Thresholds: common practice, no published source.
 */
import { median } from "simple-statistics";
import { groupedInteger } from "../../shared/format";
import type { UnsureReason } from "../types";
import type { FileDecimalHint } from "./decimal";

/** A successive-reading ratio above this is a jump no gauge curve makes (a 1,000-fold misread is far above it). */
const JUMP_RATIO = 100;
/** 1.1 atm in microns: no absolute vacuum reading lies above it. */
const MAX_PLAUSIBLE_MICRONS = 825_000;
/** A vacuum-decay log comes below this somewhere (the top of a typical micron gauge's range is 25,000). */
const VACUUM_REACHED_MICRONS = 30_000;
/** Median readings below this are deeper than HVAC vacuum pumps reach. */
const DEEPEST_MEDIAN_MICRONS = 5;

/** The decimal mark the file's other cells and separators lean to (decimal.ts), or null. */
export type SeparatorHint = FileDecimalHint | null;

/** Ambiguous cells seen while reading, and the proof either way found in the column. */
export class AmbiguousCells {
  /** Reading indices (into the microns read so far) of ambiguous cells, ascending; each was read as its thousands reading. */
  readonly index: number[] = [];
  /** The first ambiguous cell as written, its digits as an integer, and its mark ("," or "."), for the message. */
  example = "";
  exampleDigits = 0;
  mark = "";
  /** Set by readWatched: the cell just read was ambiguous (its mark in `lastMark`). */
  last = false;
  lastMark = "";
  /** Cells that prove a mark's role: a comma or point as the decimal mark, or grouping thousands. */
  commaDecimal = 0;
  commaGroups = 0;
  pointDecimal = 0;
  pointGroups = 0;

  note(readingIndex: number, cell: string): void {
    if (this.index.length === 0) {
      this.example = cell.trim();
      this.mark = this.lastMark;
      this.exampleDigits = Number(this.example.replace(/[,.+]/g, ""));
    }
    this.index.push(readingIndex);
  }

  /** Proof that the ambiguous mark groups thousands (large) or is the decimal mark (small). */
  proofs(): { large: number; small: number } {
    return this.mark === "."
      ? { large: this.pointGroups + this.commaDecimal, small: this.pointDecimal + this.commaGroups }
      : { large: this.commaGroups + this.pointDecimal, small: this.commaDecimal + this.pointGroups };
  }
}

/**
 * The thousands reading of a cell written d[d[d]] mark ddd ("4,150", "12.500"), with the mark at
 * `markAt`, or NaN when the cell is not in that form (no regular expression: this runs on every reading).
 */
function groupedOne(s: string, markAt: number): number {
  const n = s.length;
  if (n - markAt !== 4) return NaN;
  let start = 0;
  if (s.charCodeAt(0) === 43) start = 1; // '+'
  const lead = markAt - start;
  if (lead < 1 || lead > 3) return NaN;
  let v = 0;
  for (let i = start; i < n; i++) {
    if (i === markAt) continue;
    const d = s.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return NaN;
    v = v * 10 + d;
  }
  return v;
}

const COMMA_GROUPS = /^[+]?\d{1,3}(,\d{3})+(\.\d+)?$/;
const POINT_GROUPS = /^[+]?\d{1,3}(\.\d{3})+(,\d+)?$/;
const SPACE_GROUPS = /^[+]?\d{1,3}([ \u00a0\u202f']\d{3})+$/;

/**
 * Read a pressure cell while the column's convention is open. Unambiguous cells are read by their
 * only meaning (and counted as proof); an ambiguous one ("4,150", and "12.500" when `pointMayGroup`)
 * is read as its thousands reading and flagged in `ev.last` (settleGrouping divides it by 1,000 if the
 * column says so). Returns NaN for a cell that is no number.
 */
export function readWatched(cell: string, ev: AmbiguousCells, pointMayGroup: boolean): number {
  ev.last = false;
  let s = cell;
  const n = s.length;
  if (n === 0) return NaN;
  const c0 = s.charCodeAt(0);
  const cl = s.charCodeAt(n - 1);
  if (c0 === 32 || cl === 32 || c0 === 9 || cl === 9) s = s.trim();
  const comma = s.indexOf(",");
  const point = s.indexOf(".");
  if (comma === -1) {
    if (point === -1) return SPACE_GROUPS.test(s) ? Number(s.replace(/[ \u00a0\u202f']/g, "")) : plain(s);
    if (!pointMayGroup || s.length < 5 || s.charCodeAt(s.length - 4) !== 46) {
      if (s.indexOf(".", point + 1) !== -1 && POINT_GROUPS.test(s)) { ev.pointGroups++; return plain(s.split(".").join("")); }
      const v = plain(s);
      if (v === v) ev.pointDecimal++;
      return v;
    }
  }
  const mark = comma !== -1 ? comma : point;
  if ((comma === -1 || point === -1) && s.indexOf(comma !== -1 ? "," : ".", mark + 1) === -1) {
    const digits = groupedOne(s, mark);
    if (digits === digits) {
      if (mark === (s.charCodeAt(0) === 43 ? 2 : 1) && s.charCodeAt(mark - 1) === 48) {
        // "0,535": no thousands group starts with a zero
        if (comma !== -1) ev.commaDecimal++;
        else ev.pointDecimal++;
        return digits / 1000;
      }
      ev.last = true;
      ev.lastMark = comma !== -1 ? "," : ".";
      return digits;
    }
  }
  if (point === -1) {
    const v = decimalCommaNumber(s, comma);
    if (v === v) { ev.commaDecimal++; return v; }
    if (COMMA_GROUPS.test(s)) { ev.commaGroups++; return plain(s.split(",").join("")); }
    return NaN;
  }
  if (comma === -1) {
    if (POINT_GROUPS.test(s)) { ev.pointGroups++; return plain(s.split(".").join("")); }
    const v = plain(s);
    if (v === v) ev.pointDecimal++;
    return v;
  }
  // both marks: the later one is the decimal mark
  if (point > comma && COMMA_GROUPS.test(s)) { ev.commaGroups++; ev.pointDecimal++; return plain(s.split(",").join("")); }
  if (comma > point && POINT_GROUPS.test(s)) { ev.pointGroups++; ev.commaDecimal++; return plain(s.split(".").join("").replace(",", ".")); }
  return NaN;
}

/**
 * "0,5933" (digits, one comma at `comma`, digits) read without building a new string: the digits as one
 * integer over a power of ten, which is the correctly rounded value while the integer is below 2^53 (the
 * same value Number("0.5933") gives). NaN when the cell is not in that form or too long to be exact.
 */
function decimalCommaNumber(s: string, comma: number): number {
  const n = s.length;
  if (comma === n - 1 || n > 16) return NaN;
  let start = 0;
  let sign = 1;
  const c0 = s.charCodeAt(0);
  if (c0 === 45 || c0 === 43) {
    start = 1;
    if (c0 === 45) sign = -1;
  }
  let v = 0;
  for (let i = start; i < n; i++) {
    if (i === comma) continue;
    const d = s.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return NaN;
    v = v * 10 + d;
  }
  return (sign * v) / POWERS_OF_TEN[n - 1 - comma];
}

const POWERS_OF_TEN = [1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16];

function plain(s: string): number {
  if (s.length === 0) return NaN;
  const c = s.charCodeAt(0);
  if (!((c >= 48 && c <= 57) || c === 45 || c === 43 || c === 46)) return NaN;
  const last = s.charCodeAt(s.length - 1);
  if (!((last >= 48 && last <= 57) || last === 46)) return NaN;
  if (s.length > 1 && (s.charCodeAt(1) === 120 || s.charCodeAt(1) === 88)) return NaN;
  const v = Number(s);
  return v === v && v !== Infinity && v !== -Infinity ? v : NaN;
}

export interface GroupingDecision {
  /** The ambiguous mark, "," or ".". */
  mark: string;
  /** The ambiguous mark groups thousands ("4,150" = 4150). */
  large: boolean;
  unsure: UnsureReason | null;
  /** How it was decided, in words, for the import's assumptions. */
  why: string;
}

/** An ambiguous reading (microns, read as its thousands reading) with its mark grouping thousands or not. */
function valueOf(largeMicrons: number, large: boolean): number {
  return large ? largeMicrons : largeMicrons / 1000;
}

/**
 * Successive-reading jumps (ratio above JUMP_RATIO) with the ambiguous readings read large, and read
 * small. Only pairs of one ambiguous and one plain reading can differ between the two readings of the
 * column (two ambiguous ones, or two plain ones, keep their ratio either way), so only those are looked
 * at: O(ambiguous cells), not O(readings).
 */
function jumps(microns: number[], ev: AmbiguousCells): { large: number; small: number } {
  let large = 0;
  let small = 0;
  const idx = ev.index;
  const m = idx.length;
  const count = (plainValue: number, ambiguousLarge: number) => {
    if (!(plainValue > 0 && ambiguousLarge > 0)) return;
    const small1 = ambiguousLarge / 1000;
    if ((ambiguousLarge > plainValue ? ambiguousLarge / plainValue : plainValue / ambiguousLarge) > JUMP_RATIO) large++;
    if ((small1 > plainValue ? small1 / plainValue : plainValue / small1) > JUMP_RATIO) small++;
  };
  for (let k = 0; k < m; k++) {
    const i = idx[k];
    if (i > 0 && (k === 0 || idx[k - 1] !== i - 1)) count(microns[i - 1], microns[i]);
    if (i + 1 < microns.length && (k + 1 === m || idx[k + 1] !== i + 1)) count(microns[i + 1], microns[i]);
  }
  return { large, small };
}

/** Whether the readings, with the ambiguous ones read large (or small), look like a vacuum-decay log (rule 3). */
function plausible(microns: number[], ev: AmbiguousCells, large: boolean): boolean {
  const n = microns.length;
  if (n === 0) return true;
  let min = Infinity;
  let max = -Infinity;
  const stride = Math.max(1, Math.floor(n / 4001));
  const sample: number[] = [];
  let k = 0;
  for (let i = 0; i < n; i++) {
    let v = microns[i];
    if (k < ev.index.length && ev.index[k] === i) {
      v = valueOf(v, large);
      k++;
    }
    if (!(v > 0)) continue;
    if (v < min) min = v;
    if (v > max) max = v;
    if (i % stride === 0) sample.push(v);
  }
  const middle = sample.length ? median(sample) : NaN;
  return max <= MAX_PLAUSIBLE_MICRONS && min <= VACUUM_REACHED_MICRONS && !(middle < DEEPEST_MEDIAN_MICRONS);
}

/**
 * Decide the column (rules at the top of this file) and write the ambiguous readings (microns) in
 * place as decided. `unitWord` names the cells' unit in messages. Null when no cell was ambiguous.
 */
export function settleGrouping(microns: number[], ev: AmbiguousCells, hint: SeparatorHint, unitWord: string, forced?: boolean): GroupingDecision | null {
  if (ev.index.length === 0) return null;
  if (forced !== undefined) {
    if (!forced) for (let k = 0; k < ev.index.length; k++) microns[ev.index[k]] /= 1000;
    return { mark: ev.mark, large: forced, unsure: null, why: "as asked" };
  }
  const asLarge = groupedInteger(ev.exampleDigits);
  const asSmall = String(ev.exampleDigits / 1000);
  const both = `'${ev.example}' is ${asLarge} or ${asSmall} ${unitWord}`;
  const because = (large: boolean, why: string): GroupingDecision => ({ mark: ev.mark, large, unsure: null, why: `${both}: read as ${large ? asLarge : asSmall}, because ${why}` });
  let d: GroupingDecision;
  const proof = ev.proofs();
  const j = proof.large > 0 || proof.small > 0 ? null : jumps(microns, ev);
  if (!j) {
    const large = proof.large > proof.small;
    d = because(large, large ? "other cells of the column group thousands" : `other cells of the column use '${ev.mark}' as the decimal mark`);
  } else if (j.large !== j.small && Math.min(j.large, j.small) * 3 < Math.max(j.large, j.small)) {
    const large = j.large < j.small;
    d = because(large, `read the other way the curve would jump 1,000-fold between successive readings (${Math.max(j.large, j.small)} times)`);
  } else {
    const okLarge = plausible(microns, ev, true);
    const okSmall = plausible(microns, ev, false);
    if (okLarge !== okSmall) d = because(okLarge, "read the other way the readings could not come from a vacuum-decay log");
    else if (hint && hint.decimal !== ev.mark) d = because(true, hint.why);
    else {
      const message = `${both}: nothing in the file tells which; read as ${asLarge} (the larger reading cannot pass a leaking or wet system by mistake). Confirm how the readings are written.`;
      // "point" makes a comma group thousands; "comma" makes a comma the decimal mark (and a point group thousands)
      const largeMark = ev.mark === "," ? "point" : "comma";
      const smallMark = ev.mark === "," ? "comma" : "point";
      const choices = [
        { decimalMark: largeMark, cell: ev.example, reads: `${asLarge} ${unitWord}` },
        { decimalMark: smallMark, cell: ev.example, reads: `${asSmall} ${unitWord}` },
      ] as NonNullable<UnsureReason["choices"]>;
      d = { mark: ev.mark, large: true, unsure: { code: "decimal_mark", message, choices }, why: message };
    }
  }
  if (!d.large) for (let k = 0; k < ev.index.length; k++) microns[ev.index[k]] /= 1000;
  return d;
}
