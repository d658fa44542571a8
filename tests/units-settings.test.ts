/**
 * The shop's units and a person's own, through the real routes and database: stored, read back,
 * and applied to the report (the shop's document, in the shop's units).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { GET as unitsGet, PUT as unitsPut } from "@/app/api/settings/units/route";
import { PUT as mineUnitsPut } from "@/app/api/settings/units/mine/route";
import { db } from "@/db/client";
import { vacuumTests } from "@/db/schema";
import { buildReportModel } from "@/lib/reports/model";
import { appRequest, createCrew, type TestMember } from "./helpers/members";
import { seedTest } from "./helpers/seed-test";
import type { Role } from "@/lib/permissions";

let crew: Record<Role, TestMember>;
beforeAll(async () => {
  crew = await createCrew();
});
afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

const json = (method: string, body: unknown, as: TestMember, path: string) =>
  appRequest(path, { method, body: JSON.stringify(body), headers: { "content-type": "application/json" }, as });
const read = async (as: TestMember) => (await unitsGet(appRequest("/api/settings/units", { as }))).json();

describe("units as a shop setting with a person's own choice (NIST SP 811 factors)", () => {
  it("is imperial until set; only the owner sets the shop's; a bad value is a 400 naming unitSystem", async () => {
    expect(await read(crew.technician)).toEqual({ shop: "imperial", person: null, effective: "imperial" });
    expect((await unitsPut(json("PUT", { unitSystem: "metric" }, crew.lead, "/api/settings/units"))).status).toBe(403);
    const bad = await unitsPut(json("PUT", { unitSystem: "SI" }, crew.owner, "/api/settings/units"));
    expect(bad.status).toBe(400);
    expect(JSON.stringify(await bad.json())).toContain("unitSystem");
    const ok = await unitsPut(json("PUT", { unitSystem: "metric" }, crew.owner, "/api/settings/units"));
    expect(ok.status).toBe(200);
    expect(await read(crew.technician)).toEqual({ shop: "metric", person: null, effective: "metric" });
  });

  it("a person's own choice overrides the shop's for them only, and null goes back to the shop's", async () => {
    const r = await mineUnitsPut(json("PUT", { unitSystem: "imperial" }, crew.technician, "/api/settings/units/mine"));
    expect(r.status).toBe(200);
    expect(await read(crew.technician)).toEqual({ shop: "metric", person: "imperial", effective: "imperial" });
    expect((await read(crew.lead)).effective).toBe("metric");
    await mineUnitsPut(json("PUT", { unitSystem: null }, crew.technician, "/api/settings/units/mine"));
    expect((await read(crew.technician)).effective).toBe("metric");
  });

  it("the report writes the line set and ambient in the shop's units (25 ft = 7.6 m; 21.5 °C = 71 °F)", async () => {
    const id = await seedTest(crew.technician, {});
    await db().update(vacuumTests).set({ lineSetFeet: 25, ambientC: 21.5 }).where(eq(vacuumTests.id, id));
    const metric = (await buildReportModel(db(), { organizationId: crew.owner.organizationId, testId: id }))!;
    const words = Object.fromEntries(metric.conditions);
    expect(words["Line set"]).toMatch(/^7\.6 m,/);
    expect(words["Ambient temperature"]).toBe("21.5 °C");
    await unitsPut(json("PUT", { unitSystem: "imperial" }, crew.owner, "/api/settings/units"));
    const imperial = Object.fromEntries((await buildReportModel(db(), { organizationId: crew.owner.organizationId, testId: id }))!.conditions);
    expect(imperial["Line set"]).toMatch(/^25 ft,/);
    expect(imperial["Ambient temperature"]).toBe("71 °F");
  });
});
