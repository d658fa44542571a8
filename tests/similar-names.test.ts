/**
 * Similar-name warnings before a record is created (product rule): pg_trgm similarity
 * (PostgreSQL documentation, F.35 pg_trgm; the 0.4 threshold is our choice, common practice for
 * trigram matching, no published source), scoped to the shop; job pickers name customer and site.
 * Real PostgreSQL; invented names.
 */
import { describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { createCustomer, createJob, createSite, createSystem, listJobsByOrganization } from "@/db/queries/records";
import { listSimilarNamesByOrganization } from "@/db/queries/similar-names";
import { GET as similarGet } from "@/app/api/records/similar/route";
import { POST as mergePost } from "@/app/api/records/merge/route";
import { sites, vacuumTests } from "@/db/schema";
import { seedTest } from "./helpers/seed-test";
import { appRequest, createShop } from "./helpers/members";
import { crewForFile, jsonInit } from "./helpers/crew";

const crew = crewForFile();

describe("similar names (pg_trgm)", () => {
  it("the extension is installed by the migrations (CREATE EXTENSION pg_trgm)", async () => {
    const { rows } = await db().execute<{ extname: string }>(sql`select extname from pg_extension where extname = 'pg_trgm'`);
    expect(rows).toHaveLength(1);
  });

  it("'Harbour Dental' finds 'Harbor Lane Dental — main office' with its customer; unrelated names and other shops stay out", async () => {
    const org = crew.owner.organizationId;
    const customer = await createCustomer(db(), { organizationId: org, name: "Harbor Lane Dental Group" });
    const site = await createSite(db(), { organizationId: org, name: "Harbor Lane Dental — main office", address: "4 Quay St", customerId: customer.id });
    await createSite(db(), { organizationId: org, name: "Maple Street Bakery", customerId: null });
    const other = await createShop();
    await createSite(db(), { organizationId: other.organizationId, name: "Harbour Dental", customerId: null });

    const found = await listSimilarNamesByOrganization(db(), { organizationId: org, kind: "site", name: "Harbour Dental" });
    expect(found.map((f) => f.name)).toEqual(["Harbor Lane Dental — main office"]);
    expect(found[0]).toMatchObject({ id: site.id, detail: "Harbor Lane Dental Group · 4 Quay St" });
    expect(found[0].score).toBeGreaterThanOrEqual(0.4);
    expect(await listSimilarNamesByOrganization(db(), { organizationId: org, kind: "site", name: "Riverside Clinic" })).toEqual([]);
    expect(await listSimilarNamesByOrganization(db(), { organizationId: org, kind: "site", name: "Ha" })).toEqual([]);
    expect((await listSimilarNamesByOrganization(db(), { organizationId: org, kind: "customer", name: "harbor lane dental" })).map((f) => f.name)).toEqual(["Harbor Lane Dental Group"]);

    await createSystem(db(), { organizationId: org, siteId: site.id, name: "Rooftop heat pump 2" });
    const sys = await listSimilarNamesByOrganization(db(), { organizationId: org, kind: "system", name: "rooftop heatpump", siteId: site.id });
    expect(sys.map((s) => s.name)).toEqual(["Rooftop heat pump 2"]);
    expect(sys[0].detail).toBe("Harbor Lane Dental — main office");

    const res = await similarGet(appRequest(`/api/records/similar?kind=site&name=${encodeURIComponent("Harbour Dental")}`, { as: crew.technician }));
    expect(res.status).toBe(200);
    expect((await res.json()).matches.map((m: { name: string }) => m.name)).toEqual(["Harbor Lane Dental — main office"]);
    const bad = await similarGet(appRequest("/api/records/similar?kind=truck&name=x", { as: crew.technician }));
    expect(bad.status).toBe(400);
    expect((await similarGet(appRequest("/api/records/similar?kind=site&name=Harbour", { as: crew.apprentice }))).status).toBe(403);
  });

  it("the job list carries the site's and the customer's names for the pickers", async () => {
    const org = crew.owner.organizationId;
    const customer = await createCustomer(db(), { organizationId: org, name: "Quayside Offices" });
    const site = await createSite(db(), { organizationId: org, name: "Quayside — east wing", customerId: customer.id });
    const job = await createJob(db(), { organizationId: org, visitedOn: "2026-12-02", siteId: site.id, reason: "New install", reference: "WO-4147" });
    const row = (await listJobsByOrganization(db(), { organizationId: org })).find((j) => j.id === job.id)!;
    expect(row).toMatchObject({ reference: "WO-4147", siteName: "Quayside — east wing", customerName: "Quayside Offices" });
  });
});

describe("merging duplicates (product rule: nothing a test recorded is lost)", () => {
  it("a duplicate site's tests, jobs and systems move to the kept site and the duplicate is gone; another shop's site is 404; into itself is 400", async () => {
    const org = crew.owner.organizationId;
    const kept = await createSite(db(), { organizationId: org, name: "Harbor Lane Dental — main office (kept)", customerId: null });
    const dup = await createSite(db(), { organizationId: org, name: "Harbour Dental", customerId: null });
    const sys = await createSystem(db(), { organizationId: org, siteId: dup.id, name: "Split in the lab" });
    const job = await createJob(db(), { organizationId: org, visitedOn: "2026-12-02", siteId: dup.id });
    const testId = await seedTest(crew.technician, { siteId: dup.id, systemId: sys.id });
    const post = (body: unknown, as = crew.technician) => mergePost(appRequest("/api/records/merge", jsonInit(as, body)));
    const res = await post({ kind: "site", fromId: dup.id, intoId: kept.id });
    expect(res.status).toBe(200);
    expect((await res.json()).moved).toEqual({ tests: 1, jobs: 1, sites: 0, systems: 1 });
    const [t] = await db().select({ siteId: vacuumTests.siteId, systemId: vacuumTests.systemId }).from(vacuumTests).where(eq(vacuumTests.id, testId));
    expect(t).toEqual({ siteId: kept.id, systemId: sys.id });
    expect((await listJobsByOrganization(db(), { organizationId: org })).find((j) => j.id === job.id)?.siteId).toBe(kept.id);
    expect((await db().select().from(sites).where(eq(sites.id, dup.id))).length).toBe(0);

    const other = await createShop();
    const foreign = await createSite(db(), { organizationId: other.organizationId, name: "Not yours", customerId: null });
    expect((await post({ kind: "site", fromId: foreign.id, intoId: kept.id })).status).toBe(404);
    expect((await db().select().from(sites).where(eq(sites.id, foreign.id))).length).toBe(1);
    expect((await post({ kind: "site", fromId: kept.id, intoId: kept.id })).status).toBe(400);
    expect((await post({ kind: "site", fromId: kept.id, intoId: foreign.id }, crew.apprentice)).status).toBe(403);
  });
});
