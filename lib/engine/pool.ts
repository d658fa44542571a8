/**
 * The one door to the engine for every log: runOnEngine takes a task of lib/engine/tasks.ts (a
 * decay log to analyse, an import preview, a blank-off log, a nitrogen test) and runs it inline
 * when it is small, else on a small pool of worker threads, each running one task at a time, so a
 * long log never stalls the main thread while it serves HTTP, the database and storage.
 *
 *  - Size: ENGINE_WORKERS (lib/env.ts); 0 runs the engine inline on the caller's thread.
 *  - Small logs run inline anyway (ENGINE_INLINE_MAX_KB, default 256 kB): the engine holds the event
 *    loop only milliseconds for them, less than handing them to a worker costs (copying the log in
 *    and the run out, a second heap; measured in docs/PERFORMANCE.md). A large log, up to the
 *    upload limit, would hold the loop for seconds, so it goes to a worker.
 *  - A LogError in the worker comes back as the same LogError (→ 422 with the importer's message).
 *  - A worker that dies or overruns ENGINE_TIMEOUT_MS fails only its own log with a clear error
 *    and is replaced; the others carry on. If workers keep failing without finishing a single
 *    log (a broken deployment), the pool gives up and analyses inline rather than fail uploads.
 *  - Background work (a queued large log, a bulk re-analysis) always goes to a worker, never the
 *    request thread, and waits behind the logs of requests in progress.
 *  - One pool per process, kept on globalThis: Next.js bundles the routes and the job runner
 *    (instrumentation) apart, and both use it.
 */
import { availableParallelism } from "node:os";
import path from "node:path";
import { Worker } from "node:worker_threads";
import { LogError } from "@/analysis/shared/errors";
import type { AnalyzeOptions } from "@/analysis/decay/types";
import { AppError } from "@/lib/errors";
import { env } from "@/lib/env";
import { log } from "@/lib/log";
import type { EngineRun } from "@/lib/vacuum-tests/engine";
import { runEngineTask, sizeOfTask, type AnswerOf, type EngineTask } from "./tasks";
import type { EngineReady, EngineReply, EngineRequest } from "./worker";

interface Job {
  request: EngineRequest;
  background: boolean;
  resolve: (answer: unknown) => void;
  reject: (err: unknown) => void;
}

interface Slot {
  worker: Worker;
  /** The entry loaded (it said so); a worker failing before that never got to the log. */
  ready: boolean;
  job: Job | null;
  timer: NodeJS.Timeout | null;
}

interface PoolState {
  slots: Slot[] | null;
  waiting: Job[];
  nextId: number;
  /** Worker failures since a worker last finished a log; at MAX_FAILURES_IN_A_ROW the pool goes inline. */
  failuresInARow: number;
  inlineOnly: boolean;
}
const g = globalThis as unknown as { rlEnginePool?: PoolState };
const state: PoolState = (g.rlEnginePool ??= { slots: null, waiting: [], nextId: 1, failuresInARow: 0, inlineOnly: false });
const MAX_FAILURES_IN_A_ROW = 5;

let spawnOverride: (() => Worker) | null = null;
let timeoutOverrideMs: number | null = null;
let inlineMaxKbOverride: number | null = null;

/** Test seam: how a worker is started (null restores the real one). */
export function setWorkerSpawnForTests(spawn: (() => Worker) | null): void {
  spawnOverride = spawn;
}

/** Test seam: a shorter worker timeout (null restores ENGINE_TIMEOUT_MS). */
export function setEngineTimeoutForTests(ms: number | null): void {
  timeoutOverrideMs = ms;
}

/** Test seam: the largest log analysed inline, in kB (0: every log goes to the pool); null restores ENGINE_INLINE_MAX_KB. */
export function setInlineMaxKbForTests(kb: number | null): void {
  inlineMaxKbOverride = kb;
}

