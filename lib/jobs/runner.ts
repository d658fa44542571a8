/**
 * The job runner: one started pg-boss instance per process that keeps the cron schedules and does
 * pg-boss's maintenance (putting back jobs whose server died, archiving), and a fetch loop per
 * queue (./fetch-loop.ts) that runs the jobs.
 *
 * It runs inside `next start` (instrumentation.ts, unless JOBS_IN_APP=off) and as `npm run worker`
 * (scripts/worker.ts); any number of them may run over one database: pg-boss hands each job to
 * one of them (SELECT … FOR UPDATE SKIP LOCKED), and a cron schedule fires once a minute across
 * all of them, not once per process.
 *
 * Stopping (SIGTERM, SIGINT): no new jobs are fetched, jobs in flight get `timeoutMs` to finish,
 * and whatever is still running then is failed back to the queue for another try.
 */
import PgBoss from "pg-boss";
import { log } from "@/lib/log";
import { bossOptions, ensureJobStore } from "./boss";
import { startFetchLoop } from "./fetch-loop";
import { isQuiet } from "./local-load";
import type { QueueName } from "./queues";

/** How often pg-boss's maintenance looks for jobs left active by a dead server (one runner does it per interval). */
export const MAINTENANCE_SECONDS = 10;
/**
 * The longest background work that can wait holds off while this process serves uploads (then it
 * goes anyway, so mail still flows under steady load; an idle server or a worker takes it sooner).
 */
const MAX_QUIET_WAIT_MS = 30_000;
let maxQuietWaitMs = MAX_QUIET_WAIT_MS;

/** Test seam: a shorter longest wait for a quiet moment (null restores the default). */
export function setMaxQuietWaitMsForTests(ms: number | null): void {
  maxQuietWaitMs = ms ?? MAX_QUIET_WAIT_MS;
}

export type RunnerRole = "app" | "worker" | "test";

export interface JobContext {
  role: RunnerRole;
  /** True once the runner is stopping: long work should stop at a safe point and throw. */
  stopping: () => boolean;
}

export interface WorkerSpec<T extends object = object> {
  queue: QueueName | (string & {});
  /** Jobs fetched at once per loop, and loops per process (default 1 and 1). */
  batchSize?: number;
  loops?: number;
  pollingIntervalSeconds?: number;
  /** Background work that waits for a quiet moment in a process serving uploads. */
  canWait?: boolean;
  run: (job: PgBoss.JobWithMetadata<T>, ctx: JobContext) => Promise<unknown>;
}

export interface ScheduleSpec {
  queue: QueueName | (string & {});
  cron: string;
}

export interface JobRunner {
  role: RunnerRole;
  boss: PgBoss;
  stop: (opts?: { timeoutMs?: number }) => Promise<void>;
}

const g = globalThis as unknown as { rlJobRunner?: Promise<JobRunner>; rlJobRunnerUp?: boolean };

/** Errors from polling (say, while the database is down) are logged once per 10 s per message. */
function quietErrorLog(): (err: unknown) => void {
  const last = new Map<string, number>();
  return (err) => {
    const message = err instanceof Error ? err.message : String((err as { message?: unknown })?.message ?? err);
    const now = Date.now();
    if ((last.get(message) ?? 0) > now - 10_000) return;
    last.set(message, now);
    log.warn("job queue error (retrying)", { error: message.slice(0, 300) });
  };
}

/**
 * Start this process's runner with the given workers and schedules (once per process; a second
 * call returns the first runner). `test` starts no schedules: tests run sweeps themselves.
 */
export function startJobRunner(role: RunnerRole, workers: WorkerSpec[], schedules: ScheduleSpec[]): Promise<JobRunner> {
  g.rlJobRunner ??= (async () => {
    await ensureJobStore();
    let stopping = false;
    const boss = new PgBoss({
      ...bossOptions(),
      supervise: true,
      schedule: role !== "test",
      migrate: false,
      maintenanceIntervalSeconds: MAINTENANCE_SECONDS,
    });
    boss.on("error", quietErrorLog());
    await boss.start();
    const ctx: JobContext = { role, stopping: () => stopping };
    const loops = workers.flatMap((w) => Array.from({ length: w.loops ?? 1 }, () => startFetchLoop(boss, w, ctx, mayFetchFor(w, role))));
    if (role !== "test") for (const s of schedules) await boss.schedule(s.queue, s.cron, {}, { tz: "UTC" });
    log.info("job runner started", { role, queues: workers.map((w) => w.queue) });
    g.rlJobRunnerUp = true;
    const stop = async (opts: { timeoutMs?: number } = {}) => {
      if (stopping) return;
      stopping = true;
      // Jobs in flight get the time limit to finish; whatever still runs then goes back to the queue.
      let timer: NodeJS.Timeout | undefined;
      const limit = new Promise((r) => (timer = setTimeout(r, opts.timeoutMs ?? 20_000)));
      await Promise.race([Promise.all(loops.map((l) => l.done)), limit]);
      clearTimeout(timer);
      for (const l of loops) {
        for (const [id, queue] of l.inFlight) await boss.fail(queue, id, { message: "the server stopped while this job ran" }).catch(() => undefined);
      }
      await boss.stop({ graceful: false, wait: true, close: false });
      g.rlJobRunner = undefined;
      g.rlJobRunnerUp = false;
      log.info("job runner stopped", { role });
    };
    return { role, boss, stop };
  })().catch((err) => {
    g.rlJobRunner = undefined;
    throw err;
  });
  return g.rlJobRunner;
}

/** For work that can wait in a process serving uploads: fetch only when quiet, or once the longest wait has passed. */
function mayFetchFor(spec: WorkerSpec, role: RunnerRole): () => boolean {
  if (!spec.canWait || role === "worker") return () => true;
  let busySince: number | null = null;
  return () => {
    if (isQuiet()) {
      busySince = null;
      return true;
    }
    busySince ??= Date.now();
    if (Date.now() - busySince < maxQuietWaitMs) return false;
    busySince = null; // one fetch, then hold off again
    return true;
  };
}

/** Whether this process runs the background jobs now (for /api/health). */
export function jobRunnerState(): "running" | "starting" | "not started" {
  return g.rlJobRunnerUp ? "running" : g.rlJobRunner ? "starting" : "not started";
}
