/**
 * The job runner inside `next start` (called from instrumentation.ts).
 *
 * Stopping: Next.js answers SIGTERM/SIGINT by closing its HTTP server, waiting for requests in
 * flight, then calling process.exit. We stop the runner on the same signal (no new jobs; jobs in
 * flight finish, or go back to the queue) and hold that exit until it is done, for at most
 * STOP_TIMEOUT_MS plus a margin, so a restart never leaves a job stuck as active.
 */
import { env } from "@/lib/env";
import { log } from "@/lib/log";
import { startJobs } from "./workers";

/** Jobs in flight get this long to finish when the server stops (inside the 30 s drain platforms allow). */
const STOP_TIMEOUT_MS = 15_000;

export async function startJobsInApp(): Promise<void> {
  if (env().JOBS_IN_APP === "off") {
    log.info("background jobs are left to a separate worker (JOBS_IN_APP=off)");
    return;
  }
  // Starting must not hold the server back (nor fail it) while the database is away: the runner
  // keeps trying, and uploads answer 503 meanwhile as they would anyway.
  const starting = startWithRetries();
  let stopped: Promise<void> | null = null;
  const onSignal = () => {
    stopped ??= starting.then((r) => r?.stop({ timeoutMs: STOP_TIMEOUT_MS })).catch((err) => log.error("job runner did not stop cleanly", { err: String(err) }));
    holdExitUntil(stopped, STOP_TIMEOUT_MS + 5_000);
  };
  process.once("SIGTERM", onSignal);
  process.once("SIGINT", onSignal);
}

async function startWithRetries() {
  for (let attempt = 1; ; attempt++) {
    try {
      return await startJobs("app");
    } catch (err) {
      log.warn("job runner not started yet; trying again", { attempt, err: String(err).slice(0, 300) });
      await new Promise((r) => setTimeout(r, Math.min(30_000, 1000 * attempt)));
    }
  }
}

/** Make process.exit wait for `done` (at most `limitMs`), then exit with the code Next.js asked for. */
function holdExitUntil(done: Promise<unknown>, limitMs: number): void {
  const exit = process.exit.bind(process);
  let exiting = false;
  process.exit = ((code?: number) => {
    if (exiting) return undefined as never;
    exiting = true;
    const limit = new Promise((r) => setTimeout(r, limitMs).unref());
    void Promise.race([done, limit]).finally(() => exit(code));
    return undefined as never;
  }) as typeof process.exit;
}
