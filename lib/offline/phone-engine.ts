/**
 * What the phone's engine does with a log (importer → analysis → chart series), apart from the Web
 * Worker that runs it (engine.worker.ts), so the same function can be set beside the server's
 * (lib/vacuum-tests/engine.ts) on the evaluation set (tests/offline-agreement.test.ts).
 */
import { importLog } from "@/analysis/decay/import/index";
import { analyzeReadings, downsampleForChart } from "@/analysis/index";
import type { AnalysisResult, AnalyzeOptions } from "@/analysis/decay/types";

/** Same as the server's chart (lib/vacuum-tests/engine.ts). */
export const PHONE_CHART_MAX_POINTS = 1500;

export interface PhoneRun {
  result: AnalysisResult;
  series: { t: number[]; p: number[] };
}

/** Throws LogError for an unreadable log, as the server's engine does. */
export function analyseOnThisDevice(text: string, options: AnalyzeOptions): PhoneRun {
  const log = importLog(text, options.import ?? {});
  const result = analyzeReadings(log, options);
  const keep: number[] = [];
  if (result.isolationAt !== null) keep.push(result.isolationAt);
  for (const h of result.holds) keep.push(h.isolatedAtSeconds, h.endSeconds);
  if (result.phases.breakAtSeconds !== null) keep.push(result.phases.breakAtSeconds);
  const thinned = downsampleForChart(log.tSeconds, log.microns, PHONE_CHART_MAX_POINTS, keep);
  return { result, series: { t: thinned.tSeconds, p: thinned.microns } };
}
