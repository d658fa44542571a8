/**
 * One polling loop over one queue: fetch a batch (pg-boss hands each job to one fetcher: SELECT …
 * FOR UPDATE SKIP LOCKED), run each job, complete it or fail it back for a retry, and go again at
 * once while there is work, else after the polling interval.
 *
 * Our own loop rather than pg-boss's work(), for one reason: background work that can wait is not
 * fetched at all while this process is serving uploads (`mayFetch`), so it stays in the queue for
 * an idle server or a worker to take, instead of being held here. A job still running when the
 * loop is stopped and its time is up is failed back to the queue by the runner (lib/jobs/runner.ts).
 */
import type PgBoss from "pg-boss";
import { log } from "@/lib/log";
import type { JobContext, WorkerSpec } from "./runner";

export interface FetchLoop {
  /** Resolves when the loop has stopped (after its job in flight, if any). */
  done: Promise<void>;
  /** Jobs being run right now. */
  inFlight: Map<string, string>;
}

const sleep = (ms: number, stopping: () => boolean) =>
  new Promise<void>((resolve) => {
    const started = Date.now();
    const tick = () => (stopping() || Date.now() - started >= ms ? resolve() : setTimeout(tick, Math.min(50, ms)));
    tick();
  });

export function startFetchLoop<T extends object>(boss: PgBoss, spec: WorkerSpec<T>, ctx: JobContext, mayFetch: () => boolean): FetchLoop {
  const inFlight = new Map<string, string>();
  const pollMs = (spec.pollingIntervalSeconds ?? 1) * 1000;
  const batchSize = spec.batchSize ?? 1;
  const done = (async () => {
    while (!ctx.stopping()) {
      if (!mayFetch()) {
        await sleep(50, ctx.stopping);
        continue;
      }
      // pg-boss's fetch answers [] when the database cannot be reached; the loop just tries again.
      const jobs = await boss.fetch<T>(spec.queue, { batchSize, includeMetadata: true });
      if (!jobs.length) {
        await sleep(pollMs, ctx.stopping);
        continue;
      }
      let next = 0;
      for (; next < jobs.length && !ctx.stopping(); next++) {
        const job = jobs[next];
        inFlight.set(job.id, spec.queue);
        try {
          await spec.run(job, ctx);
          inFlight.delete(job.id);
          await boss.complete(spec.queue, job.id).catch(() => undefined); // if lost, the job expires and its retry finds the work done
        } catch (err) {
          inFlight.delete(job.id);
          log.warn("job failed; pg-boss retries it", { queue: spec.queue, jobId: job.id, retryCount: job.retryCount, error: String(err).slice(0, 300) });
          await boss.fail(spec.queue, job.id, { message: String(err).slice(0, 500) }).catch(() => undefined);
        }
      }
      // Jobs fetched but not started because the loop is stopping go straight back.
      for (const job of jobs.slice(next)) await boss.fail(spec.queue, job.id, { message: "the runner stopped before this job started" }).catch(() => undefined);
      if (jobs.length < batchSize) await sleep(pollMs, ctx.stopping);
    }
  })();
  return { done, inFlight };
}
