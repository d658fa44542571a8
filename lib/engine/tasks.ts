/**
 * Every piece of work the server hands the engine, as one tagged request, and the one function that
 * runs it. lib/engine/pool.ts runs it inline for a small log or on a worker thread for a large one,
 * so no route reads a log on the request thread by itself:
 *  - "analyse": a decay test's log, imported and analysed (upload, re-test, re-analysis, queued logs);
 *  - "preview": the importer alone, for the column and unit choices before an upload;
 *  - "blank-off": the lowest reading of a rig's blank-off log;
 *  - "nitrogen": a nitrogen standing-pressure test, typed or from a logger CSV.
 * Each answer is plain data (dates and arrays), so it crosses a worker's message port unchanged.
 */
import { importLog } from "@/analysis/decay/import/index";
import type { AnalyzeOptions, ImportOptions } from "@/analysis/decay/types";
import { evaluatePressureTestRequest, type EvaluatedPressureTest } from "@/lib/pressure/evaluate";
import type { PressureTestCreate } from "@/lib/pressure/schemas";
import { runAnalysis, type EngineRun } from "@/lib/vacuum-tests/engine";
import { readPreview, type ImportPreview } from "@/lib/vacuum-tests/preview";

export interface BlankOffReading {
  lowestMicrons: number;
  readings: number;
  unit: string;
}

export type EngineTask =
  | { kind: "analyse"; text: string; options: AnalyzeOptions }
  | { kind: "preview"; text: string; options: ImportOptions }
  | { kind: "blank-off"; text: string }
  | { kind: "nitrogen"; body: PressureTestCreate };

export interface EngineAnswer {
  analyse: EngineRun;
  preview: ImportPreview;
  "blank-off": BlankOffReading;
  nitrogen: EvaluatedPressureTest;
}

export type AnswerOf<T extends EngineTask> = EngineAnswer[T["kind"]];

/** The lowest reading, by one loop: a blank-off log can hold a million readings (no spreading them as arguments). */
function lowestOf(readings: ArrayLike<number>): number {
  let lowest = Infinity;
  for (let i = 0; i < readings.length; i++) if (readings[i] < lowest) lowest = readings[i];
  return lowest;
}

/** Characters of log text the task reads: what decides inline or worker. */
export function sizeOfTask(task: EngineTask): number {
  if (task.kind === "nitrogen") return task.body.source === "file" ? task.body.csvText.length : 0;
  return task.text.length;
}

/**
 * Run one task on this thread. Throws LogError for an unreadable log, RangeError for a number the
 * nitrogen evaluation cannot use (the callers map both to 422 with the engine's message).
 */
export function runEngineTask<T extends EngineTask>(task: T): AnswerOf<T> {
  switch (task.kind) {
    case "analyse":
      return runAnalysis(task.text, task.options) as AnswerOf<T>;
    case "preview":
      return readPreview(task.text, task.options) as AnswerOf<T>;
    case "blank-off": {
      const log = importLog(task.text, {});
      return { lowestMicrons: lowestOf(log.microns), readings: log.microns.length, unit: log.summary.unit } as AnswerOf<T>;
    }
    case "nitrogen":
      return evaluatePressureTestRequest(task.body) as AnswerOf<T>;
  }
}
