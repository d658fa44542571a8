/**
 * Sniffing the layout of a log from its first lines: line ending, delimiter, where the header
 * row is (after any free-text preamble), a sample of data rows, and whether numbers use a
 * decimal comma. The whole file is parsed once, later, with what is decided here.
 *
 * The sample is the first SAMPLE_ROWS data rows, and, when some of those are gauge markers
 * (">25000", "OR", "---": a log that starts above the gauge's range), the rows with readings
 * that follow, until SAMPLE_ROWS such rows are in hand or MAX_SAMPLE_SCAN_LINES lines after the
 * header have been looked at. Columns, units and the decimal convention are judged from it.
 */
import { LogError } from "../../shared/errors";
import { parsePressureUnit } from "../../shared/units";
import { addEvidence, decideDecimalComma, emptyEvidence, fileDecimalHint, type FileDecimalHint } from "./decimal";
import { classifyNonNumber } from "./numbers";

/** Lines looked at to find the header (preamble included). */
const HEADER_SEARCH_LINES = 100;
/** Data rows after the header used to decide columns, units and time format. */
export const SAMPLE_ROWS = 50;
/**
 * Lines after the header looked at, at most, to find SAMPLE_ROWS rows free of gauge markers and blank
 * cells: a gauge over range may write markers or nothing for the first hours (7,200 lines at 1 Hz is two).
 */
export const MAX_SAMPLE_SCAN_LINES = 20000;
/** Lines read at a time past the first window when the sample must look further. */
const SCAN_CHUNK_LINES = 512;

const DELIMITERS = ["\t", ";", ",", "|"] as const;

export interface Layout {
  newline: "\r\n" | "\n" | "\r";
  delimiter: string;
  /** 0-based line index of the header row. */
  headerLine: number;
  /** Character offset of the header row in the text (BOM already removed). */
  headerOffset: number;
  header: string[];
  /**
   * Non-blank data rows after the header, split into cells: the first SAMPLE_ROWS, then (when
   * those hold gauge markers) up to SAMPLE_ROWS more rows free of markers, in file order.
   */
  sampleRows: string[][];
  /** 1-based file line of each sample row. */
  sampleLines: number[];
  decimalComma: boolean;
  /** The decimal mark the file's other cells and separators lean to, for the pressure column's own decision (grouping.ts). */
  decimalHint: FileDecimalHint | null;
  /** The header row is a row of units under a row of names; `header` holds both ("Pressure (mTorr)"). */
  unitsRow: boolean;
}

export function detectNewline(text: string): Layout["newline"] {
  const lf = text.indexOf("\n");
  const cr = text.indexOf("\r");
  if (cr === -1) return "\n";
  if (lf === -1) return "\r";
  if (cr < lf) return cr + 1 === lf ? "\r\n" : "\r";
  return "\n";
}

/**
 * Up to `maxLines` lines from offset `from`, appended to `lines` / `offsets`. Returns the offset
 * of the next unread line, or -1 when the text is exhausted.
 */
function readLines(text: string, newline: string, from: number, maxLines: number, lines: string[], offsets: number[]): number {
  let start = from;
  for (let k = 0; k < maxLines; k++) {
    let end = text.indexOf(newline, start);
    if (end === -1) end = text.length;
    let line = text.slice(start, end);
    // A stray line ending of another kind inside a line is dropped for sniffing.
    if (line.endsWith("\r")) line = line.slice(0, -1);
    lines.push(line);
    offsets.push(start);
    if (end === text.length) return -1;
    start = end + newline.length;
  }
  return start;
}

/** The last cell found to be a marker: runs of marker rows repeat the same text. */
let lastMarker = "";

/** A cell that is a gauge marker in place of a reading (">25000", "OR", "---", "<20"). */
function isMarkerCell(cell: string): boolean {
  const n = cell.length;
  if (n === 0) return false;
  const c = cell.charCodeAt(0);
  if (c >= 48 && c <= 57) return false; // digit first: a number or a time
  if (cell === lastMarker) return true;
  const kind = classifyNonNumber(cell);
  const marker = kind === "over_range" || kind === "dashes" || kind === "under_range";
  if (marker) lastMarker = cell;
  return marker;
}

