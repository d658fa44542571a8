/** Sites, systems, jobs and acceptance profiles: org-scoped lists, creation by role, cross-org refusals. */
import { beforeAll, describe, expect, it } from "vitest";
import { GET as sitesGet, POST as sitesPost } from "@/app/api/sites/route";
import { GET as systemsGet, POST as systemsPost } from "@/app/api/systems/route";
import { GET as jobsGet, POST as jobsPost } from "@/app/api/jobs/route";
import { GET as profilesGet } from "@/app/api/profiles/route";
import { db } from "@/db/client";
import { createProfile } from "@/db/queries/profiles";
import { DEFAULT_PROFILE } from "@/analysis/decay/profile";
import type { Role } from "@/lib/permissions";
import { appRequest, createCrew, createShop, type TestMember } from "./helpers/members";
import { jsonRequest } from "./helpers/uploads";

type Crew = Record<Role, TestMember>;

describe("records API (permission matrix: records.manage = owner, lead, technician)", () => {
  let crew: Crew;
  let other: TestMember;
  let siteId: string;
  beforeAll(async () => {
    [crew, other] = await Promise.all([createCrew(), createShop()]);
  });

  it("creates a site with a new customer and lists it only in its own organization", async () => {
    const res = await sitesPost(jsonRequest("/api/sites", { name: "Birchwood Clinic", address: "4 Mill Lane", newCustomerName: "Birchwood Health" }, crew.technician));
    expect(res.status).toBe(201);
    const { site } = await res.json();
    siteId = site.id;
    const mine = await (await sitesGet(appRequest("/api/sites", { as: crew.apprentice }))).json();
    expect(mine.items).toEqual([expect.objectContaining({ id: siteId, name: "Birchwood Clinic", customerName: "Birchwood Health" })]);
    const theirs = await (await sitesGet(appRequest("/api/sites", { as: other }))).json();
    expect(theirs.items).toEqual([]);
  });

  it("answers 401 anonymous, 403 for trainer and apprentice creating records, 400 for a bad body", async () => {
    expect((await sitesGet(appRequest("/api/sites", { as: null }))).status).toBe(401);
    expect((await sitesPost(jsonRequest("/api/sites", { name: "X" }, crew.trainer))).status).toBe(403);
    expect((await systemsPost(jsonRequest("/api/systems", { siteId, name: "X" }, crew.apprentice))).status).toBe(403);
    expect((await jobsPost(jsonRequest("/api/jobs", { visitedOn: "2026-11-02" }, crew.trainer))).status).toBe(403);
    const bad = await sitesPost(jsonRequest("/api/sites", { name: "" }, crew.lead));
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.message).toMatch(/^name:/);
  });

  it("creates a system at a site, filters systems by site and refuses another shop's site (400 naming siteId)", async () => {
    const res = await systemsPost(jsonRequest("/api/systems", { siteId, name: "Rooftop unit 2", refrigerant: "R-410A", lineSetFeet: 40, liquidOd: "3/8", suctionOd: "7/8" }, crew.lead));
    expect(res.status).toBe(201);
    const { system } = await res.json();
    const list = await (await systemsGet(appRequest(`/api/systems?siteId=${siteId}`, { as: crew.technician }))).json();
    expect(list.items.map((s: { id: string }) => s.id)).toEqual([system.id]);
    const foreign = await systemsPost(jsonRequest("/api/systems", { siteId, name: "Sneaky" }, other));
    expect(foreign.status).toBe(400);
    expect((await foreign.json()).error.message).toMatch(/^siteId:/);
    expect((await systemsPost(jsonRequest("/api/systems", { siteId, name: "Odd", liquidOd: "9/8" }, crew.lead))).status).toBe(400);
  });

  it("creates a job for the caller by default and refuses a technician from another shop", async () => {
    const res = await jobsPost(jsonRequest("/api/jobs", { visitedOn: "2026-11-02", siteId, reference: "WO-1182", reason: "Compressor change" }, crew.technician));
    expect(res.status).toBe(201);
    const { job } = await res.json();
    expect(job.technicianId).toBe(crew.technician.userId);
    const list = await (await jobsGet(appRequest("/api/jobs", { as: crew.owner }))).json();
    expect(list.items.map((j: { id: string }) => j.id)).toContain(job.id);
    const foreign = await jobsPost(jsonRequest("/api/jobs", { visitedOn: "2026-11-02", technicianId: other.userId }, crew.owner));
    expect(foreign.status).toBe(400);
    expect((await jobsPost(jsonRequest("/api/jobs", { visitedOn: "02/11/2026" }, crew.owner))).status).toBe(400);
  });
});

describe("acceptance profiles", () => {
  it("shows the engine's default as 'Common practice (default)' when the shop has none (common practice, no published source)", async () => {
    const owner = await createShop();
    const body = await (await profilesGet(appRequest("/api/profiles", { as: owner }))).json();
    expect(body.items).toEqual([
      {
        id: null,
        name: "Common practice (default)",
        targetMicrons: DEFAULT_PROFILE.targetMicrons,
        holdMinutes: DEFAULT_PROFILE.holdMinutes,
        limitMicrons: DEFAULT_PROFILE.limitMicrons,
        leakRateMicronsPerMinute: DEFAULT_PROFILE.leakRateMicronsPerMinute,
        isDefault: true,
      },
    ]);
  });

  it("lists the shop's own profiles, default first, and never another shop's", async () => {
    const [owner, other] = await Promise.all([createShop(), createShop()]);
    await createProfile(db(), { organizationId: owner.organizationId, name: "Strict 300", targetMicrons: 300, holdMinutes: 15, limitMicrons: 500, leakRateMicronsPerMinute: 10 });
    await createProfile(db(), { organizationId: owner.organizationId, name: "House rule", targetMicrons: 500, holdMinutes: 10, limitMicrons: 1000, leakRateMicronsPerMinute: 20, isDefault: true });
    const mine = await (await profilesGet(appRequest("/api/profiles", { as: owner }))).json();
    expect(mine.items.map((p: { name: string }) => p.name)).toEqual(["House rule", "Strict 300"]);
    const theirs = await (await profilesGet(appRequest("/api/profiles", { as: other }))).json();
    expect(theirs.items.map((p: { id: string | null }) => p.id)).toEqual([null]);
  });
});
