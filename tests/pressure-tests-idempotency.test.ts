/**
 * Idempotency-Key on POST /api/pressure-tests, as on the other creating routes (IETF httpapi draft
 * "The Idempotency-Key HTTP Header Field", draft-ietf-httpapi-idempotency-key-header §2.2, §2.6,
 * §2.7): a retry never makes a second nitrogen test record.
 */
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as createTest } from "@/app/api/pressure-tests/route";
import { db } from "@/db/client";
import type { Role } from "@/lib/permissions";
import { appRequest, createCrew, type TestMember } from "./helpers/members";

const typed = (endGauge = 288) => ({
  source: "typed", unit: "psig", temperatureUnit: "F", start: { pressureGauge: 300, temperature: 80 }, end: { pressureGauge: endGauge, temperature: 70 },
  ratedTestPressureGauge: 450, startedAt: "2026-05-01T08:00:00-05:00", endedAt: "2026-05-01T10:00:00-05:00",
});
const post = (body: unknown, as: TestMember, key?: string) =>
  createTest(appRequest("/api/pressure-tests", { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json", ...(key ? { "idempotency-key": key } : {}) }, as }));

async function recordsOf(m: TestMember): Promise<number> {
  const r = await db().execute<{ n: number }>(sql`select count(*)::int as n from pressure_tests where organization_id = ${m.organizationId} and created_by_id = ${m.userId}`);
  return r.rows[0].n;
}

let crew: Record<Role, TestMember>;
beforeAll(async () => {
  crew = await createCrew();
});

describe("Idempotency-Key on POST /api/pressure-tests (draft-ietf-httpapi-idempotency-key-header)", () => {
  it("answers a retry with the same key and request with the first record, 200, and saves one (§2.6)", async () => {
    const key = randomUUID();
    const before = await recordsOf(crew.technician);
    const first = await post(typed(), crew.technician, key);
    expect(first.status).toBe(201);
    const made = await first.json();
    const again = await post(typed(), crew.technician, key);
    expect(again.status).toBe(200);
    const replayed = await again.json();
    expect(replayed.test.id).toBe(made.test.id);
    expect(replayed.test).toEqual(made.test);
    expect(replayed.result.expectedEndGauge).toBe(made.result.expectedEndGauge);
    expect(replayed.test).not.toHaveProperty("requestFingerprint");
    expect(await recordsOf(crew.technician)).toBe(before + 1);
  });

  it("refuses the same key with another request, 422 naming the key, and saves nothing (§2.7)", async () => {
    const key = randomUUID();
    expect((await post(typed(288), crew.technician, key)).status).toBe(201);
    const before = await recordsOf(crew.technician);
    const other = await post(typed(280), crew.technician, key);
    expect(other.status).toBe(422);
    expect((await other.json()).error.message).toMatch(/Idempotency-Key/);
    expect(await recordsOf(crew.technician)).toBe(before);
  });

  it("makes one record of two concurrent requests with the same key", async () => {
    const key = randomUUID();
    const before = await recordsOf(crew.lead);
    const [a, b] = await Promise.all([post(typed(), crew.lead, key), post(typed(), crew.lead, key)]);
    expect([a.status, b.status].sort()).toEqual([200, 201]);
    expect((await a.json()).test.id).toBe((await b.json()).test.id);
    expect(await recordsOf(crew.lead)).toBe(before + 1);
  });

  it("scopes a key to the person who sent it (§2.2): another member's same key makes their own record", async () => {
    const key = randomUUID();
    const mine = await (await post(typed(), crew.technician, key)).json();
    const theirs = await post(typed(), crew.owner, key);
    expect(theirs.status).toBe(201);
    expect((await theirs.json()).test.id).not.toBe(mine.test.id);
  });

  it("saves a record per request without a key, as before", async () => {
    const before = await recordsOf(crew.trainer);
    expect((await post(typed(), crew.trainer)).status).toBe(201);
    expect((await post(typed(), crew.trainer)).status).toBe(201);
    expect(await recordsOf(crew.trainer)).toBe(before + 2);
  });
});
