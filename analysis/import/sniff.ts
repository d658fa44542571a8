/**
 * Sniffing the layout of a log from its first lines only: line ending, delimiter, where the
 * header row is (after any free-text preamble) and whether numbers use a decimal comma.
 * The whole file is parsed once, later, with what is decided here.
 */
import { LogError } from "../errors";
import { parsePressureUnit } from "../units";
import { addEvidence, decideDecimalComma, emptyEvidence } from "./decimal";

/** Lines looked at to find the header (preamble included). */
const HEADER_SEARCH_LINES = 100;
/** Data rows after the header used to decide columns, units and time format. */
export const SAMPLE_ROWS = 50;

const DELIMITERS = ["\t", ";", ",", "|"] as const;

export interface Layout {
  newline: "\r\n" | "\n" | "\r";
  delimiter: string;
  /** 0-based line index of the header row. */
  headerLine: number;
  /** Character offset of the header row in the text (BOM already removed). */
  headerOffset: number;
  header: string[];
  /** Up to SAMPLE_ROWS non-blank data rows after the header, split into cells. */
  sampleRows: string[][];
  /** 1-based file line of each sample row. */
  sampleLines: number[];
  decimalComma: boolean;
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

/** First `maxLines` lines with their start offsets. */
function headLines(text: string, newline: string, maxLines: number): { lines: string[]; offsets: number[] } {
  const lines: string[] = [];
  const offsets: number[] = [];
  let start = 0;
  while (lines.length < maxLines && start <= text.length) {
    let end = text.indexOf(newline, start);
    if (end === -1) end = text.length;
    let line = text.slice(start, end);
    // A stray line ending of another kind inside a line is dropped for sniffing.
    if (line.endsWith("\r")) line = line.slice(0, -1);
    lines.push(line);
    offsets.push(start);
    if (end === text.length) break;
    start = end + newline.length;
  }
  return { lines, offsets };
}

/** Split one line on a delimiter, honouring double quotes ("a,b" is one cell; "" is a quote). */
export function splitLine(line: string, delimiter: string): string[] {
  if (line.indexOf('"') === -1) return line.split(delimiter);
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

/** Decimal comma for the whole file, from every cell of the sample (rule in decimal.ts). */
function detectDecimalComma(rows: string[][], delimiter: string): boolean {
  const evidence = emptyEvidence();
  for (const row of rows) for (const cell of row) addEvidence(evidence, cell);
  return decideDecimalComma(evidence, delimiter);
}

/**
 * Find delimiter, header row and sample rows from the first lines of the text (BOM removed).
 * Throws no_header when no row of column names precedes the data.
 */
export function sniffLayout(text: string): Layout {
  if (text.slice(0, 4096).indexOf("\u0000") !== -1)
    throw new LogError("no_header", "the file is not text (it holds binary data); export the log as CSV");
  const newline = detectNewline(text);
  const { lines, offsets } = headLines(text, newline, HEADER_SEARCH_LINES + SAMPLE_ROWS);
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
  for (let i = headerLine + 1; i < lines.length && sampleRows.length < SAMPLE_ROWS; i++) {
    if (isBlank(lines[i])) continue;
    sampleRows.push(split[i]);
    sampleLines.push(i + 1);
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
    decimalComma: detectDecimalComma(sampleRows, delimiter),
  };
}
