/**
 * A new visit (job) made with the upload: POST /api/vacuum-tests with newJob creates the job in the
 * upload's own transaction and links the test to it. Real database, real S3 fake, no mocks.
 * Status codes per RFC 9110 (§15.3.2 201, §15.5.1 400, §15.5.4 403).
 */
import { afterEach, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { POST as testsPost } from "@/app/api/vacuum-tests/route";
import { GET as detailGet } from "@/app/api/vacuum-tests/[id]/route";
import { db } from "@/db/client";
import { createSite } from "@/db/queries/records";
import { setUploadFaultForTests } from "@/lib/vacuum-tests/upload";
import { crewForFile } from "./helpers/crew";
import { appRequest, createShop, routeParams, type TestMember } from "./helpers/members";
import { countRows, listKeys, sampleText, uploadRequest } from "./helpers/uploads";

const SAMPLE = "sample-1-iso-microns.csv";
const crew = crewForFile();

async function post(as: TestMember, fields: Record<string, string>, headers: Record<string, string> = {}) {
  const res = await testsPost(uploadRequest("/api/vacuum-tests", { as, file: { body: sampleText(SAMPLE), name: SAMPLE }, fields, headers }));
  return { status: res.status, body: await res.json() };
}

async function jobsOf(organizationId: string) {
  const r = await db().execute<{ id: string; visited_on: string; reason: string | null; technician_id: string | null; site_id: string | null; system_id: string | null }>(
    sql`select id, visited_on::text, reason, technician_id, site_id, system_id from jobs where organization_id = ${organizationId} order by created_at`,
  );
  return r.rows;
}

afterEach(() => setUploadFaultForTests(null));

describe("POST /api/vacuum-tests with newJob", () => {
  it("creates the visit today for the uploader at the new site and system, and the test shows it (201, RFC 9110 §15.3.2)", async () => {
    const tech = crew.technician;
    const before = (await jobsOf(tech.organizationId)).length;
    const r = await post(tech, { newSiteName: "Harbor Bakery (invented)", newSystemName: "Walk-in cooler", newJob: "true", newJobReason: "Leak repair", newJobVisitedOn: "2031-04-09" });
    expect(r.status).toBe(201);
    const jobs = await jobsOf(tech.organizationId);
    expect(jobs.length - before).toBe(1);
    const job = jobs[jobs.length - 1];
    expect(job).toMatchObject({ visited_on: "2031-04-09", reason: "Leak repair", technician_id: tech.userId });
    expect(job.site_id).toBe(r.body.test.site.id);
    expect(job.system_id).toBe(r.body.test.system.id);
    expect(r.body.test.job).toEqual({ id: job.id, reference: null, visitedOn: "2031-04-09", reason: "Leak repair" });
    const detail = await detailGet(appRequest(`/api/vacuum-tests/${r.body.test.id}`, { as: tech }), routeParams({ id: r.body.test.id }));
    expect((await detail.json()).test.job.id).toBe(job.id);
  });

  it("dates the visit by the test when no date is sent (UTC calendar day of testedAt)", async () => {
    const r = await post(crew.lead, { newJob: "true", testedAt: "2030-02-03T23:30:00-05:00" });
    expect(r.status).toBe(201);
    // 23:30 at −05:00 is 04:30 UTC on the 4th.
    expect(r.body.test.job).toMatchObject({ visitedOn: "2030-02-04", reason: null });
  });

  it("makes exactly one job for a retried upload with the same Idempotency-Key (201 then 200)", async () => {
    const tech = crew.technician;
    const key = randomUUID();
    const before = (await jobsOf(tech.organizationId)).length;
    const first = await post(tech, { newJob: "true", newJobReason: "Install" }, { "idempotency-key": key });
    const retry = await post(tech, { newJob: "true", newJobReason: "Install" }, { "idempotency-key": key });
    expect([first.status, retry.status]).toEqual([201, 200]);
    expect(retry.body.test.job.id).toBe(first.body.test.job.id);
    expect((await jobsOf(tech.organizationId)).length - before).toBe(1);
  });

  it("makes one job when three identical requests race on the key (losers roll back their job)", async () => {
    const tech = crew.technician;
    const key = randomUUID();
    const before = (await jobsOf(tech.organizationId)).length;
    const all = await Promise.all([0, 1, 2].map(() => post(tech, { newJob: "true" }, { "idempotency-key": key })));
    expect(new Set(all.map((r) => r.body.test?.job?.id)).size).toBe(1);
    expect((await jobsOf(tech.organizationId)).length - before).toBe(1);
  });

  it("answers 400 naming newJob when jobId is given too (RFC 9110 §15.5.1), and saves nothing", async () => {
    const tech = crew.technician;
    const before = await countRows(tech.organizationId);
    const jobsBefore = (await jobsOf(tech.organizationId)).length;
    const r = await post(tech, { jobId: randomUUID(), newJob: "true" });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/^newJob: give either jobId or newJob/);
    const reason = await post(tech, { newJobReason: "Service" });
    expect(reason.status).toBe(400);
    expect(reason.body.error.message).toMatch(/^newJobReason:/);
    expect(await countRows(tech.organizationId)).toEqual(before);
    expect((await jobsOf(tech.organizationId)).length).toBe(jobsBefore);
  });

  it("refuses an apprentice's newJob with 403 naming newJob (records.manage is owner, lead, technician) and stores nothing", async () => {
    const a = crew.apprentice;
    const before = await countRows(a.organizationId);
    const r = await post(a, { newJob: "true" });
    expect(r.status).toBe(403);
    expect(r.body.error.message).toMatch(/^newJob:/);
    expect(await countRows(a.organizationId)).toEqual(before);
    // Without newJob the same apprentice uploads as before.
    expect((await post(a, {})).status).toBe(201);
  });

  it("answers 400 for another organization's siteId and keeps no test, job or file", async () => {
    const other = await createShop();
    const foreign = await createSite(db(), { organizationId: other.organizationId, name: "Somewhere else (invented)" });
    const tech = crew.technician;
    const before = await countRows(tech.organizationId);
    const jobsBefore = (await jobsOf(tech.organizationId)).length;
    const keysBefore = await listKeys(`orgs/${tech.organizationId}/`);
    const r = await post(tech, { siteId: foreign.id, newJob: "true" });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/^siteId:/);
    expect(await countRows(tech.organizationId)).toEqual(before);
    expect((await jobsOf(tech.organizationId)).length).toBe(jobsBefore);
    expect(await listKeys(`orgs/${tech.organizationId}/`)).toEqual(keysBefore);
    expect(await jobsOf(other.organizationId)).toEqual([]);
  });

  it("leaves no orphan job when the upload transaction fails after the job was made (503, compensation)", async () => {
    const tech = crew.technician;
    const jobsBefore = (await jobsOf(tech.organizationId)).length;
    const keysBefore = await listKeys(`orgs/${tech.organizationId}/`);
    setUploadFaultForTests(async (tx) => {
      // The database goes away mid-transaction: the server ends this very connection.
      await tx.execute(sql`select pg_terminate_backend(pg_backend_pid())`);
    });
    const r = await post(tech, { newJob: "true", newJobReason: "Coil change" });
    expect(r.status).toBe(503);
    expect((await jobsOf(tech.organizationId)).length).toBe(jobsBefore);
    expect(await listKeys(`orgs/${tech.organizationId}/`)).toEqual(keysBefore);
  });
});