/** A log small enough that analysing it here costs less than handing it to a worker. */
function smallEnoughForInline(task: EngineTask): boolean {
  return sizeOfTask(task) <= (inlineMaxKbOverride ?? env().ENGINE_INLINE_MAX_KB) * 1024;
}

/**
 * Workers the pool keeps: the setting, else one per core less the one the main thread needs for
 * HTTP, the database and storage (at least 1, at most 4). On a 2-core machine one worker beat two
 * in bench:api (docs/PERFORMANCE.md): a second isolate warms up and compiles the engine again while
 * competing with the main thread for the cores.
 */
export function engineWorkerCount(): number {
  const configured = env().ENGINE_WORKERS;
  return configured ?? Math.min(4, Math.max(1, availableParallelism() - 1));
}

function spawnWorker(): Worker {
  if (spawnOverride) return spawnOverride();
  // A built server runs the entry Next.js bundled from the literal URL below. Under vitest or
  // tsx (ENGINE_WORKER_ENTRY=source) the worker registers tsx's loader and requires the source.
  return env().ENGINE_WORKER_ENTRY === "source"
    ? new Worker(`require("tsx/cjs"); require(${JSON.stringify(path.join(process.cwd(), "lib/engine/worker.ts"))});`, { eval: true })
    : new Worker(new URL("./worker.ts", import.meta.url));
}

/** Stop a worker for good; a late error from it (say, while its entry loads) is ignored. */
function retire(worker: Worker): Promise<unknown> {
  worker.removeAllListeners();
  worker.on("error", () => undefined);
  return worker.terminate().catch(() => undefined);
}

function settle(slot: Slot, reply: EngineReply): void {
  const job = slot.job;
  if (!job || job.request.id !== reply.id) return;
  state.failuresInARow = 0;
  finish(slot);
  if (reply.ok) job.resolve(reply.answer);
  else if (reply.logError) {
    const e = reply.logError;
    job.reject(new LogError(e.code, e.message, { line: e.line ?? undefined, column: e.column ?? undefined }));
  } else if (reply.errorName === "RangeError") job.reject(new RangeError(reply.message));
  else job.reject(new Error(`analysis failed in the engine worker: ${reply.message}`));
}

function finish(slot: Slot): void {
  if (slot.timer) clearTimeout(slot.timer);
  slot.timer = null;
  slot.job = null;
  slot.worker.unref();
  pump();
}

/**
 * Replace a worker that crashed or overran, failing only the log it was working on. A worker
 * whose entry never loaded did not fail the log: that log is analysed inline instead.
 */
function replace(slot: Slot, why: string): void {
  const job = slot.job;
  const neverLoaded = !slot.ready && why !== "timed out";
  retire(slot.worker);
  log.error("engine worker replaced", { why });
  if (++state.failuresInARow >= MAX_FAILURES_IN_A_ROW && !state.inlineOnly) {
    state.inlineOnly = true;
    log.error("engine workers keep failing; analysing on the request thread from now on", { why });
  }
  if (job && neverLoaded) runInline(job.request.task).then(job.resolve, job.reject);
  else if (job) job.reject(new AppError("analysis_unavailable"));
  if (state.inlineOnly) {
    drainInline();
    return;
  }
  try {
    attach(slot, spawnWorker());
  } catch (err) {
    state.inlineOnly = true;
    log.error("engine worker cannot be replaced; analysing on the request thread", { err: String(err) });
    drainInline();
    return;
  }
  finish(slot);
}

function attach(slot: Slot, worker: Worker): void {
  slot.worker = worker;
  slot.ready = false;
  worker.on("message", (reply: EngineReply | EngineReady) => {
    if ("ready" in reply) slot.ready = true;
    else settle(slot, reply);
  });
  worker.on("error", (err) => replace(slot, String(err)));
  worker.on("exit", (code) => {
    if (slot.worker === worker && slot.job) replace(slot, `exited with code ${code}`);
  });
  // After the listeners (adding a 'message' listener refs the port again): an idle worker never
  // keeps the process alive, so scripts and tests exit when their work is done.
  worker.unref();
}

