/** The test file's own job runner: real pg-boss on the test database, in this process's schema (tests/setup-jobs.ts). */
import { afterAll, beforeAll } from "vitest";
import type PgBoss from "pg-boss";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { env } from "@/lib/env";
import type { JobRunner } from "@/lib/jobs/runner";
import { startJobs } from "@/lib/jobs/workers";

/** Registers beforeAll/afterAll that start and stop a runner of every queue (no schedules). */
export function jobRunnerForFile(): { runner: () => JobRunner } {
  let runner: JobRunner | null = null;
  beforeAll(async () => {
    runner = await startJobs("test");
  });
  afterAll(async () => {
    await runner?.stop({ timeoutMs: 5000 });
  });
  return { runner: () => runner! };
}

/** Jobs of a queue in this process's schema by state (created, retry, active, completed, failed …). */
export async function jobStates(queue: string): Promise<Record<string, number>> {
  const schema = env().JOBS_SCHEMA;
  const rows = await db().execute<{ state: string; n: number }>(sql`select state::text as state, count(*)::int as n from ${sql.identifier(schema)}.job where name = ${queue} group by state`);
  return Object.fromEntries(rows.rows.map((r) => [r.state, r.n]));
}

export type { PgBoss };