/** A data row none of whose cells is a gauge marker or blank (a gauge over range may write nothing). */
function isPlainRow(cells: string[]): boolean {
  for (const c of cells) if (c.length === 0 || isMarkerCell(c) || c.trim().length === 0) return false;
  return true;
}

/** Split one line on a delimiter, honouring double quotes ("a,b" is one cell; "" is a quote). */
export function splitLine(line: string, delimiter: string): string[] {
  if (line.indexOf('"') === -1) return line.split(delimiter);
  // every cell quoted, no quote or delimiter inside one ("00:10"<TAB>"4,150"): split and unwrap
  const simple = line.split(delimiter);
  let plainQuoted = true;
  for (let k = 0; k < simple.length && plainQuoted; k++) {
    const c = simple[k];
    if (c.length < 2 || c.charCodeAt(0) !== 34 || c.charCodeAt(c.length - 1) !== 34 || c.indexOf('"', 1) !== c.length - 1) plainQuoted = false;
  }
  if (plainQuoted) {
    for (let k = 0; k < simple.length; k++) simple[k] = simple[k].slice(1, -1);
    return simple;
  }
  const cells: string[] = [];
  let cell = "";
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (quoted) {
      if (ch === '"') {
        if (line[i + 1] === '"') {
          cell += '"';
          i++;
        } else quoted = false;
      } else cell += ch;
    } else if (ch === '"') quoted = true;
    else if (line.startsWith(delimiter, i)) {
      cells.push(cell);
      cell = "";
      i += delimiter.length - 1;
    } else cell += ch;
  }
  cells.push(cell);
  return cells;
}

function startsLikeData(cell: string): boolean {
  const s = cell.trim();
  if (s.length === 0) return false;
  const c = s.charCodeAt(0);
  if (c >= 48 && c <= 57) return true;
  if ((c === 45 || c === 43 || c === 46 || c === 62 || c === 60) && s.length > 1) {
    const d = s.charCodeAt(1);
    return d >= 48 && d <= 57;
  }
  return false;
}

/** A row most of whose non-empty cells start like a number or a time. */
function looksLikeData(cells: string[]): boolean {
  let filled = 0;
  let numeric = 0;
  for (const c of cells) {
    if (c.trim().length === 0) continue;
    filled++;
    if (startsLikeData(c)) numeric++;
  }
  return filled > 0 && numeric * 2 >= filled;
}

/** A row of names: no cell starts like a number and at least one has a letter. */
function looksLikeHeader(cells: string[]): boolean {
  let letters = false;
  for (const c of cells) {
    if (startsLikeData(c)) return false;
    if (/[A-Za-zµμ°]/.test(c)) letters = true;
  }
  return letters;
}

function isBlank(line: string): boolean {
  return line.trim().length === 0;
}

/** The field count most lines share with this delimiter, and how many lines share it. */
function delimiterScore(lines: string[], delimiter: string): { fields: number; score: number } {
  const counts = new Map<number, number>();
  for (const line of lines) {
    if (isBlank(line)) continue;
    const n = splitLine(line, delimiter).length;
    counts.set(n, (counts.get(n) ?? 0) + 1);
  }
  let fields = 1;
  let score = 0;
  for (const [n, c] of counts) if (n >= 2 && (c > score || (c === score && n > fields))) { fields = n; score = c; }
  return { fields, score };
}

/** Decimal comma for the whole file, from every cell of the sample, and where the file leans (rules in decimal.ts). */
function detectDecimalComma(rows: string[][], delimiter: string): { decimalComma: boolean; decimalHint: FileDecimalHint | null } {
  const evidence = emptyEvidence();
  for (const row of rows) for (const cell of row) addEvidence(evidence, cell);
  return { decimalComma: decideDecimalComma(evidence, delimiter), decimalHint: fileDecimalHint(evidence, delimiter, rows) };
}

