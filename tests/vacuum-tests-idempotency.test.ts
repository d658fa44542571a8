/**
 * Idempotent uploads (Idempotency-Key header, as in the IETF httpapi draft
 * "The Idempotency-Key HTTP Header Field"): a retry returns the first test, never a duplicate,
 * also when two identical requests race (§2.6); keys are scoped to the person who sent them
 * (§2.2); the same key with a different request is refused with 422 (§2.4 fingerprint, §2.7).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { POST as testsPost } from "@/app/api/vacuum-tests/route";
import { POST as reanalyse } from "@/app/api/vacuum-tests/[id]/analyses/route";
import { createShop, addMember, appRequest, routeParams, type TestMember } from "./helpers/members";
import { countRows, jsonRequest, listKeys, sampleText, uploadRequest } from "./helpers/uploads";

const SAMPLE = "sample-2-elapsed-mtorr.csv";

async function send(as: TestMember, key: string, file = SAMPLE, fields: Record<string, string> = {}) {
  const res = await testsPost(uploadRequest("/api/vacuum-tests", { as, file: { body: sampleText(file), name: file }, fields, headers: { "idempotency-key": key } }));
  return { status: res.status, body: await res.json() };
}

describe("Idempotency-Key on POST /api/vacuum-tests", () => {
  let owner: TestMember;
  let tech: TestMember;
  beforeAll(async () => {
    owner = await createShop();
    tech = await addMember(owner.organizationId, "technician");
  });

  it("returns the same test for a sequential retry: 201 then 200, one test and one stored file", async () => {
    const key = randomUUID();
    const first = await send(tech, key);
    const retry = await send(tech, key);
    expect(first.status).toBe(201);
    expect(retry.status).toBe(200);
    expect(retry.body.test.id).toBe(first.body.test.id);
    expect(retry.body.analysis.verdict).toBe(first.body.analysis.verdict);
    const keys = await listKeys(`orgs/${owner.organizationId}/tests/${first.body.test.id}/`);
    expect(keys).toHaveLength(1);
  });

  it("keeps exactly one test when five identical requests race (primary key on idempotency_keys)", async () => {
    const before = await countRows(owner.organizationId);
    const key = randomUUID();
    const results = await Promise.all(Array.from({ length: 5 }, () => send(tech, key)));
    const ids = new Set(results.map((r) => r.body.test?.id));
    expect(ids.size).toBe(1);
    expect(results.filter((r) => r.status === 201)).toHaveLength(1);
    expect(results.every((r) => r.status === 201 || r.status === 200)).toBe(true);
    const after = await countRows(owner.organizationId);
    expect(after.tests - before.tests).toBe(1);
    expect(after.uploads - before.uploads).toBe(1);
    expect(after.idempotencyKeys - before.idempotencyKeys).toBe(1);
    // the losers deleted their objects: one file in the bucket for this organization's new test
    const all = await listKeys(`orgs/${owner.organizationId}/tests/`);
    expect(all.filter((k) => k.includes([...ids][0]!))).toHaveLength(1);
    expect(all).toHaveLength(after.uploads);
  });

  it("scopes keys to the person (§2.2): another technician's same key makes their own test, never answers with the first", async () => {
    const key = randomUUID();
    const other = await addMember(owner.organizationId, "technician");
    const a = await send(tech, key);
    const b = await send(other, key);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(b.body.test.id).not.toBe(a.body.test.id);
    expect(b.body.test.technician?.id ?? b.body.test.createdById).not.toBe(tech.userId);
  });

  it("refuses the same key with another file (§2.7): 422 naming the header; the second log is not stored", async () => {
    const key = randomUUID();
    const first = await send(tech, key);
    expect(first.status).toBe(201);
    const before = await countRows(owner.organizationId);
    const second = await send(tech, key, "sample-4-minutes-torr.csv");
    expect(second.status).toBe(422);
    expect(second.body.error.code).toBe("idempotency_mismatch");
    expect(second.body.error.message).toMatch(/^Idempotency-Key: you already used this key for a different request/);
    expect(await countRows(owner.organizationId)).toEqual(before);
  });

  it("refuses the same key and file with other fields (422): the fingerprint covers the fields too", async () => {
    const key = randomUUID();
    expect((await send(tech, key, SAMPLE, { title: "Rooftop unit" })).status).toBe(201);
    expect((await send(tech, key, SAMPLE, { title: "Basement unit" })).status).toBe(422);
    expect((await send(tech, key, SAMPLE, { title: "Rooftop unit" })).status).toBe(200);
  });

  it("applies to re-analysis: a retry answers with the same version; other overrides with the key are a 422", async () => {
    const { body } = await send(tech, randomUUID());
    const id = body.test.id;
    const key = randomUUID();
    const run = (reason: string) =>
      reanalyse(appRequest(`/api/vacuum-tests/${id}/analyses`, { method: "POST", as: tech, body: JSON.stringify({ reason }), headers: { "content-type": "application/json", "idempotency-key": key } }), routeParams({ id }));
    const a = await run("moved isolation");
    const b = await run("moved isolation");
    expect([a.status, b.status]).toEqual([201, 200]);
    const [va, vb] = [await a.json(), await b.json()];
    expect(vb.analysisId).toBe(va.analysisId);
    expect(vb.version).toBe(va.version);
    expect((await run("something else")).status).toBe(422);
  });

  it("scopes keys by organization: the same key in another shop makes its own test", async () => {
    const key = randomUUID();
    const other = await createShop();
    const a = await send(tech, key);
    const b = await send(other, key);
    expect(a.status).toBe(201);
    expect(b.status).toBe(201);
    expect(b.body.test.id).not.toBe(a.body.test.id);
  });

  it("applies to typed readings too, and refuses an unprintable key with 400", async () => {
    const key = randomUUID();
    const body = { timeMode: "minutes", readings: Array.from({ length: 12 }, (_, i) => ({ time: i, microns: 300 + 10 * i })) };
    const a = await testsPost(jsonRequest("/api/vacuum-tests", body, tech, { "idempotency-key": key }));
    const b = await testsPost(jsonRequest("/api/vacuum-tests", body, tech, { "idempotency-key": key }));
    expect([a.status, b.status]).toEqual([201, 200]);
    expect((await b.json()).test.id).toBe((await a.json()).test.id);
    const bad = await testsPost(jsonRequest("/api/vacuum-tests", body, tech, { "idempotency-key": "   " }));
    expect(bad.status).toBe(400);
  });
});
