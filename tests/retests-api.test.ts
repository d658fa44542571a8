/**
 * POST /api/vacuum-tests/:id/retests — the re-test log of a sent-back test, end to end against the real
 * database, the real S3 fake and the real SMTP catcher. Status codes per RFC 9110 (§15.3.2 201,
 * §15.5.4 403, §15.5.5 404, §15.5.10 409, §15.5.21 422, §15.6.4 503); Idempotency-Key as in the
 * IETF httpapi draft "The Idempotency-Key HTTP Header Field". Invented data.
 */
import { afterEach, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { POST as retestPost } from "@/app/api/vacuum-tests/[id]/retests/route";
import { POST as reviewPost } from "@/app/api/vacuum-tests/[id]/review/route";
import { GET as detailGet } from "@/app/api/vacuum-tests/[id]/route";
import { db } from "@/db/client";
import { setRetestFaultForTests } from "@/lib/review/retest";
import { crewForFile, jsonInit } from "./helpers/crew";
import { jobRunnerForFile } from "./helpers/jobs";
import { waitForMail } from "./helpers/mailbox";
import { addMember, appRequest, createShop, routeParams, type TestMember } from "./helpers/members";
import { POST as uploadPost } from "@/app/api/vacuum-tests/route";
import { listKeys, sampleText, sha256, uploadRequest } from "./helpers/uploads";
import { seedTest } from "./helpers/seed-test";

const PASS = "sample-1-iso-microns.csv"; // a pass per fixtures/samples/EXPECTED.md
const BAD_TIME = readFileSync(path.resolve(import.meta.dirname, "../fixtures/bad/bad-time.csv"), "utf8");
const crew = crewForFile();
jobRunnerForFile();

afterEach(() => setRetestFaultForTests(null));

async function sentBackTest(tech: TestMember, lead: TestMember, title: string): Promise<string> {
  const id = await seedTest(tech, { verdict: "leak", title });
  const res = await reviewPost(appRequest(`/api/vacuum-tests/${id}/review`, jsonInit(lead, { action: "send_back", note: "Pull down again and hold 15 minutes." })), routeParams({ id }));
  expect(res.status).toBe(200);
  return id;
}

async function retest(id: string, as: TestMember, file: { body: string; name: string }, opts: { note?: string; key?: string } = {}) {
  const req = uploadRequest(`/api/vacuum-tests/${id}/retests`, {
    as, file, fields: opts.note ? { note: opts.note } : {}, headers: opts.key ? { "idempotency-key": opts.key } : {},
  });
  const res = await retestPost(req, routeParams({ id }));
  return { status: res.status, body: await res.json() };
}

/** What the database holds for one test: status, analyses (version order), uploads, audit kinds, outbox rows. */
async function stateOf(id: string) {
  const one = async <T extends Record<string, unknown>>(q: ReturnType<typeof sql>) => (await db().execute<T>(q)).rows;
  const [t] = await one<{ status: string; current_analysis_id: string | null }>(sql`select status, current_analysis_id from vacuum_tests where id = ${id}`);
  return {
    status: t.status,
    currentAnalysisId: t.current_analysis_id,
    analyses: (await one<{ id: string; version: number }>(sql`select id, version from analyses where test_id = ${id} order by version`)).map((r) => r.version),
    uploads: (await one<{ sha256: string; object_key: string }>(sql`select sha256, object_key from uploads where test_id = ${id}`)),
    events: (await one<{ kind: string }>(sql`select kind from test_events where test_id = ${id} order by created_at, id`)).map((r) => r.kind),
    outbox: (await one<{ n: number }>(sql`select count(*)::int as n from mail_outbox where test_id = ${id}`))[0].n,
  };
}

describe("POST /api/vacuum-tests/:id/retests", () => {
  it("stores the re-test log, makes analysis version 2 current (version 1 kept), resubmits and e-mails the lead (201, RFC 9110 §15.3.2)", async () => {
    const { technician: tech, lead } = crew;
    const id = await sentBackTest(tech, lead, "Dental office rooftop unit");
    const text = sampleText(PASS);
    const r = await retest(id, tech, { body: text, name: PASS }, { note: "Replaced the hose gasket.", key: randomUUID() });
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ version: 2, status: "waiting_review" });
    expect(r.body.analysis.verdict).toBe("pass");
    expect(r.body.test.status).toBe("waiting_review");

    const s = await stateOf(id);
    expect(s.status).toBe("waiting_review");
    expect(s.currentAnalysisId).toBe(r.body.analysisId);
    expect(s.analyses).toEqual([1, 2]);
    expect(s.events.slice(-1)).toEqual(["retest_uploaded"]);
    // The raw file as sent: SHA-256 recorded, stored under the organization's prefix beside the test.
    expect(s.uploads).toHaveLength(1);
    expect(s.uploads[0].sha256).toBe(sha256(text));
    expect(s.uploads[0].object_key.startsWith(`orgs/${tech.organizationId}/tests/${id}/retests/`)).toBe(true);
    expect(await listKeys(`orgs/${tech.organizationId}/tests/${id}/`)).toEqual([s.uploads[0].object_key]);

    const detail = await (await detailGet(appRequest(`/api/vacuum-tests/${id}`, { as: tech }), routeParams({ id }))).json();
    expect(detail.history.map((h: { version: number }) => h.version)).toEqual([1, 2]);
    expect(detail.upload.sha256).toBe(sha256(text));

    const mail = await waitForMail(lead.email, /Re-test to review: Dental office rooftop unit/);
    expect(mail.text).toContain(tech.name);
    expect(mail.text).toContain("Replaced the hose gasket.");
    expect(mail.text).toContain(`/vacuum-tests/${id}`);
  });

  it("answers 422 with the importer's message for an unreadable log and changes nothing (no analysis, no upload, no object)", async () => {
    const { technician: tech, lead } = crew;
    const id = await sentBackTest(tech, lead, "Bad re-test log");
    const before = await stateOf(id);
    const r = await retest(id, tech, { body: BAD_TIME, name: "bad-time.csv" }, { key: randomUUID() });
    expect(r.status).toBe(422);
    expect(r.body.error.message).toMatch(/line \d+/i);
    expect(await stateOf(id)).toEqual(before);
    expect(before.status).toBe("sent_back");
    expect(await listKeys(`orgs/${tech.organizationId}/tests/${id}/`)).toEqual([]);
  });

  it("answers a retry with the same Idempotency-Key with the same analysis: 201 then 200, one upload, one object", async () => {
    const { technician: tech, lead } = crew;
    const id = await sentBackTest(tech, lead, "Retried re-test");
    const key = randomUUID();
    const first = await retest(id, tech, { body: sampleText(PASS), name: PASS }, { key });
    const again = await retest(id, tech, { body: sampleText(PASS), name: PASS }, { key });
    expect([first.status, again.status]).toEqual([201, 200]);
    expect(again.body.analysisId).toBe(first.body.analysisId);
    expect(again.body.version).toBe(2);
    const s = await stateOf(id);
    expect(s.analyses).toEqual([1, 2]);
    expect(s.uploads).toHaveLength(1);
    expect(s.events.filter((k) => k === "retest_uploaded")).toHaveLength(1);
    expect(await listKeys(`orgs/${tech.organizationId}/tests/${id}/`)).toHaveLength(1);
  });

  it("refuses a new upload that reuses a re-test's Idempotency-Key (422 naming the header, IETF Idempotency-Key draft §2.7); nothing new saved", async () => {
    const { technician: tech, lead } = crew;
    const id = await sentBackTest(tech, lead, "Key spent on a re-test");
    const key = randomUUID();
    expect((await retest(id, tech, { body: sampleText(PASS), name: PASS }, { key })).status).toBe(201);
    const before = await db().execute<{ n: number }>(sql`select count(*)::int as n from vacuum_tests where organization_id = ${tech.organizationId}`);
    const res = await uploadPost(uploadRequest("/api/vacuum-tests", { as: tech, file: { body: sampleText(PASS), name: PASS }, headers: { "idempotency-key": key } }));
    expect(res.status).toBe(422);
    expect((await res.json()).error.message).toMatch(/^Idempotency-Key: .*different request/);
    const after = await db().execute<{ n: number }>(sql`select count(*)::int as n from vacuum_tests where organization_id = ${tech.organizationId}`);
    expect(after.rows[0].n).toBe(before.rows[0].n);
  });

  it("keeps one re-test when three identical requests race (losers roll back and delete their objects)", async () => {
    const { technician: tech, lead } = crew;
    const id = await sentBackTest(tech, lead, "Raced re-test");
    const key = randomUUID();
    const all = await Promise.all([0, 1, 2].map(() => retest(id, tech, { body: sampleText(PASS), name: PASS }, { key })));
    expect(all.filter((r) => r.status === 201)).toHaveLength(1);
    expect(all.every((r) => r.status === 201 || r.status === 200)).toBe(true);
    expect(new Set(all.map((r) => r.body.analysisId)).size).toBe(1);
    const s = await stateOf(id);
    expect(s.analyses).toEqual([1, 2]);
    expect(await listKeys(`orgs/${tech.organizationId}/tests/${id}/`)).toHaveLength(1);
  });

  it("refuses a trainer who is not the technician (403), another technician (404, not visible) and another shop (404); nothing changes", async () => {
    const { technician: tech, lead, trainer } = crew;
    const id = await sentBackTest(tech, lead, "Not yours");
    const before = await stateOf(id);
    const otherTech = await addMember(tech.organizationId, "technician");
    const otherShop = await createShop();
    const file = { body: sampleText(PASS), name: PASS };
    expect((await retest(id, trainer, file)).status).toBe(403);
    expect((await retest(id, otherTech, file)).status).toBe(404);
    expect((await retest(id, otherShop, file)).status).toBe(404);
    expect(await stateOf(id)).toEqual(before);
    expect(await listKeys(`orgs/${tech.organizationId}/tests/${id}/`)).toEqual([]);
  });

  it("lets a lead upload the re-test (tests.review) and refuses a test that is not sent back with 409", async () => {
    const { technician: tech, lead } = crew;
    const id = await sentBackTest(tech, lead, "Lead re-tests");
    expect((await retest(id, lead, { body: sampleText(PASS), name: PASS })).status).toBe(201);
    const again = await retest(id, lead, { body: sampleText(PASS), name: PASS });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/waiting for review/);
    expect((await stateOf(id)).analyses).toEqual([1, 2]);
  });

  it("leaves no orphan object and no change when the transaction fails (503, compensation)", async () => {
    const { technician: tech, lead } = crew;
    const id = await sentBackTest(tech, lead, "Database trouble");
    const before = await stateOf(id);
    setRetestFaultForTests(async (tx) => {
      // The database goes away mid-transaction: the server ends this very connection.
      await tx.execute(sql`select pg_terminate_backend(pg_backend_pid())`);
    });
    const r = await retest(id, tech, { body: sampleText(PASS), name: PASS });
    expect(r.status).toBe(503);
    expect(await stateOf(id)).toEqual(before);
    expect(await listKeys(`orgs/${tech.organizationId}/tests/${id}/`)).toEqual([]);
  });
});
