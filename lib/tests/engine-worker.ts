/**
 * One engine worker thread: receives { id, text, options }, runs the analysis, posts back the run
 * or the LogError's fields. Started only by lib/tests/engine-pool.ts.
 */
import { parentPort } from "node:worker_threads";
import { LogError } from "@/analysis/shared/errors";
import type { AnalyzeOptions } from "@/analysis/decay/types";
import { runAnalysis } from "./engine";

export interface EngineRequest {
  id: number;
  text: string;
  options: AnalyzeOptions;
}

/** Posted once the entry has loaded, so the pool can tell a broken entry from a failed log. */
export interface EngineReady {
  ready: true;
}

export type EngineReply =
  | { id: number; ok: true; run: ReturnType<typeof runAnalysis> }
  | { id: number; ok: false; logError: { code: LogError["code"]; message: string; line: number | null; column: string | null } | null; message: string };

parentPort?.on("message", (req: EngineRequest) => {
  let reply: EngineReply;
  try {
    reply = { id: req.id, ok: true, run: runAnalysis(req.text, req.options) };
  } catch (err) {
    const logError = err instanceof LogError ? { code: err.code, message: err.message, line: err.line, column: err.column } : null;
    reply = { id: req.id, ok: false, logError, message: err instanceof Error ? err.message : String(err) };
  }
  parentPort?.postMessage(reply);
});

parentPort?.postMessage({ ready: true } satisfies EngineReady);
