/**
 * The tests API end to end against the real database and the real S3 fake: upload, list with
 * visibility and filters, detail, raw download, re-analysis with history, typed readings, preview.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { GET as listGet, POST as testsPost } from "@/app/api/vacuum-tests/route";
import { GET as detailGet } from "@/app/api/vacuum-tests/[id]/route";
import { GET as rawGet } from "@/app/api/vacuum-tests/[id]/raw/route";
import { POST as analysesPost } from "@/app/api/vacuum-tests/[id]/analyses/route";
import { POST as previewPost } from "@/app/api/imports/preview/route";
import { db } from "@/db/client";
import { createTestShare } from "@/db/queries/visibility";
import { appRequest, createCrew, createShop, routeParams, type TestMember } from "./helpers/members";
import { countRows, jsonRequest, listKeys, sampleText, sha256, uploadRequest } from "./helpers/uploads";
import type { Role } from "@/lib/permissions";

type Crew = Record<Role, TestMember>;

async function upload(as: TestMember, name: string, fields: Record<string, string> = {}) {
  const res = await testsPost(uploadRequest("/api/vacuum-tests", { as, file: { body: sampleText(name), name }, fields }));
  return { status: res.status, body: await res.json() };
}

const get = (fn: typeof detailGet, path: string, as: TestMember | null, id: string) => fn(appRequest(path, { as }), routeParams({ id }));

describe("the ten sample layouts (expected verdicts: fixtures/samples/EXPECTED.md, invented data with known truth)", () => {
  let owner: TestMember;
  beforeAll(async () => {
    owner = await createShop();
  });
  const expected: [string, string][] = [
    ["sample-1-iso-microns.csv", "pass"],
    ["sample-2-elapsed-mtorr.csv", "leak"],
    ["sample-3-clock-microns-preamble.csv", "moisture"],
    ["sample-4-minutes-torr.csv", "leak_and_moisture"],
    ["sample-5-semicolon-pa-comma.csv", "leak"],
    ["sample-6-iso-mbar-extra.csv", "leak"],
    ["sample-7-tsv-quoted-thousands.csv", "moisture"],
    ["sample-8-typed-minutes.csv", "leak"],
    ["sample-9-us-ampm-repull.csv", "pass"],
    ["sample-10-eu-semicolon-dropouts.csv", "leak_and_moisture"],
  ];
  for (const [name, verdict] of expected) {
    it(`uploads ${name} → 201 with verdict ${verdict} (RFC 9110 §15.3.2 201 Created; EXPECTED.md)`, async () => {
      const { status, body } = await upload(owner, name);
      expect(status).toBe(201);
      expect(body.analysis.verdict).toBe(verdict);
      expect(body.test.verdict).toBe(verdict);
      expect(body.test.source).toBe("file");
      expect(body.analysis.import.rows).toBeGreaterThan(5);
    });
  }
});

describe("sign-in and role rules (our permission matrix, lib/permissions.ts)", () => {
  it("answers 401 to an anonymous caller on every tests route (RFC 9110 §15.5.2 401)", async () => {
    const id = "00000000-0000-4000-8000-000000000000";
    const responses = [
      await testsPost(uploadRequest("/api/vacuum-tests", { as: null, file: { body: sampleText("sample-1-iso-microns.csv"), name: "a.csv" } })),
      await listGet(appRequest("/api/vacuum-tests", { as: null })),
      await get(detailGet, `/api/vacuum-tests/${id}`, null, id),
      await get(rawGet, `/api/vacuum-tests/${id}/raw`, null, id),
      await analysesPost(jsonRequest(`/api/vacuum-tests/${id}/analyses`, {}, null), routeParams({ id })),
      await previewPost(uploadRequest("/api/imports/preview", { as: null, file: { body: "a,b\n1,2\n", name: "a.csv" } })),
    ];
    expect(responses.map((r) => r.status)).toEqual([401, 401, 401, 401, 401, 401]);
  });
});

describe("reading tests back", () => {
  let crew: Crew;
  let other: TestMember;
  let techTestId: string;
  let leadTestId: string;
  beforeAll(async () => {
    [crew, other] = await Promise.all([createCrew(), createShop()]);
    techTestId = (await upload(crew.technician, "sample-2-elapsed-mtorr.csv", { title: "Tech leak", isPractice: "false" })).body.test.id;
    leadTestId = (await upload(crew.lead, "sample-1-iso-microns.csv", { title: "Lead pass", isPractice: "true" })).body.test.id;
  });

  it("shows a lead every test of the shop and a technician only their own (visibility rule, lib/permissions.ts)", async () => {
    const lead = await (await listGet(appRequest("/api/vacuum-tests", { as: crew.lead }))).json();
    expect(lead.items.map((i: { id: string }) => i.id).sort()).toEqual([techTestId, leadTestId].sort());
    const tech = await (await listGet(appRequest("/api/vacuum-tests", { as: crew.technician }))).json();
    expect(tech.items.map((i: { id: string }) => i.id)).toEqual([techTestId]);
    const item = tech.items[0];
    expect(item).toMatchObject({ title: "Tech leak", verdict: "leak", technician: { id: crew.technician.userId }, site: null, isPractice: false });
    expect(typeof item.leakRateMicronsPerMinute).toBe("number");
    expect(Array.isArray(item.findingCodes)).toBe(true);
  });

  it("lets an apprentice see a test only once it is shared with them (visibility rule)", async () => {
    expect((await get(detailGet, "/x", crew.apprentice, techTestId)).status).toBe(404);
    await createTestShare(db(), { organizationId: crew.owner.organizationId, testId: techTestId, userId: crew.apprentice.userId });
    const res = await get(detailGet, "/x", crew.apprentice, techTestId);
    expect(res.status).toBe(200);
    const list = await (await listGet(appRequest("/api/vacuum-tests", { as: crew.apprentice }))).json();
    expect(list.items.map((i: { id: string }) => i.id)).toEqual([techTestId]);
  });

  it("answers 404, never 403, for another shop's test and for an unknown id (no existence leak across organizations)", async () => {
    expect((await get(detailGet, "/x", other, techTestId)).status).toBe(404);
    expect((await get(rawGet, "/x", other, techTestId)).status).toBe(404);
    const unknown = "00000000-0000-4000-8000-000000000000";
    expect((await get(detailGet, "/x", crew.owner, unknown)).status).toBe(404);
    expect((await get(detailGet, "/x", crew.owner, "not-a-uuid")).status).toBe(400);
    const list = await (await listGet(appRequest("/api/vacuum-tests", { as: other }))).json();
    expect(list.items).toEqual([]);
  });

  it("filters by verdict, practice and technician, and pages with an opaque cursor (API contract)", async () => {
    const byVerdict = await (await listGet(appRequest("/api/vacuum-tests?verdict=pass", { as: crew.owner }))).json();
    expect(byVerdict.items.map((i: { id: string }) => i.id)).toEqual([leadTestId]);
    const practice = await (await listGet(appRequest("/api/vacuum-tests?isPractice=true", { as: crew.owner }))).json();
    expect(practice.items.map((i: { id: string }) => i.id)).toEqual([leadTestId]);
    const byTech = await (await listGet(appRequest(`/api/vacuum-tests?technicianId=${crew.technician.userId}`, { as: crew.owner }))).json();
    expect(byTech.items.map((i: { id: string }) => i.id)).toEqual([techTestId]);
    const page1 = await (await listGet(appRequest("/api/vacuum-tests?limit=1", { as: crew.owner }))).json();
    expect(page1.items).toHaveLength(1);
    expect(typeof page1.nextCursor).toBe("string");
    const page2 = await (await listGet(appRequest(`/api/vacuum-tests?limit=1&cursor=${page1.nextCursor}`, { as: crew.owner }))).json();
    expect(page2.items).toHaveLength(1);
    expect(page2.items[0].id).not.toBe(page1.items[0].id);
    expect(page2.nextCursor).toBeNull();
    expect((await listGet(appRequest("/api/vacuum-tests?limit=51", { as: crew.owner }))).status).toBe(400);
    expect((await listGet(appRequest("/api/vacuum-tests?cursor=garbage", { as: crew.owner }))).status).toBe(400);
  });

  it("returns the detail with a chart series of at most 1500 points, the history and the upload's SHA-256 (API contract)", async () => {
    const res = await get(detailGet, "/x", crew.technician, techTestId);
    const body = await res.json();
    expect(body.test.id).toBe(techTestId);
    expect(body.analysis.verdict).toBe("leak");
    expect(body.series.t.length).toBe(body.series.p.length);
    expect(body.series.t.length).toBeGreaterThan(10);
    expect(body.series.t.length).toBeLessThanOrEqual(1500);
    expect(body.history).toHaveLength(1);
    expect(body.history[0]).toMatchObject({ version: 1, verdict: "leak", createdBy: { id: crew.technician.userId } });
    expect(body.upload.sha256).toBe(sha256(sampleText("sample-2-elapsed-mtorr.csv")));
    expect(body.upload.filename).toBe("sample-2-elapsed-mtorr.csv");
  });

  it("gives a 5-minute download link that fetches the exact uploaded bytes (SHA-256 compared)", async () => {
    const res = await get(rawGet, "/x", crew.technician, techTestId);
    const body = await res.json();
    expect(body.expiresInSeconds).toBe(300);
    const file = await fetch(body.url);
    expect(file.status).toBe(200);
    const bytes = new Uint8Array(await file.arrayBuffer());
    expect(sha256(bytes)).toBe(sha256(sampleText("sample-2-elapsed-mtorr.csv")));
  });
});

describe("re-analysis", () => {
  let crew: Crew;
  let other: TestMember;
  let testId: string;
  const post = (as: TestMember, body: unknown, id = testId) => analysesPost(jsonRequest(`/api/vacuum-tests/${id}/analyses`, body, as), routeParams({ id }));
  beforeAll(async () => {
    [crew, other] = await Promise.all([createCrew(), createShop()]);
    testId = (await upload(crew.technician, "sample-1-iso-microns.csv")).body.test.id;
    await createTestShare(db(), { organizationId: crew.owner.organizationId, testId, userId: crew.apprentice.userId });
  });

  it("stores version 2 with the reason, points the test at it and keeps version 1 in the history (API contract)", async () => {
    const res = await post(crew.technician, { holdWindow: { startSeconds: 1473, endSeconds: 2000 }, reason: "hold ends at the break" });
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.version).toBe(2);
    expect(typeof body.analysisId).toBe("string");
    const detail = await (await get(detailGet, "/x", crew.technician, testId)).json();
    expect(detail.test.currentAnalysisId).toBe(body.analysisId);
    expect(detail.history.map((h: { version: number }) => h.version)).toEqual([1, 2]);
    expect(detail.history[1].reason).toBe("hold ends at the break");
    expect(detail.history[1].options.holdWindow).toEqual({ startSeconds: 1473, endSeconds: 2000 });
    // the raw file is untouched: same SHA-256 as the sample
    expect(detail.upload.sha256).toBe(sha256(sampleText("sample-1-iso-microns.csv")));
  });

  it("lets a lead re-analyse anyone's test but not an apprentice who only sees it shared (403) (permission matrix)", async () => {
    expect((await post(crew.lead, { reason: "check" })).status).toBe(201);
    expect((await post(crew.apprentice, { reason: "mine?" })).status).toBe(403);
  });

  it("answers 404 across organizations and 400/422 naming the bad override (API contract)", async () => {
    expect((await post(other, {})).status).toBe(404);
    const badUnit = await post(crew.technician, { unit: "bar-ish" });
    expect(badUnit.status).toBe(400);
    expect((await badUnit.json()).error.message).toMatch(/^unit:/);
    const badWindow = await post(crew.technician, { holdWindow: { startSeconds: 50, endSeconds: 10 } });
    expect(badWindow.status).toBe(400);
    expect((await badWindow.json()).error.message).toMatch(/holdWindow/);
    const badColumn = await post(crew.technician, { pressureColumn: "no such column" });
    expect(badColumn.status).toBe(422);
    expect((await badColumn.json()).error.message.toLowerCase()).toMatch(/column/);
    const unknownField = await post(crew.technician, { isolationAt: 5 });
    expect(unknownField.status).toBe(400);
  });
});

describe("typed readings and quick-created records", () => {
  let crew: Crew;
  beforeAll(async () => {
    crew = await createCrew();
  });

  /** A textbook leak written by hand: straight 50 microns per minute climb after isolation (invented). */
  const leakMinutes = Array.from({ length: 21 }, (_, i) => ({ time: i, microns: 350 + 50 * i }));

  it("analyses minutes typed by hand with the same engine and stores them as a CSV (source typed)", async () => {
    const res = await testsPost(jsonRequest("/api/vacuum-tests", { timeMode: "minutes", readings: leakMinutes, title: "By hand" }, crew.technician));
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.test.source).toBe("typed");
    expect(body.analysis.verdict).toBe("leak");
    // 50 microns/min typed exactly; the fit should recover it within 5 % (noise-free line)
    expect(body.analysis.decay.leakRateMicronsPerMinute).toBeGreaterThan(47.5);
    expect(body.analysis.decay.leakRateMicronsPerMinute).toBeLessThan(52.5);
  });

  it("reads clock times HH:MM and names the bad reading (400 with the field path)", async () => {
    const clock = leakMinutes.map((r) => ({ time: `13:${String(r.time + 10).padStart(2, "0")}`, microns: r.microns }));
    const ok = await testsPost(jsonRequest("/api/vacuum-tests", { timeMode: "clock", readings: clock }, crew.technician));
    expect(ok.status).toBe(201);
    const bad = await testsPost(jsonRequest("/api/vacuum-tests", { timeMode: "clock", readings: [...clock.slice(0, 5), { time: "25:99", microns: 1 }] }, crew.technician));
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.message).toMatch(/readings\.5\.time/);
  });

  it("creates a new site and system in the same transaction as the test", async () => {
    const res = await upload(crew.technician, "sample-1-iso-microns.csv", { newSiteName: "Maple Court 12", newSystemName: "Heat pump, attic", lineSetFeet: "25", liquidOd: "3/8", suctionOd: "3/4", refrigerant: "R-454B" });
    expect(res.status).toBe(201);
    expect(res.body.test.site.name).toBe("Maple Court 12");
    expect(res.body.test.system.name).toBe("Heat pump, attic");
    expect(res.body.test.title).toBe("Maple Court 12 — Heat pump, attic");
    expect(res.body.analysis.leakRate === null || res.body.analysis.leakRate.volumeLitres > 0).toBe(true);
  });

  it("answers the upload with exactly the test record a later GET reads (built from what was written, API contract)", async () => {
    const detailOf = async (id: string) => (await (await get(detailGet, `/api/vacuum-tests/${id}`, crew.technician, id)).json()).test;
    const created = await upload(crew.technician, "sample-2-elapsed-mtorr.csv", { newSiteName: "Quarry Lane 4", newSystemName: "Walk-in cooler", newJob: "true", newJobReason: "Leak repair" });
    expect(created.status).toBe(201);
    expect(created.body.test.job.reason).toBe("Leak repair");
    expect(created.body.test).toEqual(await detailOf(created.body.test.id));
    // an existing site, system and visit chosen by id; then nothing but the file
    const chosen = await upload(crew.technician, "sample-1-iso-microns.csv", { siteId: created.body.test.site.id, systemId: created.body.test.system.id, jobId: created.body.test.job.id });
    expect(chosen.status).toBe(201);
    expect(chosen.body.test.job.id).toBe(created.body.test.job.id);
    expect(chosen.body.test).toEqual(await detailOf(chosen.body.test.id));
    const systemOnly = await upload(crew.technician, "sample-1-iso-microns.csv", { systemId: created.body.test.system.id });
    expect(systemOnly.body.test.site.name).toBe("Quarry Lane 4");
    expect(systemOnly.body.test).toEqual(await detailOf(systemOnly.body.test.id));
    const bare = await upload(crew.technician, "sample-1-iso-microns.csv");
    expect(bare.body.test).toEqual(await detailOf(bare.body.test.id));
  });

  it("refuses a bad field with 400 naming it, and saves nothing", async () => {
    const before = await countRows(crew.owner.organizationId);
    const res = await upload(crew.technician, "sample-1-iso-microns.csv", { lineSetFeet: "lots", liquidOd: "3/8", suctionOd: "3/4" });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/^lineSetFeet:/);
    const foreignSite = await upload(crew.technician, "sample-1-iso-microns.csv", { siteId: "00000000-0000-4000-8000-000000000000" });
    expect(foreignSite.status).toBe(400);
    expect(foreignSite.body.error.message).toMatch(/^siteId:/);
    expect(await countRows(crew.owner.organizationId)).toEqual(before);
  });
});

