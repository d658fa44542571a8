/**
 * The decimal convention of a log (decimal point or decimal comma), decided once per FILE from
 * the sample cells, never per cell: "33,199" must mean the same in every row of a file.
 *
 * Rule (each number-like cell is looked at with any sign and a leading '>' or '<' removed, so
 * over-range markers such as ">3,3331" count as evidence too):
 *
 *  - Proof of a decimal comma: one comma followed by other than three digits ("25,2", "0,47375",
 *    "3239,7"), or point-grouped thousands with a comma after them ("1.234,5"), or two or more
 *    point groups ("1.234.567").
 *  - Proof of a decimal point: comma-grouped thousands with a point after them ("1,234.5"), or
 *    two or more comma groups ("1,234,567").
 *  - Only one kind of proof: that convention. Both kinds (a mixed file): the more frequent one,
 *    the decimal comma on a tie.
 *  - No proof, but cells like "33,199" (a comma and exactly three digits, ambiguous):
 *      · semicolon-delimited: decimal comma (the semicolon is the delimiter of decimal-comma
 *        locales, precisely because the comma is taken);
 *      · comma-delimited (the comma can only be inside quotes): thousands separator;
 *      · tab or pipe: decimal comma unless some cell has a decimal point ("21.5"), in which case
 *        the comma is a thousands separator.
 *  - Nothing with a comma: decimal point.
 *
 * In a decimal-comma file a cell with only a point is still read with a decimal point (see
 * parseReading): exporters often leave some columns unlocalised.
 */

/** Counts of the evidence found in some cells. */
export interface DecimalEvidence {
  commaProof: number;
  pointProof: number;
  /** "33,199": a comma and exactly three digits, nothing else. */
  ambiguousComma: number;
  /** "21.5", "0.0167": a plain decimal point. */
  pointCells: number;
}

export function emptyEvidence(): DecimalEvidence {
  return { commaProof: 0, pointProof: 0, ambiguousComma: 0, pointCells: 0 };
}

const COMMA_DECIMAL = /^\d+,(\d{1,2}|\d{4,})$/;
const POINT_GROUPS_COMMA = /^\d{1,3}(\.\d{3})+,\d*$/;
const POINT_GROUPS_ONLY = /^\d{1,3}(\.\d{3}){2,}$/;
const COMMA_GROUPS_POINT = /^\d{1,3}(,\d{3})+\.\d*$/;
const COMMA_GROUPS_ONLY = /^\d{1,3}(,\d{3}){2,}$/;
const AMBIGUOUS_COMMA = /^\d+,\d{3}$/;
const POINT_DECIMAL = /^\d*\.\d+$/;

/** Add the evidence of one cell (cheap: cells without a digit after their first character are skipped fast). */
export function addEvidence(ev: DecimalEvidence, cell: string): void {
  let s = cell.trim();
  if (s.length < 2) return;
  let c = s.charCodeAt(0);
  if (c === 62 /* > */ || c === 60 /* < */ || c === 43 /* + */ || c === 45 /* - */) {
    s = s.slice(1).trimStart();
    if (s.length < 2) return;
    c = s.charCodeAt(0);
  }
  if (!((c >= 48 && c <= 57) || c === 46)) return;
  const comma = s.indexOf(",");
  const point = s.indexOf(".");
  if (comma === -1) {
    if (point === -1) return;
    if (POINT_GROUPS_ONLY.test(s)) ev.commaProof++;
    else if (POINT_DECIMAL.test(s)) ev.pointCells++;
    return;
  }
  if (point === -1) {
    if (COMMA_DECIMAL.test(s)) ev.commaProof++;
    else if (AMBIGUOUS_COMMA.test(s)) ev.ambiguousComma++;
    else if (COMMA_GROUPS_ONLY.test(s)) ev.pointProof++;
    return;
  }
  if (point < comma) {
    if (POINT_GROUPS_COMMA.test(s)) ev.commaProof++;
  } else if (COMMA_GROUPS_POINT.test(s)) ev.pointProof++;
}

/** True when the evidence holds a proof either way (no need to look at more cells). */
export function hasProof(ev: DecimalEvidence): boolean {
  return ev.commaProof > 0 || ev.pointProof > 0;
}

/** The file's convention from its evidence and delimiter (see the rule at the top of this file). */
export function decideDecimalComma(ev: DecimalEvidence, delimiter: string): boolean {
  if (ev.commaProof > 0 || ev.pointProof > 0) return ev.commaProof >= ev.pointProof;
  if (ev.ambiguousComma === 0) return false;
  if (delimiter === ";") return true;
  if (delimiter === ",") return false;
  return ev.pointCells === 0;
}

/** The decimal mark the file's other cells and separators point to, with why (see grouping.ts, rule 4). */
export interface FileDecimalHint {
  decimal: "," | ".";
  why: string;
}

const EU_DATE = /^\d{1,2}\.\d{1,2}\.\d{2,4}\b/;
const US_DATE = /^\d{1,2}\/\d{1,2}\/\d{4}\b/;
const MERIDIEM = /\d\s*[AaPp]\.?[Mm]\.?\s*$/;

/**
 * Which decimal mark the file leans to, from the sample's evidence, its delimiter and how it writes
 * dates: proof in any cell first, then the delimiter (a comma delimiter leaves the comma no room as a
 * decimal mark; semicolons are the delimiter of decimal-comma locales), then day.month.year dates
 * (decimal comma) or month/day/year with AM/PM (decimal point), then plain point decimals. Null when
 * nothing leans either way. Common practice, no published source.
 */
export function fileDecimalHint(ev: DecimalEvidence, delimiter: string, rows: string[][]): FileDecimalHint | null {
  if (ev.commaProof > ev.pointProof) return { decimal: ",", why: "other cells of the file write decimals with a comma" };
  if (ev.pointProof > ev.commaProof) return { decimal: ".", why: "other cells of the file group thousands with a comma" };
  if (delimiter === ",") return { decimal: ".", why: "the comma separates the columns, so it is not the decimal mark" };
  let eu = 0;
  let us = 0;
  for (const row of rows)
    for (const cell of row) {
      const c = cell.trim();
      if (EU_DATE.test(c)) eu++;
      else if (US_DATE.test(c) || MERIDIEM.test(c)) us++;
    }
  if (delimiter === ";" && us === 0) return { decimal: ",", why: "the columns are separated by semicolons, as decimal-comma exports do" };
  if (eu > 0 && us === 0) return { decimal: ",", why: "the dates are written day.month.year, as decimal-comma exports do" };
  if (us > 0 && eu === 0) return { decimal: ".", why: "the dates are written month/day/year or with AM/PM, as decimal-point exports do" };
  if (ev.pointCells > 0) return { decimal: ".", why: "other cells of the file write decimals with a point" };
  return null;
}
