/**
 * The shop's time zone, the note for the customer, and typed "minutes since isolation" through the
 * real routes, database and storage (no mocks of our own layer).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as shopGet, PUT as shopPut } from "@/app/api/settings/shop/route";
import { GET as detailGet, PATCH as detailPatch } from "@/app/api/vacuum-tests/[id]/route";
import { POST as testsPost } from "@/app/api/vacuum-tests/route";
import { appRequest, createCrew, routeParams, type TestMember } from "./helpers/members";
import { jsonRequest } from "./helpers/uploads";
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

const json = (method: string, body: unknown, as: TestMember, path: string) => appRequest(path, { method, body: JSON.stringify(body), headers: { "content-type": "application/json" }, as });

describe("the shop's time zone (IANA time zone database names)", () => {
  it("is UTC until set; the owner sets it; others may read it but not change it; an unknown zone is a 400 naming timeZone", async () => {
    expect(await (await shopGet(appRequest("/api/settings/shop", { as: crew.technician }))).json()).toEqual({ timeZone: "UTC" });
    const ok = await shopPut(json("PUT", { timeZone: "America/Chicago" }, crew.owner, "/api/settings/shop"));
    expect(ok.status).toBe(200);
    expect(await (await shopGet(appRequest("/api/settings/shop", { as: crew.apprentice }))).json()).toEqual({ timeZone: "America/Chicago" });
    expect((await shopPut(json("PUT", { timeZone: "Europe/Berlin" }, crew.lead, "/api/settings/shop"))).status).toBe(403);
    const bad = await shopPut(json("PUT", { timeZone: "Mars/Olympus_Mons" }, crew.owner, "/api/settings/shop"));
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.message).toMatch(/^timeZone: not a time zone/);
    expect(await (await shopGet(appRequest("/api/settings/shop", { as: crew.owner }))).json()).toEqual({ timeZone: "America/Chicago" });
  });
});

describe("the note for the customer (kept apart from the internal notes)", () => {
  it("the test's technician and the lead write it; a trainer who can read the test may not; another technician cannot see it (404)", async () => {
    const id = await seedTest(crew.technician, { notes: "Internal only." });
    const patch = (as: TestMember, customerNote: string) => detailPatch(json("PATCH", { customerNote }, as, `/api/vacuum-tests/${id}`), routeParams({ id }));
    expect((await patch(crew.technician, "  We will come back on Friday.  ")).status).toBe(200);
    let detail = (await (await detailGet(appRequest(`/api/vacuum-tests/${id}`, { as: crew.lead }), routeParams({ id }))).json()).test;
    expect(detail.customerNote).toBe("We will come back on Friday.");
    expect(detail.notes).toBe("Internal only.");
    expect((await patch(crew.lead, "")).status).toBe(200);
    detail = (await (await detailGet(appRequest(`/api/vacuum-tests/${id}`, { as: crew.lead }), routeParams({ id }))).json()).test;
    expect(detail.customerNote).toBeNull();
    expect((await patch(crew.trainer, "x")).status).toBe(403);
    const other = await createCrew();
    expect((await patch(other.technician, "x")).status).toBe(404);
    const tooLong = await patch(crew.lead, "x".repeat(2001));
    expect(tooLong.status).toBe(400);
    expect((await tooLong.json()).error.message).toMatch(/^customerNote/);
  });
});

describe("typed readings, minutes since isolation (common practice: the count starts when the pump is valved off)", () => {
  it("takes the first typed reading as the isolation and judges a steady 62 microns/min typed leak with calibrated confidence", async () => {
    const readings = Array.from({ length: 16 }, (_, m) => ({ time: m, microns: 350 + 62 * m }));
    const res = await testsPost(jsonRequest("/api/vacuum-tests", { timeMode: "minutes", readings, customerNote: "Leak found; repair quoted." }, crew.technician));
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.analysis.isolationAt).toBe(0);
    expect(body.analysis.findings.map((f: { code: string }) => f.code)).not.toContain("isolation_not_found");
    expect(body.analysis.reasons[0]).toBe("Isolated at 350 microns.");
    expect(body.analysis.verdict).toBe("leak");
    // A textbook leak, typed without scatter: the calibrated confidence says "sure" (it said 44 % before calibration).
    expect(body.analysis.confidence).toBeGreaterThanOrEqual(0.9);
    expect(body.analysis.certainty.words).toBe("sure");
    expect(body.test.customerNote).toBe("Leak found; repair quoted.");
  });
});
