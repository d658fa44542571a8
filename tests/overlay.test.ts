/**
 * The overlay against the real database: curves aligned at isolation (t = 0 at each test's
 * isolationAt, or at the first reading when the log starts in the hold), checked numerically;
 * the requested order kept; tests the viewer cannot see left out with a note, 404 when none is
 * visible or for another shop; at most eight; an apprentice's uncalled practice test shows no verdict.
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as overlayGet } from "@/app/api/overlay/route";
import { db } from "@/db/client";
import { insertAnalysis } from "@/db/queries/analyses";
import { insertTest, updateTestCurrentAnalysis } from "@/db/queries/vacuum-tests";
import { alignAtIsolation, micronsAt } from "@/lib/casebook/align";
import type { Role } from "@/lib/permissions";
import { appRequest, createCrew, createShop, type TestMember } from "./helpers/members";
import { seedTest, seededResult, seededSeries } from "./helpers/seed-test";

const overlay = (ids: string[], as: TestMember) => overlayGet(appRequest(`/api/overlay?tests=${ids.join(",")}`, { as }));

/** A stored test whose log starts in the hold: no isolation point, readings from 300 rising slowly. */
async function seedHoldOnly(member: TestMember): Promise<string> {
  const testId = randomUUID();
  const t: number[] = [];
  const p: number[] = [];
  for (let s = 0; s <= 900; s += 30) {
    t.push(s);
    p.push(300 + s / 10);
  }
  const result = { ...seededResult("pass"), isolationAt: null };
  await db().transaction(async (tx) => {
    await insertTest(tx, { id: testId, organizationId: member.organizationId, createdById: member.userId, title: "Started in the hold", source: "typed" });
    const a = await insertAnalysis(tx, { organizationId: member.organizationId, testId, version: 1, options: {}, result, series: { t, p }, createdById: member.userId });
    await updateTestCurrentAnalysis(tx, { organizationId: member.organizationId, testId, analysisId: a.id, verdict: "pass" });
  });
  return testId;
}

let crew: Record<Role, TestMember>;
let leakId: string;
let passId: string;
let holdOnlyId: string;

beforeAll(async () => {
  crew = await createCrew();
  leakId = await seedTest(crew.technician, { verdict: "leak" });
  passId = await seedTest(crew.technician, { verdict: "pass" });
  holdOnlyId = await seedHoldOnly(crew.apprentice);
});
afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

describe("alignAtIsolation (t' = t − isolationAt; linear interpolation between readings)", () => {
  it("inserts an interpolated reading at t' = 0 when isolation falls between readings (hand-computed: halfway 50→40 = 45)", () => {
    const a = alignAtIsolation({ t: [0, 10, 20, 30], p: [100, 50, 40, 60] }, 15);
    expect(a.t).toEqual([-15, -5, 0, 5, 15]);
    expect(a.p).toEqual([100, 50, 45, 40, 60]);
    expect(a.zeroMicrons).toBe(45);
  });
  it("uses the first reading as zero when there is no isolation point, and keeps a reading at zero as is", () => {
    expect(alignAtIsolation({ t: [5, 15], p: [300, 310] }, null)).toEqual({ zeroSeconds: 5, zeroMicrons: 300, t: [0, 10], p: [300, 310] });
    expect(alignAtIsolation({ t: [0, 10, 20], p: [9, 8, 7] }, 10).t).toEqual([-10, 0, 10]);
    expect(micronsAt({ t: [0, 10], p: [0, 100] }, 2.5)).toBe(25);
  });
});

describe("GET /api/overlay (visibility rule of db/queries/visibility.ts, DEVELOPERS.md)", () => {
  it("a trainer overlays three curves, each with t = 0 at its own isolation, in the order asked", async () => {
    const res = await overlay([passId, leakId, holdOnlyId], crew.trainer);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.tests.map((x: { id: string }) => x.id)).toEqual([passId, leakId, holdOnlyId]);
    expect(body.omittedIds).toEqual([]);
    expect(body.note).toBeNull();
    for (const [id, verdict] of [[passId, "pass"], [leakId, "leak"]] as const) {
      const x = body.tests.find((v: { id: string }) => v.id === id);
      const stored = seededSeries(verdict);
      expect(x.isolationAt).toBe(1200);
      // first aligned time = −isolationAt (the log's first row is t = 0)
      expect(x.aligned.t[0]).toBe(-1200);
      // value at t' = 0 equals the stored reading at isolation (exact: 1200 s is a reading; 1e-9 covers JSON round-trip)
      const i0 = x.aligned.t.indexOf(0);
      expect(i0).toBeGreaterThan(0);
      const atIso = stored.p[stored.t.indexOf(1200)];
      expect(Math.abs(x.aligned.p[i0] - atIso)).toBeLessThan(1e-9);
      expect(Math.abs(x.zeroMicrons - atIso)).toBeLessThan(1e-9);
      // every point shifted by the same 1200 s
      expect(x.aligned.t.length).toBe(stored.t.length);
      expect(x.aligned.t[x.aligned.t.length - 1]).toBe(stored.t[stored.t.length - 1] - 1200);
      expect(x.verdict).toBe(verdict);
      expect(x.decay.startMicrons).toBe(400);
    }
    const h = body.tests.find((v: { id: string }) => v.id === holdOnlyId);
    expect(h.isolationAt).toBeNull();
    expect(h.zeroSeconds).toBe(0);
    expect(h.aligned.t[0]).toBe(0);
    expect(h.aligned.p[0]).toBe(300);
  });

  it("leaves out a test the viewer cannot see, with a note; 404 when none is visible", async () => {
    const res = await overlay([leakId, holdOnlyId], crew.technician);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.tests.map((x: { id: string }) => x.id)).toEqual([leakId]);
    expect(body.omittedIds).toEqual([holdOnlyId]);
    expect(body.note).toMatch(/1 of the 2 tests/);
    expect(JSON.stringify(body)).not.toContain("Started in the hold");
    expect((await overlay([holdOnlyId], crew.technician)).status).toBe(404);
  });

  it("another shop gets 404 for our tests", async () => {
    const stranger = await createShop();
    expect((await overlay([leakId, passId], stranger)).status).toBe(404);
  });

  it("at most eight tests, valid ids only (400); duplicates counted once", async () => {
    const nine = Array.from({ length: 9 }, () => randomUUID());
    expect((await overlay(nine, crew.trainer)).status).toBe(400);
    expect((await overlay(["not-an-id"], crew.trainer)).status).toBe(400);
    expect((await overlayGet(appRequest("/api/overlay", { as: crew.trainer }))).status).toBe(400);
    const dup = await (await overlay([leakId, leakId], crew.trainer)).json();
    expect(dup.tests).toHaveLength(1);
  });

  it("an apprentice's uncalled practice test shows its curve but no verdict or numbers", async () => {
    const practiceId = await seedTest(crew.apprentice, { verdict: "leak", isPractice: true });
    const body = await (await overlay([practiceId], crew.apprentice)).json();
    expect(body.tests[0]).toMatchObject({ analysisHidden: true, verdict: null, decay: null, isolationAt: null });
    expect(body.tests[0].aligned.t.length).toBeGreaterThan(10);
    const asTrainer = await (await overlay([practiceId], crew.trainer)).json();
    expect(asTrainer.tests[0]).toMatchObject({ analysisHidden: false, verdict: "leak", isolationAt: 1200 });
  });
});
