/**
 * GET /api/vacuum-tests/:id?analysisId= — an earlier analysis version, read back whole (real database and
 * S3 fake, the real upload and re-analysis routes; sample logs are invented data).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { POST as testsPost } from "@/app/api/vacuum-tests/route";
import { GET as detailGet } from "@/app/api/vacuum-tests/[id]/route";
import { POST as analysesPost } from "@/app/api/vacuum-tests/[id]/analyses/route";
import { appRequest, createCrew, createShop, routeParams, type TestMember } from "./helpers/members";
import { jsonRequest, sampleText, uploadRequest } from "./helpers/uploads";
import { seedTest } from "./helpers/seed-test";
import type { Role } from "@/lib/permissions";

const SAMPLE = "sample-1-iso-microns.csv";
const detail = (as: TestMember, id: string, search = "") => detailGet(appRequest(`/api/vacuum-tests/${id}${search}`, { as }), routeParams({ id }));

let crew: Record<Role, TestMember>;
let other: TestMember;
let testId: string;
let v1: { id: string; verdict: string; series: { t: number[]; p: number[] } };
let v2Id: string;

beforeAll(async () => {
  [crew, other] = await Promise.all([createCrew(), createShop()]);
  const up = await testsPost(uploadRequest("/api/vacuum-tests", { as: crew.technician, file: { body: sampleText(SAMPLE), name: SAMPLE } }));
  expect(up.status).toBe(201);
  testId = (await up.json()).test.id;
  const first = await (await detail(crew.technician, testId)).json();
  v1 = { id: first.test.currentAnalysisId, verdict: first.analysis.verdict, series: first.series };
  // Version 2 reads the same microns as pascals (1 Pa ≈ 7.5 microns, NIST SP 811 Appendix B), so its
  // series and verdict differ from version 1's.
  const re = await analysesPost(jsonRequest(`/api/vacuum-tests/${testId}/analyses`, { unit: "pa", reason: "gauge set to pascals" }, crew.technician), routeParams({ id: testId }));
  expect(re.status).toBe(201);
  v2Id = (await re.json()).analysisId;
});

describe("an earlier analysis version (API contract)", () => {
  it("returns version 1's verdict and series after a re-analysis made version 2 (pass per fixtures/samples/EXPECTED.md)", async () => {
    expect(v1.verdict).toBe("pass");
    const current = await (await detail(crew.technician, testId)).json();
    expect(current.test.currentAnalysisId).toBe(v2Id);
    expect(current.analysis.verdict).not.toBe("pass");

    const res = await detail(crew.technician, testId, `?analysisId=${v1.id}`);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.analysis.verdict).toBe("pass");
    // Version 1's stored series exactly (same readings, same microns), not version 2's.
    expect(body.series).toEqual(v1.series);
    expect(body.series.p).not.toEqual(current.series.p);
    expect(body.shown).toEqual({ analysisId: v1.id, version: 1, versionCount: 2, isCurrent: false });
    expect(body.test.currentAnalysisId).toBe(v2Id);
    expect(body.history.map((h: { version: number }) => h.version)).toEqual([1, 2]);
  });

  it("marks the current version as current when asked for it by id", async () => {
    const body = await (await detail(crew.lead, testId, `?analysisId=${v2Id}`)).json();
    expect(body.shown).toEqual({ analysisId: v2Id, version: 2, versionCount: 2, isCurrent: true });
  });

  it("answers 404 for another organization's analysis id and for an analysis of another test", async () => {
    const foreignTest = await seedTest(other, { verdict: "leak" });
    const foreign = await (await detail(other, foreignTest)).json();
    const res = await detail(crew.technician, testId, `?analysisId=${foreign.test.currentAnalysisId}`);
    expect(res.status).toBe(404);
    expect(JSON.stringify(await res.json())).not.toContain("leak");

    const sibling = await seedTest(crew.technician, { verdict: "leak" });
    const siblingDetail = await (await detail(crew.technician, sibling)).json();
    expect((await detail(crew.technician, testId, `?analysisId=${siblingDetail.test.currentAnalysisId}`)).status).toBe(404);
    // The other shop cannot reach this test's version either.
    expect((await detail(other, testId, `?analysisId=${v1.id}`)).status).toBe(404);
  });

  it("answers 400 naming analysisId for a malformed id", async () => {
    const res = await detail(crew.technician, testId, "?analysisId=version-1");
    expect(res.status).toBe(400);
    expect((await res.json()).error.message).toMatch(/^analysisId:/);
  });

  it("keeps an apprentice's practice test closed at every version until their call (403 naming /practice/:id)", async () => {
    const practice = await seedTest(crew.apprentice, { verdict: "leak", isPractice: true });
    const trainerView = await (await detail(crew.trainer, practice)).json();
    const res = await detail(crew.apprentice, practice, `?analysisId=${trainerView.test.currentAnalysisId}`);
    expect(res.status).toBe(403);
    const text = JSON.stringify(await res.json());
    expect(text).toContain(`/practice/${practice}`);
    expect(text).not.toMatch(/"verdict"|leak|steady_climb/i);
  });
});
