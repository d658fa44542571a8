/**
 * The server's one door to the engine: every log the server reads — an upload, an import preview,
 * a re-test, a re-analysis, a blank-off log, a nitrogen test — goes through here, and from here
 * through runOnEngine (lib/engine/pool.ts), which keeps a large log off the request thread. Each
 * function maps the engine's errors to the answer the route gives (422 with the engine's words).
 */
import { LogError } from "@/analysis/shared/errors";
import type { AnalyzeOptions, ImportOptions } from "@/analysis/decay/types";
import { AppError } from "@/lib/errors";
import type { EvaluatedPressureTest } from "@/lib/pressure/evaluate";
import type { PressureTestCreate } from "@/lib/pressure/schemas";
import type { EngineRun } from "@/lib/vacuum-tests/engine";
import { firstRows, PREVIEW_ROWS, type ImportPreview } from "@/lib/vacuum-tests/preview";
import { analyseOffThread, runOnEngine } from "./pool";
import type { BlankOffReading } from "./tasks";

/** A decay test's log, imported and analysed. Rejects with LogError (→ 422 with the importer's message). */
export function analyseLog(text: string, options: AnalyzeOptions, opts: { background?: boolean } = {}): Promise<EngineRun> {
  return analyseOffThread(text, options, opts);
}

/** The preview before an upload; an unreadable log is a 422 that still shows the first rows, so the page can offer a column or unit choice. */
export async function previewLog(text: string, options: ImportOptions): Promise<ImportPreview> {
  try {
    return await runOnEngine({ kind: "preview", text, options });
  } catch (err) {
    if (!(err instanceof LogError)) throw err;
    const raw = firstRows(text, 0, undefined, PREVIEW_ROWS + 1);
    throw new AppError("invalid_file", err.message, { reason: err.code, line: err.line, column: err.column, columns: raw[0] ?? [], rows: raw.slice(1) });
  }
}

/** The lowest reading of a rig's blank-off log. Rejects with LogError (→ 422 with the importer's message). */
export function readBlankOffLog(text: string): Promise<BlankOffReading> {
  return runOnEngine({ kind: "blank-off", text });
}

/** A nitrogen test's readings and verdict; a number the evaluation cannot use is a 422 naming it. */
export async function evaluatePressureTest(body: PressureTestCreate): Promise<EvaluatedPressureTest> {
  try {
    return await runOnEngine({ kind: "nitrogen", body });
  } catch (err) {
    if (err instanceof RangeError) throw new AppError("invalid_input", err.message);
    throw err;
  }
}
