/**
 * Two `next start` servers over one PostgreSQL and one S3 fake, each running the background jobs
 * in-process (no separate worker), and the faults a shop's network meets: a server killed in the
 * middle of a burst while commits are slow, the mail server down, the database down. After each:
 * every confirmed upload stored once, every review e-mail delivered once (Message-ID counted in
 * the catcher) within a minute of the part coming back with nobody pressing anything, every job
 * finished, no orphan raw file once the sweeper has run (with a short safe age here). Real parts
 * throughout; the servers are the production build. Prints the figures docs/SCALING.md quotes.
 */
import { randomUUID } from "node:crypto";
import { execFileSync } from "node:child_process";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { mailOutbox, uploads, vacuumTests } from "@/db/schema";
import { env } from "@/lib/env";
import { ensureJobStore, sendJob } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";
import { crewForFile } from "../helpers/crew";
import { listKeys, sampleText } from "../helpers/uploads";
import { Catcher, percentile, request, serverUrls, startServer, stopServer, uploadBody, type Server } from "./cluster";

const crew = crewForFile();
const LEAK = sampleText("sample-2-elapsed-mtorr.csv"); // a leak (fixtures/samples/EXPECTED.md): each upload mails the lead
const [urlA, urlB] = serverUrls(2);
const catcher = new Catcher(env().SMTP_PORT + 1);
const serverEnv = () => ({
  SMTP_PORT: String(catcher.port),
  JOBS_SCHEMA: env().JOBS_SCHEMA,
  RAW_SWEEP_SAFE_AGE_SECONDS: "20",
  TRUSTED_ORIGINS: [urlA, urlB].join(","),
});
let a: Server;
let b: Server;
const figures: string[] = [];
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
/** Whose PostgreSQL the database fault stops and starts (scripts/services.sh profile). */
const PROFILE = process.env.CLUSTER_SERVICES_PROFILE ?? "test";

beforeAll(async () => {
  await ensureJobStore();
  await catcher.up();
  [a, b] = await Promise.all([startServer("A", urlA, serverEnv()), startServer("B", urlB, serverEnv())]);
}, 120_000);

it("each server runs the background jobs itself (no worker in this test)", async () => {
  for (const s of [a, b]) await expect.poll(async () => (await request(s, "/api/health", {})).json.jobs, { timeout: 30_000 }).toBe("running");
});

afterAll(async () => {
  await Promise.all([a, b].filter(Boolean).map((s) => stopServer(s, "SIGTERM")));
  await catcher.down();
  console.log(`\n  Two servers, one database — figures\n${figures.map((f) => `   • ${f}`).join("\n")}\n`);
}, 60_000);

interface Burst {
  testIds: Map<string, string>;
  latencies: number[];
  retries: number;
  ms: number;
}

/**
 * Upload `n` leak logs, each with its own Idempotency-Key, `perServer` at a time on each live
 * server; a failed attempt (connection cut, 5xx) is sent again with the same key to a live server.
 */
async function burst(n: number, prefix: string, live: () => Server[], perServer = 10, onConfirmed?: (count: number) => void): Promise<Burst> {
  const out: Burst = { testIds: new Map(), latencies: [], retries: 0, ms: 0 };
  const t0 = performance.now();
  let next = 0;
  const one = async (i: number) => {
    const key = randomUUID();
    const { body, contentType } = await uploadBody(LEAK, `${prefix} ${i}`);
    for (let attempt = 0; ; attempt++) {
      const servers = live();
      const s = servers[(i + attempt) % servers.length];
      try {
        const res = await request(s, "/api/vacuum-tests", { method: "POST", body, headers: { cookie: crew.technician.cookie, "content-type": contentType, "idempotency-key": key } });
        if (res.status === 201 || res.status === 200) {
          out.testIds.set(key, (res.json.test as { id: string }).id);
          out.latencies.push(res.ms);
          onConfirmed?.(out.testIds.size);
          return;
        }
        if (res.status < 500) throw new Error(`upload ${i}: ${res.status} ${JSON.stringify(res.json).slice(0, 200)}`);
      } catch (err) {
        if (String(err).includes("upload ")) throw err;
      }
      out.retries++;
      if (attempt > 20) throw new Error(`upload ${i} never confirmed`);
      await sleep(250);
    }
  };
  const lanes = Array.from({ length: perServer * live().length }, async () => {
    while (next < n) await one(next++);
  });
  await Promise.all(lanes);
  out.ms = performance.now() - t0;
  return out;
}