describe("import preview", () => {
  let owner: TestMember;
  beforeAll(async () => {
    owner = await createShop();
  });

  it("returns the columns, the first 8 data rows and what was detected, saving nothing (API contract)", async () => {
    const name = "sample-4-minutes-torr.csv";
    const res = await previewPost(uploadRequest("/api/imports/preview", { as: owner, file: { body: sampleText(name), name } }));
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.columns.length).toBeGreaterThanOrEqual(2);
    expect(body.rows).toHaveLength(8);
    expect(body.rows[0].length).toBe(body.columns.length);
    expect(body.detected.unit).toBe("torr");
    expect(body.detected.timeFormat).toBe("elapsed_min");
    expect(typeof body.detected.unsure).toBe("boolean");
    expect(await countRows(owner.organizationId)).toMatchObject({ tests: 0, uploads: 0 });
    expect(await listKeys(`orgs/${owner.organizationId}/`)).toEqual([]);
  });

  // A wet hold whose every reading is "d,ddd" microns in a tab file with nothing else to tell: 12,500 or 12.5?
  const ambiguous = '"t (s)"\t"Vacuum (microns)"\n' + Array.from({ length: 80 }, (_, i) => `"${i * 15}"\t"${(1200 + Math.round(10800 * (1 - Math.exp(-i / 12)))).toLocaleString("en-US")}"`).join("\n");

  it("asks before any verdict when a reading could be 1,000-fold apart: unsure, with both readings to choose from (common practice, no published source)", async () => {
    const res = await previewPost(uploadRequest("/api/imports/preview", { as: owner, file: { body: ambiguous, name: "tsv.csv" } }));
    expect(res.status).toBe(200);
    const { detected } = await res.json();
    expect(detected.unsure).toBe(true);
    const reason = detected.unsureReasons.find((r: { code: string }) => r.code === "decimal_mark");
    expect(reason.choices).toEqual([
      { decimalMark: "point", cell: "1,200", reads: "1,200 microns" },
      { decimalMark: "comma", cell: "1,200", reads: "1.2 microns" },
    ]);
  });

  it("the technician's answer is used: decimalMark=comma reads '1,200' as 1.2 microns, point as 1,200 (the larger reading, a wet system, never a pass)", async () => {
    const small = await testsPost(uploadRequest("/api/vacuum-tests", { as: owner, file: { body: ambiguous, name: "tsv.csv" }, fields: { decimalMark: "comma" } }));
    const large = await testsPost(uploadRequest("/api/vacuum-tests", { as: owner, file: { body: ambiguous, name: "tsv.csv" }, fields: { decimalMark: "point" } }));
    expect(small.status).toBe(201);
    expect(large.status).toBe(201);
    const [s, l] = [await small.json(), await large.json()];
    expect(s.analysis.import.unsure).toBe(false);
    expect(s.analysis.decay.startMicrons).toBeCloseTo(1.2, 6);
    expect(l.analysis.decay.startMicrons).toBe(1200);
    expect(l.analysis.verdict).toBe("moisture");
  });

  it("an unknown unit in the header is a 422 naming it, with the columns and first rows for the unit choice", async () => {
    const res = await previewPost(uploadRequest("/api/imports/preview", { as: owner, file: { body: "time,pressure (furlongs)\n0,500\n10,510\n20,520\n30,530\n40,540\n", name: "f.csv" } }));
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(body.error.message).toMatch(/'furlongs' is not a pressure unit known here; units understood:/);
    expect(body.error.details).toMatchObject({ reason: "unknown_unit", columns: ["time", "pressure (furlongs)"] });
    expect(body.error.details.rows.length).toBeGreaterThan(0);
  });

  it("answers 422 with the importer's message for an unreadable file (RFC 9110 §15.5.21 422)", async () => {
    const res = await previewPost(uploadRequest("/api/imports/preview", { as: owner, file: { body: "time,pressure\nnoon,abc\n", name: "x.csv" } }));
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(body.error.code).toBe("invalid_file");
    expect(body.error.message.length).toBeGreaterThan(10);
  });
});

