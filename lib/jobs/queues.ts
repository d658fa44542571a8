/**
 * Every queue of Riseline's background work, with its retry, expiry and dead-letter settings.
 *
 * `expireInSeconds` is how long a job may stay active: a server killed while it held a job leaves
 * it active, and pg-boss's maintenance (every MAINTENANCE_SECONDS, lib/jobs/runner.ts) puts it back
 * for another try once that time has passed. So a short expiry is what brings work back soon after
 * a crash, and each handler is kept well inside it (the mail send has its own shorter limit).
 * The sweeps may run twice at once harmlessly (each step checks the row it changes), so they are
 * not singletons: a sweep that died with its server never holds the next one back.
 */
import type PgBoss from "pg-boss";

interface QueueSpec {
  name: string;
  options: Omit<PgBoss.Queue, "name">;
}

export const QUEUES = {
  /** One job per change: deliver its outbox rows (lib/notify/delivery.ts). Retries here cover a handler that could not run at all (database gone); SMTP failures schedule their own next attempt. */
  mail: { name: "mail-delivery", options: { retryLimit: 8, retryDelay: 5, retryBackoff: true, expireInSeconds: 30, deadLetter: "mail-dead-letter" } },
  /** Jobs whose retries ran out: their unsent rows are marked "gave up" for the Mail page. */
  mailDeadLetter: { name: "mail-dead-letter", options: { retryLimit: 20, retryDelay: 30, expireInSeconds: 60 } },
  /** Unsent rows far past their next try (no live job: say, queued before the queue existed) get a job again (lib/notify/sweep.ts). */
  mailSweep: { name: "mail-sweep", options: { retryLimit: 1, retryDelay: 30, expireInSeconds: 120 } },
  /** Raw files in storage that no committed test references, older than the safe age (lib/jobs/raw-sweep.ts). */
  rawSweep: { name: "raw-file-sweep", options: { retryLimit: 2, retryDelay: 60, expireInSeconds: 300 } },
  /** A raw file an upload stored (or tried to) without committing its test: deleted again in case the store wrote it late (lib/jobs/raw-delete.ts). */
  rawDelete: { name: "raw-file-delete", options: { retryLimit: 8, retryDelay: 2, retryBackoff: true, expireInSeconds: 60 } },
  /** New tests that should be in the lead's queue but are not (lib/review/sweep.ts). */
  reviewSweep: { name: "review-sweep", options: { retryLimit: 1, retryDelay: 30, expireInSeconds: 300 } },
  /** Rig upkeep reminders by e-mail (lib/rigs/reminder-mail.ts): one at a time, as two runs at once could both mail a new reminder. */
  rigReminders: { name: "rig-reminders", options: { policy: "singleton", retryLimit: 3, retryDelay: 300, expireInSeconds: 600 } },
  /** A large log stored by the upload, analysed and saved as a test (lib/vacuum-tests/log-job.ts). */
  logAnalysis: { name: "log-analysis", options: { retryLimit: 3, retryDelay: 10, retryBackoff: true, expireInSeconds: 300 } },
  /** Re-analysis of many tests, a chunk per job (lib/vacuum-tests/bulk-reanalysis.ts). */
  bulkReanalysis: { name: "bulk-reanalysis", options: { retryLimit: 5, retryDelay: 10, retryBackoff: true, expireInSeconds: 300 } },
} as const satisfies Record<string, QueueSpec>;

export type QueueName = (typeof QUEUES)[keyof typeof QUEUES]["name"];
