/**
 * The app server killed (SIGKILL) in the middle of a burst of uploads, then started again: every
 * upload that was confirmed (201) is there with its file intact; no test is half-written; a retry
 * of each unconfirmed upload with its Idempotency-Key makes its test exactly once. Files the store
 * took for transactions that never committed are listed (the orphan sweep removes them) and none
 * belongs to a test. Then two servers at once: better-auth's rate limit is counted in PostgreSQL,
 * so both see the same count, and a client's own X-Forwarded-For is not believed.
 * Runs the production build in .next (`next build` first). OWASP ASVS 4.0.3 V11.1.7, V2.2.1.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { randomUUID } from "node:crypto";
import { openSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { simulateLog } from "@/analysis/decay/simulate";
import { db } from "@/db/client";
import { env } from "@/lib/env";
import { createShop, type TestMember } from "../helpers/members";
import { consistencyOf, until } from "./parts";

const ROOT = path.resolve(import.meta.dirname, "../..");
const LOGS = process.env.FAULTS_PROFILE_ROOT ?? path.join(ROOT, ".data/faults");
const BASE = env().BETTER_AUTH_URL;
const PORT = Number(new URL(BASE).port);
const OTHER = `http://127.0.0.1:${PORT + 1}`;
const servers = new Set<ChildProcess>();

async function startServer(name: string, port: number, extra: Record<string, string> = {}): Promise<ChildProcess> {
  const out = openSync(path.join(LOGS, `${name}.log`), "a");
  const child = spawn(path.join(ROOT, "node_modules/.bin/next"), ["start", "-H", "127.0.0.1", "-p", String(port)], {
    cwd: ROOT, env: { ...process.env, ...extra }, stdio: ["ignore", out, out], detached: true,
  });
  servers.add(child);
  child.on("exit", () => servers.delete(child));
  await until(async () => (await fetch(`http://127.0.0.1:${port}/api/health`).catch(() => null))?.status === 200, 60_000, `${name} to answer`);
  return child;
}

function kill(child: ChildProcess, signal: NodeJS.Signals = "SIGTERM") {
  try {
    process.kill(-child.pid!, signal); // its whole process group
  } catch {
    /* already gone */
  }
}

afterAll(async () => {
  for (const s of servers) kill(s, "SIGKILL");
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

let tech: TestMember;
beforeAll(async () => {
  tech = await createShop("Killed Server Cooling");
});

/** A three-hour 1 Hz log (about 200 kB): long enough that a burst of them is still being saved when the server dies. */
const LOG = simulateLog({ scenario: "leak", seed: 23, sampleSeconds: 1, startInHold: true, holdMinutes: 180, layout: "iso" }).text;

type Outcome = { key: string; status: number | null; testId?: string };

async function upload(base: string, key: string): Promise<Outcome> {
  const form = new FormData();
  form.set("file", new File([LOG], "three-hours.csv", { type: "text/csv" }));
  try {
    const res = await fetch(`${base}/api/vacuum-tests`, { method: "POST", body: form, headers: { cookie: tech.cookie, origin: BASE, "idempotency-key": key } });
    const body = await res.json().catch(() => ({}));
    return { key, status: res.status, testId: body?.test?.id };
  } catch {
    return { key, status: null }; // the connection died with the server
  }
}

describe("the app server killed in the middle of uploads", () => {
  it("keeps every confirmed upload whole, leaves nothing half-written, and a retry with the same key makes each test once", async () => {
    let server = await startServer("server-killed", PORT);
    const keys = Array.from({ length: 12 }, () => randomUUID());
    let firstAnswer: () => void = () => {};
    const answered = new Promise<void>((r) => (firstAnswer = r));
    const inFlight = keys.map((k) => upload(BASE, k).then((o) => (firstAnswer(), o)));
    await Promise.race([answered, new Promise((r) => setTimeout(r, 4000))]);
    kill(server, "SIGKILL");
    const outcomes = await Promise.all(inFlight);
    // Confirmed: the whole answer arrived. A 201 whose body the kill cut off is not a confirmation.
    const confirmed = outcomes.filter((o) => o.status === 201 && o.testId);
    const lost = outcomes.filter((o) => !(o.status === 201 && o.testId));
    expect(lost.length, "the kill came after every upload had finished: nothing was in the middle").toBeGreaterThan(0);

    server = await startServer("server-restarted", PORT);
    const after = await consistencyOf(tech.organizationId);
    expect(after.halfWritten).toEqual([]);
    expect(after.brokenFiles).toEqual([]);
    const committed = await db().execute<{ id: string }>(sql`select id from vacuum_tests where organization_id = ${tech.organizationId}`);
    const committedIds = new Set(committed.rows.map((r) => r.id));
    for (const c of confirmed) expect(committedIds.has(c.testId!), `confirmed test ${c.testId} is there`).toBe(true);
    // Files stored for transactions the kill cut short belong to no test.
    for (const key of after.orphanObjects) expect(committedIds.has(key.split("/")[3])).toBe(false);
    console.log(`server kill: ${confirmed.length} confirmed, ${lost.length} cut off, ${committedIds.size} committed, ${after.orphanObjects.length} orphan files`);

    // Every upload sent again with its own key: the confirmed ones answer 200 with the same test.
    const retried = await Promise.all(keys.map((k) => upload(BASE, k)));
    for (const r of retried) expect([200, 201]).toContain(r.status);
    for (const c of confirmed) expect(retried.find((r) => r.key === c.key)?.testId).toBe(c.testId);
    const final = await consistencyOf(tech.organizationId);
    expect(final.tests).toBe(keys.length);
    expect(final).toMatchObject({ halfWritten: [], brokenFiles: [] });
    kill(server);
    await until(() => servers.size === 0, 20_000, "the server to stop");
  });
});

describe("two app servers, one rate limit (kept in PostgreSQL)", () => {
  it("counts sign-in attempts from one client across both servers, whatever X-Forwarded-For the client claims", async () => {
    const extra = { AUTH_RATE_LIMIT: "on", TRUSTED_ORIGINS: OTHER };
    const [a, b] = await Promise.all([startServer("server-a", PORT, extra), startServer("server-b", PORT + 1, extra)]);
    await db().execute(sql`delete from rate_limit`);
    const attempt = (base: string, n: number) =>
      fetch(`${base}/api/auth/sign-in/email`, {
        method: "POST",
        headers: { "content-type": "application/json", origin: base, "x-forwarded-for": `203.0.113.${n}` },
        body: JSON.stringify({ email: tech.email, password: `not-the-password-${n}` }),
      }).then((r) => r.status);
    const statuses = [await attempt(BASE, 1), await attempt(OTHER, 2), await attempt(BASE, 3), await attempt(OTHER, 4)];
    expect(statuses).toEqual([401, 401, 401, 429]);
    const rows = await db().execute<{ key: string; count: number }>(sql`select key, count from rate_limit where key like '%/sign-in/email'`);
    expect(rows.rows.map((r) => r.key)).toEqual(["127.0.0.1|/sign-in/email"]); // the TCP peer, not 203.0.113.x
    kill(a);
    kill(b);
    await until(() => servers.size === 0, 20_000, "both servers to stop");
  });
});