describe("demo seed (scripts/seed-tests.ts, invented company)", () => {
  it("creates a believable month through the real pipeline and skips a second run (idempotent)", async () => {
    const { seedDemoTests } = await import("@/scripts/seed-tests");
    const crew = await createCrew();
    const members = Object.values(crew).map((m) => ({ userId: m.userId, role: m.role, name: m.name }));
    const first = await seedDemoTests(db(), { organizationId: crew.owner.organizationId, members });
    expect(first.created).toBeGreaterThanOrEqual(40);
    expect(first.created).toBeLessThanOrEqual(60);
    const again = await seedDemoTests(db(), { organizationId: crew.owner.organizationId, members });
    expect(again).toEqual({ created: 0, skipped: true });
    const rows = await countRows(crew.owner.organizationId);
    expect(rows.tests).toBe(first.created);
    expect(await listKeys(`orgs/${crew.owner.organizationId}/`)).toHaveLength(first.created);
    // every page of the list, as the owner sees it
    const items: { verdict: string; testedAt: string; technician: { id: string } }[] = [];
    let cursor: string | null = null;
    do {
      const page: { items: typeof items; nextCursor: string | null } = await (
        await listGet(appRequest(`/api/vacuum-tests?limit=50${cursor ? `&cursor=${cursor}` : ""}`, { as: crew.owner }))
      ).json();
      items.push(...page.items);
      cursor = page.nextCursor;
    } while (cursor);
    expect(items).toHaveLength(first.created);
    const verdicts = new Set(items.map((i) => i.verdict));
    for (const v of ["pass", "leak", "moisture", "leak_and_moisture", "inconclusive"]) expect(verdicts).toContain(v);
    const oldest = Math.min(...items.map((i) => Date.parse(i.testedAt)));
    expect(Date.now() - oldest).toBeLessThanOrEqual(31 * 86_400_000);
    expect(new Set(items.map((i) => i.technician.id)).size).toBeGreaterThanOrEqual(2);
  }, 180_000);
});
