/**
 * The analysis engine in a Web Worker on the phone: the same analysis/ code the server runs
 * (phone-engine.ts), so the phone's provisional verdict is the server's.
 */
import type { AnalyzeOptions } from "@/analysis/decay/types";
import { LogError } from "@/analysis/shared/errors";
import { analyseOnThisDevice } from "./phone-engine";

interface Job {
  id: number;
  text: string;
  options: AnalyzeOptions;
}

addEventListener("message", (ev: MessageEvent<Job>) => {
  const { id, text, options } = ev.data;
  try {
    const { result, series } = analyseOnThisDevice(text, options);
    postMessage({ id, ok: true, result, series });
  } catch (e) {
    postMessage({ id, ok: false, message: e instanceof LogError ? e.message : "This phone could not analyse the log." });
  }
});
