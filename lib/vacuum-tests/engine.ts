/**
 * The server's one door to the analysis engine: analyse a log's text, read its columns for a
 * preview, and thin a series for the chart. Everything here is a thin adapter over analysis/.
 */
import { importLog } from "@/analysis/decay/import/index";
import type { AnalysisResult, AnalyzeOptions, ImportedLog } from "@/analysis/decay/types";
import { analyzeReadings, downsampleForChart } from "@/analysis/index";

/** Most points the chart series keeps (the detail page draws it on a phone). */
export const CHART_MAX_POINTS = 1500;

export interface EngineRun {
  result: AnalysisResult;
  series: { t: number[]; p: number[] };
  /** ISO time of the first data row when the file carries absolute times, else null. */
  startedAt: string | null;
}

/** Seconds worth keeping exactly in the chart: isolation and the ends of every hold. */
function keepTimesOf(result: AnalysisResult): number[] {
  const keep: number[] = [];
  if (result.isolationAt !== null) keep.push(result.isolationAt);
  for (const h of result.holds) keep.push(h.isolatedAtSeconds, h.endSeconds);
  if (result.phases.breakAtSeconds !== null) keep.push(result.phases.breakAtSeconds);
  return keep;
}

/**
 * Analyse a log's text with the given options. Throws LogError for an unreadable log or a bad
 * option (the caller maps it to 422 with the importer's message).
 */
export function runAnalysis(text: string, options: AnalyzeOptions): EngineRun {
  // Import once, analyse the readings, and thin the same readings for the chart.
  const log: ImportedLog = importLog(text, options.import ?? {});
  const result = analyzeReadings(log, options);
  const thinned = downsampleForChart(log.tSeconds, log.microns, CHART_MAX_POINTS, keepTimesOf(result));
  return { result, series: { t: thinned.tSeconds, p: thinned.microns }, startedAt: log.startedAt };
}

/** The importer alone: columns, first rows and what it detected, for the preview. */
export function readLogForPreview(text: string, options: AnalyzeOptions["import"] = {}): ImportedLog {
  return importLog(text, options ?? {});
}
