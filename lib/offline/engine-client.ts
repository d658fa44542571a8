/**
 * The phone's engine, loaded only when a test is captured offline: the worker script (and the
 * whole analysis/ bundle inside it) is a chunk of its own, never part of the new-test page's first
 * load. One worker is kept for the page's life once started.
 */
import type { AnalyzeOptions } from "@/analysis/decay/types";
import type { ProvisionalVerdict } from "./outbox";

type Answer = { id: number; ok: true; result: ProvisionalVerdict["result"]; series: ProvisionalVerdict["series"] } | { id: number; ok: false; message: string };

let worker: Worker | null = null;
let seq = 0;
const waiting = new Map<number, (a: Answer) => void>();

function engineWorker(): Worker {
  if (worker) return worker;
  worker = new Worker(new URL("./engine.worker.ts", import.meta.url));
  worker.onmessage = (ev: MessageEvent<Answer>) => {
    const done = waiting.get(ev.data.id);
    waiting.delete(ev.data.id);
    done?.(ev.data);
  };
  return worker;
}

export class PhoneEngineError extends Error {}

/** Analyses a log's text on this phone. Throws PhoneEngineError with the importer's words. */
export function analyseOnPhone(text: string, options: AnalyzeOptions): Promise<ProvisionalVerdict> {
  const started = performance.now();
  const id = ++seq;
  return new Promise((resolve, reject) => {
    waiting.set(id, (a) => {
      if (a.ok) resolve({ result: a.result, series: a.series, elapsedMs: Math.round(performance.now() - started) });
      else reject(new PhoneEngineError(a.message));
    });
    engineWorker().postMessage({ id, text, options });
  });
}
