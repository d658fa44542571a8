// `npm run worker`: the background jobs on their own, without a web server (mail delivery, the
// sweeps, rig reminders, large-log analysis, bulk re-analysis). Run as many as you like over one
// database; set JOBS_IN_APP=off on the web servers when you do. SIGTERM or SIGINT stops it:
// jobs in flight get 20 s to finish, the rest go back to the queue.
import { closeDb } from "@/db/client";
import { closeMail } from "@/lib/mail";
import { log } from "@/lib/log";
import { closeEnginePool } from "@/lib/engine/pool";
import { startJobs } from "@/lib/jobs/workers";

const runner = await startJobs("worker");
console.log("• Riseline worker running (Ctrl-C stops it)");

let stopping = false;
async function stop(signal: string) {
  if (stopping) return;
  stopping = true;
  log.info("worker stopping", { signal });
  await runner.stop({ timeoutMs: 20_000 });
  closeMail();
  await closeEnginePool();
  await closeDb();
  process.exit(0);
}
process.on("SIGTERM", () => void stop("SIGTERM"));
process.on("SIGINT", () => void stop("SIGINT"));
