/** The import preview: what the importer read from the first lines, without saving anything. */
import Papa from "papaparse";
import { LogError } from "@/analysis/shared/errors";
import type { ImportOptions, UnsureReason } from "@/analysis/decay/types";
import { AppError } from "@/lib/errors";
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

function firstRows(text: string, fromLine: number, delimiter: string | undefined, n: number): string[][] {
  const lines = text.replace(/^\uFEFF/, "").split(/\r\n|\n|\r/).slice(fromLine, fromLine + n + 1);
  const parsed = Papa.parse<string[]>(lines.join("\n"), { delimiter, skipEmptyLines: true });
  return parsed.data.slice(0, n).map((r) => r.map((c) => String(c)));
}

export function previewLog(text: string, options: ImportOptions): ImportPreview {
  try {
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
  } catch (err) {
    if (!(err instanceof LogError)) throw err;
    // Still show what the file looks like, so the page can offer a column or unit choice.
    const raw = firstRows(text, 0, undefined, PREVIEW_ROWS + 1);
    throw new AppError("invalid_file", err.message, { reason: err.code, line: err.line, column: err.column, columns: raw[0] ?? [], rows: raw.slice(1) });
  }
}
