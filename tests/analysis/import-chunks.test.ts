import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { importLogStrict } from "@/analysis/import";
import { LogError } from "@/analysis/errors";

const root = path.resolve(import.meta.dirname, "../..");
const files = (dir: string) =>
  readdirSync(path.join(root, "fixtures", dir))
    .filter((f) => /\.(csv|tsv|txt)$/.test(f))
    .map((f) => ({ name: `${dir}/${f}`, text: readFileSync(path.join(root, "fixtures", dir, f), "utf8") }));

/** The import as JSON, or the LogError's code, message, line and column. */
function outcome(text: string, chunkChars: number, maxRows?: number): string {
  try {
    return JSON.stringify(importLogStrict(text, maxRows === undefined ? {} : { maxRows }, chunkChars));
  } catch (e) {
    if (e instanceof LogError) return `LogError ${e.code} ${e.message} ${e.line} ${e.column}`;
    throw e;
  }
}

// A chunk far larger than any fixture: the whole text in one papaparse call.
const ONE_CHUNK = 1 << 30;
// Chunk sizes that cut rows, cells, quoted cells and CRLF pairs at many places (common practice, no published source).
const SMALL_CHUNKS = [7, 61, 500];

describe("the chunked read gives the same import as one whole-text parse (our own invariant, no published source)", () => {
  const cases = [...files("samples"), ...files("layouts"), ...files("bad")];

  it.each(cases)("$name: identical result or identical LogError for chunks of 7, 61 and 500 characters (or 1/256 of the file, whichever is larger)", ({ text }) => {
    const whole = outcome(text, ONE_CHUNK);
    for (const chunkChars of SMALL_CHUNKS) expect(outcome(text, chunkChars)).toBe(whole);
  });

  it("the row limit is the same when a chunk ends past it: maxRows 20 on a 238-row sample gives too_many_rows either way", () => {
    const text = readFileSync(path.join(root, "fixtures/samples/sample-1-iso-microns.csv"), "utf8");
    const whole = outcome(text, ONE_CHUNK, 20);
    expect(whole).toMatch(/^LogError too_many_rows/);
    for (const chunkChars of SMALL_CHUNKS) expect(outcome(text, chunkChars, 20)).toBe(whole);
  });

  it("rows past maxRows + 1 data lines are not read: blank lines at the end of a long file do not count (same as one chunk)", () => {
    // 30 data rows, then 40 blank lines: with maxRows 40 only the first 42 rows are read (header + 41 lines).
    const rows = Array.from({ length: 30 }, (_, i) => `${i * 10},${500 + i}`);
    const text = ["seconds,microns", ...rows, ...Array.from({ length: 40 }, () => "")].join("\n");
    const whole = outcome(text, ONE_CHUNK, 40);
    expect(JSON.parse(whole).summary.rows).toBe(30);
    for (const chunkChars of SMALL_CHUNKS) expect(outcome(text, chunkChars, 40)).toBe(whole);
  });

  it("a 100,000-row log asked for 1-character chunks is still read whole and alike (chunks are capped at 256 per file, so the parser's recursion stays shallow)", () => {
    const rows = Array.from({ length: 100_000 }, (_, i) => `${i},${400 + (i % 50)}`);
    const text = ["seconds,microns", ...rows].join("\n") + "\n";
    const whole = outcome(text, ONE_CHUNK);
    expect(JSON.parse(whole).summary.rows).toBe(100_000);
    expect(outcome(text, 1)).toBe(whole);
  });
});

describe("fully quoted files read on papaparse's fast path give the same result as its quote-aware path", () => {
  it("plainQuotedCells accepts only cells that open and close with a quote, with nothing inside them that a split would cut", async () => {
    const { plainQuotedCells } = await import("@/analysis/import/quotes");
    expect(plainQuotedCells('"a"\t"b"\n"c"\t"d"\n', "\t")).toBe(true);
    expect(plainQuotedCells('"a"\t"b"\r\n"c"\t"d"\r\n\r\n', "\t")).toBe(true);
    for (const bad of ['"a"\t"b"\n"c\td"\t"e"\n', '"a"\t"b"\n"c"d"\t"e"\n', '"a"\t"b"\n"c\nd"\t"e"\n', '"a"\t"b"\nc\t"e"\n', '"a"\t"b"\n\n"c"\t"e"\n', 'a\tb\n'])
      expect(plainQuotedCells(bad, "\t")).toBe(false);
  });

  it("sample 7 reads the same on the fast path as on the quote-aware one (a blank line in the middle keeps it off the fast path)", async () => {
    const { plainQuotedCells } = await import("@/analysis/import/quotes");
    const sample7 = readFileSync(path.join(root, "fixtures/samples/sample-7-tsv-quoted-thousands.csv"), "utf8");
    const slow = sample7.replace('"00:10"', '\n"00:10"');
    expect(plainQuotedCells(sample7, "\t")).toBe(true);
    expect(plainQuotedCells(slow, "\t")).toBe(false);
    const fast = importLogStrict(sample7);
    const other = importLogStrict(slow);
    expect(fast.microns).toEqual(other.microns);
    expect(fast.tSeconds).toEqual(other.tSeconds);
    expect(fast.summary.columns).toEqual(other.summary.columns);
  });
});
