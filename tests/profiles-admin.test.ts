import { describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { acceptanceProfiles } from "@/db/schema";
import { GET as listGet, POST as createPost } from "@/app/api/settings/profiles/route";
import { DELETE as profileDelete, PUT as profilePut } from "@/app/api/settings/profiles/[id]/route";
import { POST as defaultPost } from "@/app/api/settings/profiles/[id]/default/route";
import { getDefaultProfileByOrganization } from "@/db/queries/profiles";
import { buildReportModel } from "@/lib/reports/model";
import { appRequest, createShop, routeParams } from "./helpers/members";
import { jsonInit, crewForFile } from "./helpers/crew";
import { seedTest } from "./helpers/seed-test";

const strict = { name: "Shop standard: 500 for 15", targetMicrons: 500, holdMinutes: 15, limitMicrons: 1000, leakRateMicronsPerMinute: 20 };
const loose = { name: "Refrigeration rack", targetMicrons: 500, holdMinutes: 10, limitMicrons: 1500, leakRateMicronsPerMinute: 30 };

const crew = crewForFile();

describe("acceptance profiles (profiles.manage is owner + lead, DEVELOPERS.md; numbers are common practice, no published source)", () => {
  it("the first profile becomes the default; making another default leaves exactly one", async () => {
    const a = await createPost(appRequest("/api/settings/profiles", jsonInit(crew.lead, strict)));
    expect(a.status).toBe(201);
    const first = (await a.json()).profile;
    expect(first.isDefault).toBe(true);
    const second = (await (await createPost(appRequest("/api/settings/profiles", jsonInit(crew.owner, loose)))).json()).profile;
    expect(second.isDefault).toBe(false);
    const d = await defaultPost(appRequest(`/api/settings/profiles/${second.id}/default`, jsonInit(crew.lead, {})), routeParams({ id: second.id }));
    expect(d.status).toBe(200);
    const defaults = await db().select().from(acceptanceProfiles).where(and(eq(acceptanceProfiles.organizationId, crew.owner.organizationId), eq(acceptanceProfiles.isDefault, true)));
    expect(defaults.map((p) => p.id)).toEqual([second.id]);
    expect((await getDefaultProfileByOrganization(db(), { organizationId: crew.owner.organizationId })).name).toBe(loose.name);
    // The default cannot be deleted; the other can.
    expect((await profileDelete(appRequest(`/api/settings/profiles/${second.id}`, { method: "DELETE", as: crew.lead }), routeParams({ id: second.id }))).status).toBe(409);
    expect((await profileDelete(appRequest(`/api/settings/profiles/${first.id}`, { method: "DELETE", as: crew.lead }), routeParams({ id: first.id }))).status).toBe(200);
    const list = await (await listGet(appRequest("/api/settings/profiles", { as: crew.owner }))).json();
    expect(list.items.map((p: { name: string }) => p.name)).toEqual([loose.name]);
  });

  it("editing a profile never changes a stored result: the report keeps the profile of its analysis", async () => {
    const shop = await createShop();
    const created = (await (await createPost(appRequest("/api/settings/profiles", jsonInit(shop, strict)))).json()).profile;
    const testId = await seedTest(shop, { verdict: "pass" });
    const before = (await buildReportModel(db(), { organizationId: shop.organizationId, testId }))!.profile;
    const put = await profilePut(appRequest(`/api/settings/profiles/${created.id}`, jsonInit(shop, { ...strict, holdMinutes: 30, limitMicrons: 800 }, "PUT")), routeParams({ id: created.id }));
    expect(put.status).toBe(200);
    expect((await put.json()).profile).toMatchObject({ holdMinutes: 30, limitMicrons: 800 });
    const after = (await buildReportModel(db(), { organizationId: shop.organizationId, testId }))!.profile;
    expect(after).toEqual(before);
  });

  it("technicians and trainers get 403; another shop's profile is 404; a limit under the target is 400", async () => {
    expect((await createPost(appRequest("/api/settings/profiles", jsonInit(crew.technician, strict)))).status).toBe(403);
    expect((await listGet(appRequest("/api/settings/profiles", { as: crew.trainer }))).status).toBe(403);
    const stranger = await createShop();
    const mine = (await (await createPost(appRequest("/api/settings/profiles", jsonInit(crew.lead, { ...strict, name: "Third" })))).json()).profile;
    expect((await profilePut(appRequest(`/api/settings/profiles/${mine.id}`, jsonInit(stranger, strict, "PUT")), routeParams({ id: mine.id }))).status).toBe(404);
    expect((await defaultPost(appRequest(`/api/settings/profiles/${mine.id}/default`, jsonInit(stranger, {})), routeParams({ id: mine.id }))).status).toBe(404);
    const bad = await createPost(appRequest("/api/settings/profiles", jsonInit(crew.lead, { ...strict, limitMicrons: 400 })));
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.message).toMatch(/limitMicrons/);
  });
});