const org = () => crew.owner.organizationId;

/** The server, or a new one on its address if it is not running (an earlier test failed before restarting it). */
async function running(s: Server): Promise<Server> {
  return s.proc.exitCode === null && s.proc.signalCode === null ? s : startServer(s.name, s.url, serverEnv());
}

async function outboxOf(titlePrefix: string) {
  return db()
    .select({ id: mailOutbox.id, status: mailOutbox.status, sentAt: mailOutbox.sentAt })
    .from(mailOutbox)
    .innerJoin(vacuumTests, eq(vacuumTests.id, mailOutbox.testId))
    .where(and(eq(mailOutbox.organizationId, org()), sql`${vacuumTests.title} like ${`${titlePrefix} %`}`));
}

/** Waits until every review e-mail of the burst is sent; returns when (ms since epoch). */
async function allSent(titlePrefix: string, expected: number, timeoutMs: number): Promise<number> {
  await expect
    .poll(async () => {
      const rows = await outboxOf(titlePrefix);
      return rows.length === expected && rows.every((r) => r.status === "sent");
    }, { timeout: timeoutMs, interval: 250 })
    .toBe(true);
  return Date.now();
}

/** Each row's Message-ID in the catcher exactly once. Returns the number of hand-overs the catcher saw. */
async function expectDeliveredOnce(titlePrefix: string, expected: number) {
  const rows = await outboxOf(titlePrefix);
  expect(rows).toHaveLength(expected);
  const domain = /@([^>\s]+)>?\s*$/.exec(env().MAIL_FROM)?.[1];
  const counts = new Map<string, number>();
  for (const m of catcher.messages) counts.set(m.messageId, (counts.get(m.messageId) ?? 0) + 1);
  const perRow = rows.map((r) => counts.get(`<outbox-${r.id}@${domain}>`) ?? 0);
  expect(perRow.filter((c) => c !== 1)).toEqual([]);
  return perRow.reduce((x, y) => x + y, 0);
}

async function openJobs(queue: string): Promise<number> {
  const res = await db().execute<{ n: number }>(sql`select count(*)::int as n from ${sql.identifier(env().JOBS_SCHEMA)}.job where name = ${queue} and state < 'completed'`);
  return res.rows[0].n;
}

async function orphanKeys(): Promise<string[]> {
  const stored = await listKeys(`orgs/${org()}/`);
  const committed = new Set((await db().select({ key: uploads.objectKey }).from(uploads).where(eq(uploads.organizationId, org()))).map((r) => r.key));
  return stored.filter((k) => !committed.has(k));
}

