import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { importLogStrict } from "@/analysis/decay/import";
import { LogError } from "@/analysis/shared/errors";

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
  it("sample 7 reads the same on the fast path as with a cell whose quotes carry a delimiter (which sends the whole file down the quote-aware path)", () => {
    const sample7 = readFileSync(path.join(root, "fixtures/samples/sample-7-tsv-quoted-thousands.csv"), "utf8");
    const fast = importLogStrict(sample7);
    // a third column whose last row holds a tab inside its quotes: a plain split would cut it
    const lines = sample7.trim().split("\n");
    const withNote = lines.map((l, i) => `${l}\t"${i === 0 ? "Note" : i === lines.length - 1 ? "valve\tclosed" : ""}"`).join("\n") + "\n";
    const slow = importLogStrict(withNote);
    expect(slow.microns).toEqual(fast.microns);
    expect(slow.tSeconds).toEqual(fast.tSeconds);
    expect(slow.summary.columns).toEqual([...fast.summary.columns, "Note"]);
  });
});
