/**
 * The S3 store stopped, then frozen (SIGSTOP: connections are accepted and nothing answers).
 * Every upload answers 503 within seconds instead of hanging; health says which part is down; an
 * upload abandoned by its timeout is never committed when the store wakes, and what the store
 * writes late is deleted again (by queued jobs, which this file's own runner takes); once the store is back, uploads work. The SMTP catcher runs in the
 * same process, so a frozen store is a frozen mail server too: mail waits in the outbox.
 * OWASP ASVS 4.0.3 V11.1.7 and V1.14 (resilience: calls to other services have timeouts).
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as health } from "@/app/api/health/route";
import { POST as emailReport } from "@/app/api/vacuum-tests/[id]/email-report/route";
import { POST as testsPost } from "@/app/api/vacuum-tests/route";
import { env } from "@/lib/env";
import { closeMail } from "@/lib/mail";
import { jobRunnerForFile } from "../helpers/jobs";
import { appRequest, createShop, routeParams, type TestMember } from "../helpers/members";
import { countRows, sampleText, uploadRequest } from "../helpers/uploads";
import { consistencyOf, fakes, timed, until } from "./parts";

const SAMPLE = "sample-1-iso-microns.csv";
let owner: TestMember;
// The deletes of what the frozen store writes late are jobs (lib/jobs/raw-delete.ts): this file runs them.
jobRunnerForFile();

beforeAll(async () => {
  owner = await createShop("Store Fault Refrigeration");
});
afterAll(async () => {
  closeMail();
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

const upload = (key = randomUUID()) =>
  testsPost(uploadRequest("/api/vacuum-tests", { as: owner, file: { body: sampleText(SAMPLE), name: SAMPLE }, headers: { "idempotency-key": key } }));

/** The longest an upload may take against a dead store: connect or request timeout, two attempts, and slack. */
const deadline = () => 2 * (env().S3_CONNECT_TIMEOUT_MS + env().S3_REQUEST_TIMEOUT_MS) + 3000;

describe("the S3 store stopped", () => {
  it("answers uploads 503 storage_unavailable at once and writes no row; health says the bucket is unreachable", async () => {
    const before = await countRows(owner.organizationId);
    fakes.stop();
    try {
      const r = await timed(upload);
      expect(r.value?.status).toBe(503);
      expect((await r.value!.json()).error.code).toBe("storage_unavailable");
      expect(r.ms).toBeLessThan(deadline());
      const h = await timed(() => health(new Request("http://127.0.0.1/api/health")));
      expect(h.value?.status).toBe(503);
      expect(await h.value!.json()).toMatchObject({ ok: false, database: "ok", bucket: "unreachable" });
      expect(h.ms).toBeLessThan(5000); // its own checks stop at 2 s; the rest is a busy machine
      expect(await countRows(owner.organizationId)).toEqual(before);
    } finally {
      fakes.start();
    }
    const again = await upload();
    expect(again.status).toBe(201);
    expect((await health(new Request("http://127.0.0.1/api/health"))).status).toBe(200);
  });
});

describe("the S3 store frozen (SIGSTOP)", () => {
  it("answers uploads 503 within the timeouts, commits none of them when the store wakes, deletes what it writes late, and works again", async () => {
    const before = await countRows(owner.organizationId);
    const keys = [randomUUID(), randomUUID(), randomUUID()];
    fakes.freeze();
    let results: Awaited<ReturnType<typeof timed<Response>>>[] = [];
    let healthMs = 0;
    try {
      results = await Promise.all(keys.map((k) => timed(() => upload(k))));
      const h = await timed(() => health(new Request("http://127.0.0.1/api/health")));
      healthMs = h.ms;
      expect(h.value?.status).toBe(503);
    } finally {
      fakes.thaw();
    }
    for (const r of results) {
      expect(r.value?.status).toBe(503);
      expect(r.ms).toBeLessThan(deadline());
    }
    expect(healthMs).toBeLessThan(5000);
    // The store wakes: the abandoned uploads stay abandoned, and the late writes are deleted again.
    await until(async () => (await consistencyOf(owner.organizationId)).orphanObjects.length === 0, 60_000, "late writes to be deleted");
    const after = await consistencyOf(owner.organizationId);
    expect(await countRows(owner.organizationId)).toEqual(before);
    expect(after).toMatchObject({ halfWritten: [], brokenFiles: [], orphanObjects: [] });
    // The same keys now make their tests once each.
    for (const k of keys) expect((await upload(k)).status).toBe(201);
    expect((await countRows(owner.organizationId)).tests - before.tests).toBe(keys.length);
  });

  it("keeps a report e-mail in the outbox while the mail server is frozen (the request answers; nothing lost) and sends it once it wakes", async () => {
    const created = await upload();
    const testId = (await created.json()).test.id;
    fakes.freeze();
    let r: Awaited<ReturnType<typeof timed<Response>>>;
    try {
      r = await timed(() =>
        emailReport(appRequest(`/api/vacuum-tests/${testId}/email-report`, { method: "POST", as: owner, body: JSON.stringify({ to: "office@example.test" }), headers: { "content-type": "application/json" } }), routeParams({ id: testId })),
      );
    } finally {
      fakes.thaw();
    }
    expect(r.value?.status).toBe(202);
    expect(r.ms).toBeLessThan(2 * env().SMTP_CONNECT_TIMEOUT_MS + 2 * env().SMTP_SOCKET_TIMEOUT_MS + 3000);
    const { db } = await import("@/db/client");
    const { sql } = await import("drizzle-orm");
    const rows = await db().execute<{ status: string }>(sql`select status from mail_outbox where test_id = ${testId}`);
    expect(rows.rows.length).toBe(1); // kept, whatever its state: pending, failed or already sent
  });
});