describe("two servers over one database, and their faults (our goals)", () => {
  it("200 uploads across both, one server killed mid-burst while commits are slow: stored once, mailed once, every job finished by the survivor, no orphan file after the sweep", async () => {
    let killedAt = 0;
    let bDead = false;
    let killing: Promise<void> | null = null;
    const lock = new pg.Client({ connectionString: env().DATABASE_URL });
    await lock.connect();
    const killMidBurst = async () => {
      // Slow commits: every upload stores its file, then waits on the uploads table.
      await lock.query("begin");
      await lock.query("lock table uploads in access exclusive mode");
      await sleep(1500);
      await stopServer(b, "SIGKILL");
      bDead = true;
      killedAt = Date.now();
      await sleep(300);
      await lock.query("commit");
    };
    const run = await burst(200, "Cluster", () => (bDead ? [a] : [a, b]), 10, (count) => {
      if (count === 100 && !killing) killing = killMidBurst();
    });
    await killing;
    await lock.end();

    // Every confirmed upload is one test with one stored file.
    expect(run.testIds.size).toBe(200);
    const tests = await db().select({ id: vacuumTests.id, title: vacuumTests.title }).from(vacuumTests).where(and(eq(vacuumTests.organizationId, org()), sql`${vacuumTests.title} like 'Cluster %'`));
    expect(tests).toHaveLength(200);
    expect(new Set(tests.map((t) => t.title)).size).toBe(200);
    expect(new Set(run.testIds.values())).toEqual(new Set(tests.map((t) => t.id)));
    const orphansBefore = await orphanKeys();
    expect(orphansBefore.length).toBeGreaterThan(0); // the killed server's uploads stored files it never committed

    // Every review e-mail delivered once, with nobody pressing a button; the killed server's jobs come back to A.
    const sentAt = await allSent("Cluster", 200, 120_000);
    const handed = await expectDeliveredOnce("Cluster", 200);
    await expect.poll(() => openJobs(QUEUES.mail.name), { timeout: 60_000, interval: 500 }).toBe(0);
    const finishedByA = await db().execute<{ n: number }>(
      sql`select count(*)::int as n from ${sql.identifier(env().JOBS_SCHEMA)}.job where name = ${QUEUES.mail.name} and state = 'completed' and completed_on > to_timestamp(${killedAt / 1000})`,
    );
    expect(finishedByA.rows[0].n).toBeGreaterThan(0);

    // The sweeper (on A, safe age 20 s here) removes the orphans and nothing else.
    await sleep(Math.max(0, killedAt + 21_000 - Date.now()));
    await sendJob(db(), QUEUES.rawSweep.name, {});
    await expect.poll(async () => (await orphanKeys()).length, { timeout: 60_000, interval: 500 }).toBe(0);
    expect(await listKeys(`orgs/${org()}/`)).toHaveLength(200);

    figures.push(
      `kill mid-burst: 200 uploads (20 at a time, then 10 on the survivor) in ${(run.ms / 1000).toFixed(1)} s, ` +
        `p50 ${percentile(run.latencies, 50).toFixed(0)} ms, p95 ${percentile(run.latencies, 95).toFixed(0)} ms, ${run.retries} attempts sent again`,
    );
    figures.push(`kill mid-burst: ${orphansBefore.length} orphan raw files left by the killed server, 0 after the sweep; all 200 e-mails sent ${((sentAt - killedAt) / 1000).toFixed(1)} s after the kill, ${handed} hand-overs for 200 messages`);
    b = await startServer("B", urlB, serverEnv()); // back for the next faults
  }, 300_000);

  it("the mail server down: the e-mails wait and retry by themselves, and all go once within a minute of its return", async () => {
    b = await running(b);
    await catcher.down();
    const downAt = Date.now();
    const run = await burst(20, "Catcher", () => [a, b], 5);
    expect(run.testIds.size).toBe(20);
    await expect.poll(async () => (await outboxOf("Catcher")).filter((r) => r.status === "failed").length, { timeout: 60_000, interval: 250 }).toBe(20);
    await sleep(10_000); // a while down: the tries go on, every 30 s at most
    expect((await outboxOf("Catcher")).some((r) => r.status === "sent")).toBe(false);
    await catcher.up();
    const backAt = Date.now();
    const sentAt = await allSent("Catcher", 20, 60_000);
    expect(sentAt - backAt).toBeLessThan(60_000);
    await expectDeliveredOnce("Catcher", 20);
    figures.push(`mail server down ${((backAt - downAt) / 1000).toFixed(0)} s around a burst of 20: all 20 e-mails sent ${((sentAt - backAt) / 1000).toFixed(1)} s after it came back`);
  }, 180_000);

  it("the database down right after a burst: the e-mails go once within a minute of its return, and both servers serve again", async () => {
    b = await running(b);
    const run = await burst(20, "Database", () => [a, b], 5);
    expect(run.testIds.size).toBe(20);
    execFileSync("bash", ["scripts/services.sh", "pg-stop", PROFILE], { stdio: "ignore" });
    const downAt = Date.now();
    await sleep(8000);
    execFileSync("bash", ["scripts/services.sh", "pg-start", PROFILE], { stdio: "ignore" });
    const backAt = Date.now();
    const sentAt = await allSent("Database", 20, 60_000);
    expect(sentAt - backAt).toBeLessThan(60_000);
    await expectDeliveredOnce("Database", 20);
    for (const s of [a, b]) await expect.poll(async () => (await request(s, "/api/health", {}).catch(() => ({ status: 0 }))).status, { timeout: 30_000 }).toBe(200);
    figures.push(`database down ${((backAt - downAt) / 1000).toFixed(0)} s right after a burst of 20: all 20 e-mails sent ${((sentAt - backAt) / 1000).toFixed(1)} s after it came back`);
  }, 180_000);
});