/** The pool, started on first use; null when workers cannot be started here (then: inline). */
function pool(): Slot[] | null {
  if (state.slots) return state.slots;
  try {
    state.slots = Array.from({ length: engineWorkerCount() }, () => {
      const slot: Slot = { worker: null as unknown as Worker, ready: false, job: null, timer: null };
      attach(slot, spawnWorker());
      return slot;
    });
  } catch (err) {
    state.inlineOnly = true;
    log.error("engine workers cannot start here; analysing on the request thread", { err: String(err) });
    return null;
  }
  return state.slots;
}

/** After the pool gave up: every waiting log is analysed on this thread. */
function drainInline(): void {
  for (const job of state.waiting.splice(0)) runInline(job.request.task).then(job.resolve, job.reject);
}

function runInline<T extends EngineTask>(task: T): Promise<AnswerOf<T>> {
  return Promise.resolve().then(() => runEngineTask(task));
}

function pump(): void {
  if (!state.slots) return;
  for (const slot of state.slots) {
    if (slot.job || state.waiting.length === 0) continue;
    const job = state.waiting.shift()!;
    slot.job = job;
    slot.worker.ref(); // keep the process alive only while a log is being analysed
    slot.timer = setTimeout(() => replace(slot, "timed out"), timeoutOverrideMs ?? env().ENGINE_TIMEOUT_MS);
    slot.worker.postMessage(job.request);
  }
}

/**
 * Where analyses run now, for /api/health: "workers" once a worker has loaded its entry,
 * "starting" before that, "not started" before the first log too large to analyse inline,
 * "inline" when the pool is off (ENGINE_WORKERS=0) or gave up.
 */
export function engineMode(): "workers" | "starting" | "not started" | "inline" {
  if (state.inlineOnly || engineWorkerCount() === 0) return "inline";
  if (!state.slots) return "not started";
  return state.slots.some((s) => s.ready) ? "workers" : "starting";
}

/**
 * Run one engine task on the pool: inline when its log is small (or when ENGINE_WORKERS=0), else
 * on a worker. Resolves with the task's answer; rejects with LogError for an unreadable log,
 * RangeError for a number the engine cannot use. `background`: a job's task, which goes to a
 * worker whatever its size and waits behind the tasks of requests (inline only when there are no
 * workers at all).
 */
export function runOnEngine<T extends EngineTask>(task: T, opts: { background?: boolean } = {}): Promise<AnswerOf<T>> {
  const background = opts.background ?? false;
  if (state.inlineOnly || engineWorkerCount() === 0 || (!background && smallEnoughForInline(task))) return runInline(task);
  if (!pool()) return runInline(task);
  return new Promise<AnswerOf<T>>((resolve, reject) => {
    const job: Job = { request: { id: state.nextId++, task }, background, resolve: resolve as (answer: unknown) => void, reject };
    // A request's log goes ahead of every background one still waiting.
    const firstBackground = background ? -1 : state.waiting.findIndex((j) => j.background);
    if (firstBackground < 0) state.waiting.push(job);
    else state.waiting.splice(firstBackground, 0, job);
    pump();
  });
}

/** A decay test's log analysed through runOnEngine (upload, re-test, re-analysis, queued logs). */
export function analyseOffThread(text: string, options: AnalyzeOptions, opts: { background?: boolean } = {}): Promise<EngineRun> {
  return runOnEngine({ kind: "analyse", text, options }, opts);
}

/** Stop every worker (tests and shutdown). The next analysis starts a fresh pool. */
export async function closeEnginePool(): Promise<void> {
  const all = state.slots ?? [];
  state.slots = null;
  state.failuresInARow = 0;
  state.inlineOnly = false;
  await Promise.all(all.map((s) => retire(s.worker)));
}
