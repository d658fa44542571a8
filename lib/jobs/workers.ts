/**
 * What each queue runs, and the schedules. Every runner (inside `next start`, `npm run worker`,
 * a test) runs all of them; pg-boss decides which runner gets which job.
 */
import { db } from "@/db/client";
import { env } from "@/lib/env";
import { markDeadLettered, runMailJob } from "@/lib/notify/delivery";
import type { MailJobData } from "@/lib/notify/outbox";
import { sweepOverdueMail } from "@/lib/notify/sweep";
import { sweepAllShopsIntoReview } from "@/lib/review/sweep";
import { mailRigReminders } from "@/lib/rigs/reminder-mail";
import { runBulkReanalysisJob, type BulkJobData } from "@/lib/vacuum-tests/bulk-reanalysis";
import { runLogAnalysisJob, type LogJobData } from "@/lib/vacuum-tests/queued-upload";
import { QUEUES } from "./queues";
import { runRawDeleteJob, type RawDeleteJobData } from "./raw-delete";
import { sweepOrphanRawFiles } from "./raw-sweep";
import { startJobRunner, type JobRunner, type RunnerRole, type ScheduleSpec, type WorkerSpec } from "./runner";

/** A spec with its job's data type, listed among the others. */
const worker = <T extends object>(spec: WorkerSpec<T>) => spec as unknown as WorkerSpec;

export function workerSpecs(): WorkerSpec[] {
  return [
    // Two loops of up to ten jobs a second each: a burst of uploads' review e-mail goes out in
    // batches, after the verdicts (canWait), over the shared SMTP connections.
    worker<MailJobData>({ queue: QUEUES.mail.name, batchSize: 10, loops: 2, canWait: true, run: (job) => runMailJob(db(), job.data) }),
    // A technician waits for this one: no holding off, half a second between polls.
    worker<LogJobData>({ queue: QUEUES.logAnalysis.name, pollingIntervalSeconds: 0.5, run: (job) => runLogAnalysisJob(db(), job.data) }),
    worker<BulkJobData>({ queue: QUEUES.bulkReanalysis.name, canWait: true, run: (job, ctx) => runBulkReanalysisJob(db(), job.data, ctx) }),
    worker<MailJobData>({ queue: QUEUES.mailDeadLetter.name, pollingIntervalSeconds: 5, run: (job) => markDeadLettered(db(), job) }),
    worker({ queue: QUEUES.mailSweep.name, pollingIntervalSeconds: 5, canWait: true, run: () => sweepOverdueMail(db()) }),
    worker({ queue: QUEUES.reviewSweep.name, pollingIntervalSeconds: 5, canWait: true, run: () => sweepAllShopsIntoReview(db()) }),
    worker({ queue: QUEUES.rigReminders.name, pollingIntervalSeconds: 5, canWait: true, run: () => mailRigReminders(db()) }),
    worker<RawDeleteJobData>({ queue: QUEUES.rawDelete.name, pollingIntervalSeconds: 2, run: (job) => runRawDeleteJob(db(), job.data) }),
    worker({ queue: QUEUES.rawSweep.name, pollingIntervalSeconds: 5, canWait: true, run: () => sweepOrphanRawFiles(db(), { safeAgeSeconds: env().RAW_SWEEP_SAFE_AGE_SECONDS }) }),
  ];
}

export function scheduleSpecs(): ScheduleSpec[] {
  return [
    { queue: QUEUES.mailSweep.name, cron: "* * * * *" },
    { queue: QUEUES.reviewSweep.name, cron: "* * * * *" },
    { queue: QUEUES.rawSweep.name, cron: "*/10 * * * *" },
    { queue: QUEUES.rigReminders.name, cron: env().RIG_REMINDER_CRON },
  ];
}

/** Start this process's runner with every queue and schedule. */
export function startJobs(role: RunnerRole): Promise<JobRunner> {
  return startJobRunner(role, workerSpecs(), scheduleSpecs());
}
