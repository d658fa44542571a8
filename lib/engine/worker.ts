/**
 * One engine worker thread: receives { id, task }, runs it (lib/engine/tasks.ts), posts back the
 * answer or the error's fields (a LogError's in full). Started only by lib/engine/pool.ts.
 */
import { parentPort } from "node:worker_threads";
import { LogError } from "@/analysis/shared/errors";
import { runEngineTask, type EngineTask } from "./tasks";

export interface EngineRequest {
  id: number;
  task: EngineTask;
}

/** Posted once the entry has loaded, so the pool can tell a broken entry from a failed log. */
export interface EngineReady {
  ready: true;
}

export type EngineReply =
  | { id: number; ok: true; answer: unknown }
  | {
      id: number;
      ok: false;
      logError: { code: LogError["code"]; message: string; line: number | null; column: string | null } | null;
      /** "RangeError" for a number the engine cannot use (422 at the route); anything else is a failure. */
      errorName: string;
      message: string;
    };

parentPort?.on("message", (req: EngineRequest) => {
  let reply: EngineReply;
  try {
    reply = { id: req.id, ok: true, answer: runEngineTask(req.task) };
  } catch (err) {
    const logError = err instanceof LogError ? { code: err.code, message: err.message, line: err.line, column: err.column } : null;
    reply = { id: req.id, ok: false, logError, errorName: err instanceof Error ? err.name : "Error", message: err instanceof Error ? err.message : String(err) };
  }
  parentPort?.postMessage(reply);
});

parentPort?.postMessage({ ready: true } satisfies EngineReady);
