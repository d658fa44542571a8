/**
 * A log whose every cell is quoted ("00:10"<TAB>"4,150") goes down papaparse's quote-aware path, which
 * on such files costs more than the rest of the analysis together. When the quotes carry nothing (every
 * cell quoted, no quote, delimiter or line break inside a cell), papaparse's fast path (a split on line
 * ends and delimiters) gives the same cells with their quotes still on, and the row reader takes the
 * quotes off the few cells it reads. One pass over the characters decides it; anything else keeps
 * papaparse's quote-aware path.
 */

const QUOTE = 34;
const CR = 13;
const LF = 10;

/**
 * Whether the quotes carry nothing, so a plain split gives the cells (quotes on): the text must be lines of
 * cells that each open and close with a quote, with nothing but the one-character delimiter between
 * cells and a line break (\n or \r\n) between lines, and no quote, delimiter or line break inside a cell.
 * Blank lines at the end are allowed. O(characters), no allocation.
 */
export function plainQuotedCells(text: string, delimiter: string): boolean {
  if (delimiter.length !== 1 || text.charCodeAt(0) !== QUOTE) return false;
  const d = delimiter.charCodeAt(0);
  const n = text.length;
  let i = 0;
  while (i < n) {
    // a line: "cell"(d"cell")* then \n, \r\n or the end
    for (;;) {
      if (text.charCodeAt(i) !== QUOTE) return false;
      i++;
      for (;;) {
        if (i >= n) return false;
        const c = text.charCodeAt(i);
        if (c === QUOTE) break;
        if (c === d || c === LF || c === CR) return false;
        i++;
      }
      i++; // the closing quote
      if (i >= n) break;
      const c = text.charCodeAt(i);
      if (c === d) {
        i++;
        continue;
      }
      if (c === CR && text.charCodeAt(i + 1) === LF) i++;
      else if (c !== LF) return false;
      i++;
      break;
    }
    // blank lines only at the very end
    let j = i;
    while (j < n && (text.charCodeAt(j) === LF || text.charCodeAt(j) === CR)) j++;
    if (j > i && j < n) return false;
    i = j;
  }
  return true;
}
