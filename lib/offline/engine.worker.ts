/**
 * The analysis engine in a Web Worker on the phone: the same analysis/ code the server runs,
 * importer → analysis → chart series, so the phone's provisional verdict is the server's.
 */
import { importLog } from "@/analysis/decay/import/index";
import { analyzeReadings, downsampleForChart } from "@/analysis/index";
import type { AnalyzeOptions } from "@/analysis/decay/types";
import { LogError } from "@/analysis/shared/errors";

/** Same as the server's chart (lib/tests/engine.ts). */
const CHART_MAX_POINTS = 1500;

interface Job {
  id: number;
  text: string;
  options: AnalyzeOptions;
}

addEventListener("message", (ev: MessageEvent<Job>) => {
  const { id, text, options } = ev.data;
  try {
    const log = importLog(text, options.import ?? {});
    const result = analyzeReadings(log, options);
    const keep: number[] = [];
    if (result.isolationAt !== null) keep.push(result.isolationAt);
    for (const h of result.holds) keep.push(h.isolatedAtSeconds, h.endSeconds);
    if (result.phases.breakAtSeconds !== null) keep.push(result.phases.breakAtSeconds);
    const thinned = downsampleForChart(log.tSeconds, log.microns, CHART_MAX_POINTS, keep);
    postMessage({ id, ok: true, result, series: { t: thinned.tSeconds, p: thinned.microns } });
  } catch (e) {
    postMessage({ id, ok: false, message: e instanceof LogError ? e.message : "This phone could not analyse the log." });
  }
});