/**
 * Find delimiter, header row and sample rows from the first lines of the text (BOM removed).
 * Throws no_header when no row of column names precedes the data.
 */
export function sniffLayout(text: string): Layout {
  if (text.slice(0, 4096).indexOf("\u0000") !== -1)
    throw new LogError("no_header", "the file is not text (it holds binary data); export the log as CSV");
  const newline = detectNewline(text);
  const lines: string[] = [];
  const offsets: number[] = [];
  let nextOffset = readLines(text, newline, 0, HEADER_SEARCH_LINES + SAMPLE_ROWS, lines, offsets);
  const searchLines = lines.slice(0, HEADER_SEARCH_LINES);

  let delimiter: string = ",";
  let fields = 1;
  let best = -1;
  for (const d of DELIMITERS) {
    const { fields: n, score } = delimiterScore(lines, d);
    if (score > best) { best = score; delimiter = d; fields = n; }
  }
  if (best <= 0) { delimiter = ","; fields = 1; }

  const split = lines.map((l) => splitLine(l, delimiter));
  let headerLine = -1;
  for (let i = 0; i < searchLines.length; i++) {
    if (isBlank(lines[i])) continue;
    const cells = split[i];
    if (fields >= 2 && cells.length < 2) continue;
    if (looksLikeData(cells)) {
      if (headerLine === -1) {
        throw new LogError(
          "no_header",
          `line ${i + 1}: '${lines[i].slice(0, 60)}' holds data, but no row of column names comes before it (expected e.g. "time,microns")`,
          { line: i + 1 },
        );
      }
      break;
    }
    if (looksLikeHeader(cells)) {
      let next = i + 1;
      while (next < lines.length && isBlank(lines[next])) next++;
      if (next < lines.length ? looksLikeData(split[next]) : fields >= 2 && cells.length === fields) { headerLine = i; break; }
      if (fields >= 2 && cells.length === fields) headerLine = i; // keep the latest candidate
    }
  }
  if (headerLine === -1) {
    throw new LogError(
      "no_header",
      `no row of column names found in the first ${Math.min(lines.length, HEADER_SEARCH_LINES)} lines (expected e.g. "time,microns")`,
    );
  }

  // A row of units under the names ("Time,Pressure" then "s,mTorr"): fold the units into the names.
  let header = split[headerLine].map((h) => h.trim());
  let unitsRow = false;
  let names = headerLine - 1;
  while (names >= 0 && isBlank(lines[names])) names--;
  if (names >= 0 && split[names].length === header.length && looksLikeHeader(split[names]) && header.some((h) => parsePressureUnit(h) !== null) && header.every((h) => h.length <= 16)) {
    header = split[names].map((n, j) => (header[j].length > 0 ? `${n.trim()} (${header[j]})` : n.trim()));
    unitsRow = true;
  }

  const sampleRows: string[][] = [];
  const sampleLines: number[] = [];
  let plainRows = 0;
  const scanEnd = headerLine + 1 + MAX_SAMPLE_SCAN_LINES;
  for (let i = headerLine + 1; i < scanEnd; i++) {
    if (i >= lines.length) {
      if (nextOffset < 0) break;
      nextOffset = readLines(text, newline, nextOffset, SCAN_CHUNK_LINES, lines, offsets);
      if (i >= lines.length) break;
    }
    if (isBlank(lines[i])) continue;
    const cells = i < split.length ? split[i] : splitLine(lines[i], delimiter);
    const plain = isPlainRow(cells);
    if (plain) plainRows++;
    if (sampleRows.length < SAMPLE_ROWS || plain) {
      sampleRows.push(cells);
      sampleLines.push(i + 1);
    }
    if (sampleRows.length >= SAMPLE_ROWS && plainRows >= SAMPLE_ROWS) break;
  }
  return {
    newline,
    delimiter,
    headerLine,
    headerOffset: offsets[headerLine],
    header,
    unitsRow,
    sampleRows,
    sampleLines,
    ...detectDecimalComma(sampleRows, delimiter),
  };
}
