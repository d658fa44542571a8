/** The import preview: what the importer read from the first lines, without saving anything (run through lib/engine/door.ts). */
import Papa from "papaparse";
import type { ImportOptions, UnsureReason } from "@/analysis/decay/types";
import { readLogForPreview } from "./engine";

export const PREVIEW_ROWS = 8;

export interface ImportPreview {
  columns: string[];
  rows: string[][];
  detected: {
    timeColumn: string;
    pressureColumn: string;
    unit: string;
    timeFormat: string;
    delimiter: string;
    headerLine: number;
    unsure: boolean;
    /** Each guess behind `unsure` by topic; a decimal_mark one carries the two readings to choose from. */
    unsureReasons: UnsureReason[];
    assumptions: string[];
  };
}

export function firstRows(text: string, fromLine: number, delimiter: string | undefined, n: number): string[][] {
  const lines = text.replace(/^\uFEFF/, "").split(/\r\n|\n|\r/).slice(fromLine, fromLine + n + 1);
  const parsed = Papa.parse<string[]>(lines.join("\n"), { delimiter, skipEmptyLines: true });
  return parsed.data.slice(0, n).map((r) => r.map((c) => String(c)));
}

/** What the importer reads from a log (pure; throws LogError). Run through the engine door, previewLog. */
export function readPreview(text: string, options: ImportOptions): ImportPreview {
  const log = readLogForPreview(text, options);
  const s = log.summary;
  return {
    columns: s.columns,
    rows: firstRows(text, s.headerLine + 1, s.delimiter, PREVIEW_ROWS),
    detected: {
      timeColumn: s.timeColumn,
      pressureColumn: s.pressureColumn,
      unit: s.unit,
      timeFormat: s.timeFormat,
      delimiter: s.delimiter,
      headerLine: s.headerLine,
      unsure: s.unsure,
      unsureReasons: s.unsureReasons ?? [],
      assumptions: s.assumptions,
    },
  };
}
