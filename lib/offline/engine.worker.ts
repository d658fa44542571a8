/**
 * The analysis engine in a Web Worker on the phone: the server's own engine function
 * (lib/vacuum-tests/engine.ts, a thin adapter over analysis/), so the phone's provisional verdict is
 * the server's for the same engine version.
 */
import type { AnalyzeOptions } from "@/analysis/decay/types";
import { LogError } from "@/analysis/shared/errors";
import { runAnalysis } from "@/lib/vacuum-tests/engine";

interface Job {
  id: number;
  text: string;
  options: AnalyzeOptions;
}

addEventListener("message", (ev: MessageEvent<Job>) => {
  const { id, text, options } = ev.data;
  try {
    const { result, series } = runAnalysis(text, options);
    postMessage({ id, ok: true, result, series });
  } catch (e) {
    postMessage({ id, ok: false, message: e instanceof LogError ? e.message : "This phone could not analyse the log." });
  }
});
