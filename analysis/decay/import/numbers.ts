/**
 * Reading number cells: a fast path for plain decimals, a slow path for decimal commas,
 * thousands separators and stray spaces, and recognising the markers gauges write when a
 * reading is missing or out of range.
 */

/** What a pressure cell holds when it is not a number. */
export type CellKind =
  | "blank"
  /** An explicit over-range marker: ">25000", "OR", "OL", "HI", "over range", … */
  | "over_range"
  /** Dashes only ("-", "---"): no reading; over-range or not is decided from the neighbours. */
  | "dashes"
  /** Below the gauge's range: "<20", "UR", "LO". */
  | "under_range"
  /** Anything else ("Err", "n/a", text). */
  | "other";

const OVER_RANGE_WORDS = new Set([
  "or", "o.r.", "o/r", "ol", "+ol", "o.l.", "over", "overrange", "over range", "over-range",
  "hi", "high", "atm", "ovr", "+++", "oor", "out of range", "range",
]);

/**
 * Parse a decimal number cell. Fast path: `Number()` after checking the first character,
 * so "0x1f", "Infinity" and "" are refused. Returns NaN when the cell is not a plain number.
 */
export function parsePlainNumber(cell: string): number {
  const n = cell.length;
  if (n === 0) return NaN;
  const c = cell.charCodeAt(0);
  // digit, '-', '+', '.'
  if (!((c >= 48 && c <= 57) || c === 45 || c === 43 || c === 46 || c === 32)) return NaN;
  const last = cell.charCodeAt(n - 1);
  if (!((last >= 48 && last <= 57) || last === 46 || last === 32)) return NaN;
  if (n > 1 && (cell.charCodeAt(1) === 120 || cell.charCodeAt(1) === 88)) return NaN; // 0x…
  const v = Number(cell);
  return v === v && v !== Infinity && v !== -Infinity ? v : NaN;
}

/**
 * Parse a reading that may use a decimal comma ("25,20"), thousands separators ("1,234" in a
 * decimal-point file, "1.234,5" in a decimal-comma file) or surrounding spaces/quotes.
 * In a decimal-comma file a cell with only a point is still read as a decimal point (exporters
 * often leave some columns unlocalised).
 */
export function parseReading(cell: string, decimalComma: boolean): number {
  if (!decimalComma) {
    const fast = parsePlainNumber(cell);
    if (fast === fast) return fast;
  } else if (cell.indexOf(",") === -1) {
    const fast = parsePlainNumber(cell);
    if (fast === fast) return fast;
  }
  return parseReadingSlow(cell, decimalComma);
}

function parseReadingSlow(cell: string, decimalComma: boolean): number {
  let s = cell.trim();
  if (s.length === 0) return NaN;
  if (decimalComma) {
    const point = s.indexOf(".");
    // Points are thousands groups when a comma follows or when there are several ("1.234.567").
    if (point !== -1 && (s.indexOf(",") !== -1 || s.indexOf(".", point + 1) !== -1)) s = s.split(".").join("");
    s = s.replace(",", ".");
    return parsePlainNumber(s);
  }
  // Thousands separators: 1,234 or 12,345.6 (groups of exactly three digits).
  if (/^[+-]?\d{1,3}(,\d{3})+(\.\d*)?$/.test(s)) return parsePlainNumber(s.split(",").join(""));
  return parsePlainNumber(s);
}

/** Classify a pressure cell that did not parse as a number. */
export function classifyNonNumber(cell: string): CellKind {
  const s = cell.trim();
  if (s.length === 0) return "blank";
  const c = s.charCodeAt(0);
  if (c === 62 /* > */) return "over_range";
  if (c === 60 /* < */) return "under_range";
  if (/^[-–—]+$/.test(s)) return "dashes";
  const lower = s.toLowerCase();
  if (OVER_RANGE_WORDS.has(lower)) return "over_range";
  if (lower === "ur" || lower === "lo" || lower === "low" || lower === "under" || lower === "underrange" || lower === "under range" || lower === "-ol") return "under_range";
  if (/^(over|hi|high)\b/.test(lower) || /\bover[- ]?range\b/.test(lower)) return "over_range";
  return "other";
}
