/**
 * Idempotent uploads (Idempotency-Key header, as in the IETF httpapi draft
 * "The Idempotency-Key HTTP Header Field"): a retry returns the first test, never a duplicate,
 * also when two identical requests race; keys are scoped to the organization.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { POST as testsPost } from "@/app/api/tests/route";
import { createShop, addMember, type TestMember } from "./helpers/members";
import { countRows, jsonRequest, listKeys, sampleText, uploadRequest } from "./helpers/uploads";

const SAMPLE = "sample-2-elapsed-mtorr.csv";

async function send(as: TestMember, key: string) {
  const res = await testsPost(uploadRequest("/api/tests", { as, file: { body: sampleText(SAMPLE), name: SAMPLE }, headers: { "idempotency-key": key } }));
  return { status: res.status, body: await res.json() };
}

describe("Idempotency-Key on POST /api/tests", () => {
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
    const a = await testsPost(jsonRequest("/api/tests", body, tech, { "idempotency-key": key }));
    const b = await testsPost(jsonRequest("/api/tests", body, tech, { "idempotency-key": key }));
    expect([a.status, b.status]).toEqual([201, 200]);
    expect((await b.json()).test.id).toBe((await a.json()).test.id);
    const bad = await testsPost(jsonRequest("/api/tests", body, tech, { "idempotency-key": "   " }));
    expect(bad.status).toBe(400);
  });
});
