/**
 * The casebook API against the real database: only trainers curate (others 403), everyone reads,
 * customer and site details stripped field by field for all but owners and leads, pins on the
 * curve, another shop → 404, and the starter casebook seeded from the simulator (idempotent).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { GET as listGet, POST as listPost } from "@/app/api/casebook/route";
import { GET as oneGet, PATCH as onePatch, DELETE as oneDelete } from "@/app/api/casebook/[id]/route";
import { POST as entryPost } from "@/app/api/casebook/[id]/entries/route";
import { PATCH as entryPatch } from "@/app/api/casebook/[id]/entries/[entryId]/route";
import { POST as pinPost } from "@/app/api/casebook/[id]/entries/[entryId]/pins/route";
import { DELETE as pinDelete } from "@/app/api/casebook/[id]/entries/[entryId]/pins/[pinId]/route";
import { db } from "@/db/client";
import { vacuumTests } from "@/db/schema";
import { createCustomer, createJob, createSite, createSystem } from "@/db/queries/records";
import { ROLES, type Role } from "@/lib/permissions";
import { seedStarterCasebook } from "@/scripts/seed-casebook";
import { appRequest, createCrew, createShop, routeParams, type TestMember } from "./helpers/members";
import { seedTest } from "./helpers/seed-test";

const json = (path: string, as: TestMember | null, method: string, body?: unknown) =>
  appRequest(path, { method, as, body: body === undefined ? undefined : JSON.stringify(body), headers: { "content-type": "application/json" } });

let crew: Record<Role, TestMember>;
let collectionId: string;
let entryId: string;
let testId: string;
const CUSTOMER = "Brightwater Pottery (invented)";
const SITE = "Brightwater kiln shed";
const ADDRESS = "4 Clayfield Row";
const SYSTEM = "Kiln room ductless head";
const JOB_REF = "WO-77123";
const TEST_TITLE = "Kiln room ductless head — leak repair";
const TEST_NOTES = "Customer asked us to call before arriving.";

beforeAll(async () => {
  crew = await createCrew();
  const org = crew.owner.organizationId;
  const customer = await createCustomer(db(), { organizationId: org, name: CUSTOMER });
  const site = await createSite(db(), { organizationId: org, name: SITE, address: ADDRESS, customerId: customer.id });
  const system = await createSystem(db(), { organizationId: org, siteId: site.id, name: SYSTEM });
  const job = await createJob(db(), { organizationId: org, visitedOn: "2026-03-02", siteId: site.id, systemId: system.id, reference: JOB_REF });
  testId = await seedTest(crew.technician, { verdict: "leak", title: TEST_TITLE, siteId: site.id, systemId: system.id });
  await db().update(vacuumTests).set({ jobId: job.id, notes: TEST_NOTES }).where(eq(vacuumTests.id, testId));
});
afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

describe("curating (casebook.curate: trainer only, DEVELOPERS.md permission matrix)", () => {
  it("a trainer builds a collection, adds a test with notes and pins a note on its curve", async () => {
    const c = await listPost(json("/api/casebook", crew.trainer, "POST", { title: "Leaks that fool you", description: "Read these before your first install." }));
    expect(c.status).toBe(201);
    collectionId = (await c.json()).collection.id;
    const e = await entryPost(json(`/api/casebook/${collectionId}/entries`, crew.trainer, "POST", { testId, title: "Steady climb after repair", notes: "Watch the slope." }), routeParams({ id: collectionId }));
    expect(e.status).toBe(201);
    entryId = (await e.json()).entry.id;
    const p = await pinPost(json(`/api/casebook/${collectionId}/entries/${entryId}/pins`, crew.trainer, "POST", { atSeconds: 1200, text: "Pump valved off here" }), routeParams({ id: collectionId, entryId }));
    expect(p.status).toBe(201);
    const p2 = await pinPost(json(`/api/casebook/${collectionId}/entries/${entryId}/pins`, crew.trainer, "POST", { atSeconds: 1900, text: "Still climbing: leak" }), routeParams({ id: collectionId, entryId }));
    expect(p2.status).toBe(201);
    const detail = await (await oneGet(appRequest(`/api/casebook/${collectionId}`, { as: crew.trainer }), routeParams({ id: collectionId }))).json();
    expect(detail.entries).toHaveLength(1);
    expect(detail.entries[0].pins.map((x: { atSeconds: number; text: string }) => [x.atSeconds, x.text])).toEqual([
      [1200, "Pump valved off here"],
      [1900, "Still climbing: leak"],
    ]);
    expect(detail.entries[0].verdict).toBe("leak");
    expect(detail.entries[0].series.t.length).toBeGreaterThan(10);
  });

  it.each(["owner", "lead", "technician", "apprentice"] as const)("%s cannot create, rename, add to or pin in a collection (403)", async (role) => {
    const as = crew[role];
    expect((await listPost(json("/api/casebook", as, "POST", { title: "Mine" }))).status).toBe(403);
    expect((await onePatch(json(`/api/casebook/${collectionId}`, as, "PATCH", { title: "x" }), routeParams({ id: collectionId }))).status).toBe(403);
    expect((await entryPost(json(`/api/casebook/${collectionId}/entries`, as, "POST", { testId, title: "x" }), routeParams({ id: collectionId }))).status).toBe(403);
    expect((await entryPatch(json(`/api/casebook/${collectionId}/entries/${entryId}`, as, "PATCH", { title: "x" }), routeParams({ id: collectionId, entryId }))).status).toBe(403);
    expect((await pinPost(json(`/api/casebook/${collectionId}/entries/${entryId}/pins`, as, "POST", { atSeconds: 5, text: "x" }), routeParams({ id: collectionId, entryId }))).status).toBe(403);
    expect((await oneDelete(json(`/api/casebook/${collectionId}`, as, "DELETE"), routeParams({ id: collectionId }))).status).toBe(403);
  });

  it("rejects a blank title and a negative pin time (400); anonymous → 401", async () => {
    expect((await listPost(json("/api/casebook", crew.trainer, "POST", { title: "  " }))).status).toBe(400);
    expect((await pinPost(json(`/api/casebook/${collectionId}/entries/${entryId}/pins`, crew.trainer, "POST", { atSeconds: -1, text: "x" }), routeParams({ id: collectionId, entryId }))).status).toBe(400);
    expect((await listGet(appRequest("/api/casebook"))).status).toBe(401);
  });

  it("a trainer can remove a pin; a pin of another entry id is 404", async () => {
    const p = await (await pinPost(json(`/api/casebook/${collectionId}/entries/${entryId}/pins`, crew.trainer, "POST", { atSeconds: 60, text: "temporary" }), routeParams({ id: collectionId, entryId }))).json();
    const del = (e: string) => pinDelete(json(`/api/casebook/${collectionId}/entries/${e}/pins/${p.pin.id}`, crew.trainer, "DELETE"), routeParams({ id: collectionId, entryId: e, pinId: p.pin.id }));
    expect((await del("00000000-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await del(entryId)).status).toBe(200);
    expect((await del(entryId)).status).toBe(404);
  });
});

describe("reading and stripping (casebook.read: everyone; details only for owners and leads, DEVELOPERS.md)", () => {
  const strippedValues = [CUSTOMER, SITE, ADDRESS, SYSTEM, JOB_REF, TEST_TITLE, TEST_NOTES];

  it.each(["trainer", "technician", "apprentice"] as const)("%s reads the collection with every customer and site field removed", async (role) => {
    const res = await oneGet(appRequest(`/api/casebook/${collectionId}`, { as: crew[role] }), routeParams({ id: collectionId }));
    expect(res.status).toBe(200);
    const text = await res.text();
    const body = JSON.parse(text);
    const entry = body.entries[0];
    expect(entry.details).toBeNull();
    // field by field: none of the customer, site, address, system, job reference, test title or notes appear anywhere
    for (const v of strippedValues) expect(text, `"${v}" leaked to ${role}`).not.toContain(v);
    // the teaching content is all there
    expect(entry.title).toBe("Steady climb after repair");
    expect(entry.notes).toBe("Watch the slope.");
    expect(entry.pins).toHaveLength(2);
    expect(entry.series.p.length).toBe(entry.series.t.length);
  });

  it.each(["owner", "lead"] as const)("%s sees each customer and site field", async (role) => {
    const body = await (await oneGet(appRequest(`/api/casebook/${collectionId}`, { as: crew[role] }), routeParams({ id: collectionId }))).json();
    expect(body.entries[0].details).toEqual({
      testTitle: TEST_TITLE, testNotes: TEST_NOTES, customerName: CUSTOMER, siteName: SITE, siteAddress: ADDRESS, systemName: SYSTEM, jobReference: JOB_REF,
    });
  });

  it("every role lists the collection; canOpenTest follows the visibility rule", async () => {
    for (const role of ROLES) {
      const res = await listGet(appRequest("/api/casebook", { as: crew[role] }));
      expect(res.status).toBe(200);
      expect((await res.json()).collections.map((c: { id: string }) => c.id)).toContain(collectionId);
    }
    const asApprentice = await (await oneGet(appRequest(`/api/casebook/${collectionId}`, { as: crew.apprentice }), routeParams({ id: collectionId }))).json();
    const asTech = await (await oneGet(appRequest(`/api/casebook/${collectionId}`, { as: crew.technician }), routeParams({ id: collectionId }))).json();
    expect(asApprentice.entries[0].canOpenTest).toBe(false);
    expect(asTech.entries[0].canOpenTest).toBe(true);
  });

  it("another shop gets 404 for the collection and cannot add its tests to its own collection", async () => {
    const stranger = await createShop();
    expect((await oneGet(appRequest(`/api/casebook/${collectionId}`, { as: stranger }), routeParams({ id: collectionId }))).status).toBe(404);
    expect((await listGet(appRequest("/api/casebook", { as: stranger }))).status).toBe(200);
    const list = await (await listGet(appRequest("/api/casebook", { as: stranger }))).json();
    expect(list.collections).toEqual([]);
    // a trainer of the other shop: its own collection, our test → 404
    const { addMember } = await import("./helpers/members");
    const otherTrainer = await addMember(stranger.organizationId, "trainer");
    const c = await (await listPost(json("/api/casebook", otherTrainer, "POST", { title: "Theirs" }))).json();
    const res = await entryPost(json(`/api/casebook/${c.collection.id}/entries`, otherTrainer, "POST", { testId, title: "stolen" }), routeParams({ id: c.collection.id }));
    expect(res.status).toBe(404);
    // and their trainer cannot pin into our entry
    expect((await pinPost(json(`/api/casebook/${collectionId}/entries/${entryId}/pins`, otherTrainer, "POST", { atSeconds: 5, text: "x" }), routeParams({ id: collectionId, entryId }))).status).toBe(404);
  });
});

describe("starter casebook (simulated curves, analysis by the real engine)", () => {
  it("stores eight simulated tests with 1–3 pins each, marked Simulated, and seeding twice adds nothing", async () => {
    const shop = await createShop();
    const { addMember } = await import("./helpers/members");
    const trainer = await addMember(shop.organizationId, "trainer");
    const first = await seedStarterCasebook(db(), { organizationId: shop.organizationId, trainerId: trainer.userId });
    expect(first).toMatchObject({ created: 8, skipped: false });
    const again = await seedStarterCasebook(db(), { organizationId: shop.organizationId, trainerId: trainer.userId });
    expect(again).toMatchObject({ created: 0, skipped: true, collectionId: first.collectionId });
    const list = await (await listGet(appRequest("/api/casebook", { as: trainer }))).json();
    expect(list.collections).toHaveLength(1);
    expect(list.collections[0]).toMatchObject({ isSimulated: true, entryCount: 8 });
    expect(list.collections[0].title).toMatch(/simulated/i);
    const detail = await (await oneGet(appRequest(`/api/casebook/${first.collectionId}`, { as: trainer }), routeParams({ id: first.collectionId }))).json();
    for (const e of detail.entries) {
      expect(e.title).toMatch(/^Simulated: /);
      expect(e.pins.length).toBeGreaterThanOrEqual(1);
      expect(e.pins.length).toBeLessThanOrEqual(3);
    }
    // the simulator's truth for these seeds: the engine agrees on the textbook cases (common practice, no published source)
    const byTitle = Object.fromEntries(detail.entries.map((e: { title: string; verdict: string }) => [e.title, e.verdict]));
    expect(byTitle["Simulated: Tight and dry"]).toBe("pass");
    expect(byTitle["Simulated: A steady leak"]).toBe("leak");
    expect(byTitle["Simulated: Moisture levelling off"]).toBe("moisture");
  }, 120_000);
});
