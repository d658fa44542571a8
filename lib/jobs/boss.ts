/**
 * The job queue: pg-boss (a PostgreSQL-backed queue) in the database Riseline already has, in its
 * own schema (JOBS_SCHEMA, default "pgboss"), which pg-boss creates and migrates itself.
 *
 * pg-boss runs its SQL through our own pool (db/client.ts) rather than a second pool per process,
 * and a job can be sent through a transaction's connection (`executorOf(tx)`), so a change and
 * the job that follows it commit together or not at all.
 *
 *  - `jobSender()`: an instance that is never started (no timers, no polling): it only writes jobs.
 *  - `ensureJobStore()`: once per process, make sure the schema and our queues exist (idempotent;
 *    `npm run db:migrate` and every job runner do it too). Sending into a queue that does not
 *    exist would silently insert nothing, so `sendJob` refuses to go on without it.
 *  - lib/jobs/runner.ts starts the instance that polls, schedules and maintains.
 */
import PgBoss from "pg-boss";
import type { Pool } from "pg";
import { db, type Database, type Db } from "@/db/client";
import { env } from "@/lib/env";
import { QUEUES, type QueueName } from "./queues";

/** pg-boss's SQL on our pool (drizzle keeps the pool it was made with as `$client`). */
export function poolExecutor(): PgBoss.Db {
  return { executeSql: (text: string, values: unknown[]) => (db() as Database & { $client: Pool }).$client.query(text, values) };
}

/**
 * pg-boss's SQL on the caller's own connection, so a job sent here takes part in the caller's
 * transaction (or runs on the pool for `db()`). pg-boss's statements use one `$n` in several
 * places with different casts, which PostgreSQL types from its first use; so they go to the pg
 * client as they are (drizzle's session keeps that client), not rebuilt as a drizzle statement.
 */
export function executorOf(conn: Db): PgBoss.Db {
  const client = (conn as unknown as { session?: { client?: Pick<Pool, "query"> } }).session?.client;
  if (!client || typeof client.query !== "function") throw new Error("job queue: no PostgreSQL client behind this connection");
  return { executeSql: (text: string, values: unknown[]) => client.query(text, values) };
}

/** Options every instance shares: our pool, our schema. */
export function bossOptions(): PgBoss.ConstructorOptions {
  return { db: poolExecutor(), schema: env().JOBS_SCHEMA };
}

const g = globalThis as unknown as { rlJobSender?: PgBoss; rlJobStore?: Promise<void> };

/** The process's sending-only instance (never started: it writes jobs and reads them, nothing else). */
export function jobSender(): PgBoss {
  if (!g.rlJobSender) {
    g.rlJobSender = new PgBoss({ ...bossOptions(), supervise: false, schedule: false, migrate: false });
    g.rlJobSender.on("error", () => undefined); // a never-started instance emits nothing; a listener keeps it that way
  }
  return g.rlJobSender;
}

/** Create or migrate the queue's schema and our queues (idempotent; safe from several processes at once). */
export async function installJobStore(): Promise<void> {
  const installer = new PgBoss({ ...bossOptions(), supervise: false, schedule: false, migrate: true });
  installer.on("error", () => undefined);
  await installer.start();
  // A dead-letter queue first: a queue names its dead letter by foreign key.
  const specs = Object.values(QUEUES).sort((a, b) => Number("deadLetter" in a.options) - Number("deadLetter" in b.options));
  for (const q of specs) await installer.createQueue(q.name, { name: q.name, ...q.options });
  await installer.stop({ graceful: false, close: false });
}

/** installJobStore once per process; a failure is not remembered, so the next call tries again. */
export function ensureJobStore(): Promise<void> {
  g.rlJobStore ??= installJobStore().catch((err) => {
    g.rlJobStore = undefined;
    throw err;
  });
  return g.rlJobStore;
}

/**
 * Send one job, in the caller's transaction when `conn` is one. Throws if the job was not written
 * (the queue missing), so the caller's change rolls back rather than lose its follow-up.
 */
export async function sendJob(conn: Db, queue: QueueName, data: object, options: PgBoss.SendOptions = {}): Promise<string> {
  await ensureJobStore();
  const id = await jobSender().send(queue, data, { ...options, db: executorOf(conn) });
  if (!id) throw new Error(`job not queued: queue "${queue}" is missing from schema ${env().JOBS_SCHEMA}`);
  return id;
}
