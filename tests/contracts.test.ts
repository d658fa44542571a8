/**
 * The answers the client is typed against (lib/contracts/) are what the routes really send: each real
 * answer, from the real database and S3 fake, parses with the declared strict schema, so a field
 * added, renamed or retyped on the server fails here before it reaches a page.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { GET as listGet, POST as testsPost } from "@/app/api/vacuum-tests/route";
import { GET as detailGet } from "@/app/api/vacuum-tests/[id]/route";
import { GET as sitesGet, POST as sitesPost } from "@/app/api/sites/route";
import { GET as systemsGet, POST as systemsPost } from "@/app/api/systems/route";
import { GET as jobsGet, POST as jobsPost } from "@/app/api/jobs/route";
import { GET as profilesGet } from "@/app/api/profiles/route";
import { GET as membersGet } from "@/app/api/members/route";
import { jobsAnswerSchema, membersAnswerSchema, profilesAnswerSchema, sitesAnswerSchema, systemsAnswerSchema } from "@/lib/contracts/records";
import { testDetailSchema, testPageSchema, testSummarySchema } from "@/lib/contracts/vacuum-tests";
import type { Role } from "@/lib/permissions";
import { appRequest, createCrew, routeParams, type TestMember } from "./helpers/members";
import { jsonRequest, sampleText, uploadRequest } from "./helpers/uploads";

let crew: Record<Role, TestMember>;
let siteId: string;
beforeAll(async () => {
  crew = await createCrew();
  const site = await sitesPost(jsonRequest("/api/sites", { name: "Contract Street 4", newCustomerName: "Cedar Row Flats" }, crew.owner));
  siteId = (await site.json()).site.id;
  const system = await systemsPost(jsonRequest("/api/systems", { siteId, name: "Roof unit 1" }, crew.owner));
  expect(system.status).toBe(201);
  const job = await jobsPost(jsonRequest("/api/jobs", { siteId, visitedOn: "2026-11-03", reason: "Install" }, crew.owner));
  expect(job.status).toBe(201);
});

describe("vacuum-test answers match lib/contracts/vacuum-tests.ts", () => {
  let testId: string;

  it("POST /api/tests answers a test summary, and an apprentice's practice upload the gated variant", async () => {
    const res = await testsPost(uploadRequest("/api/tests", { as: crew.technician, file: { body: sampleText("sample-2-elapsed-mtorr.csv"), name: "s2.csv" }, fields: { siteId } }));
    expect(res.status).toBe(201);
    const summary = testSummarySchema.parse(await res.json());
    expect(summary.analysis?.verdict).toBe("leak");
    testId = summary.test.id;

    const practice = await testsPost(uploadRequest("/api/tests", { as: crew.apprentice, file: { body: sampleText("sample-1-iso-microns.csv"), name: "p.csv" }, fields: { isPractice: "true" } }));
    expect(practice.status).toBe(201);
    const gated = testSummarySchema.parse(await practice.json());
    expect(gated.analysis).toBeNull();
    expect(gated.practiceCallUrl).toMatch(/^\/practice\//);
  });

  it("GET /api/tests answers a page of list items", async () => {
    const page = testPageSchema.parse(await (await listGet(appRequest("/api/tests", { as: crew.owner }))).json());
    expect(page.items.map((i) => i.id)).toContain(testId);
  });

  it("GET /api/tests/:id answers the detail, and ?analysisId= adds which version is shown", async () => {
    const detail = testDetailSchema.parse(await (await detailGet(appRequest(`/api/tests/${testId}`, { as: crew.owner }), routeParams({ id: testId }))).json());
    expect(detail.test.site?.id).toBe(siteId);
    expect(detail.shown).toBeUndefined();
    const analysisId = detail.history[0].id;
    const at = await detailGet(appRequest(`/api/tests/${testId}?analysisId=${analysisId}`, { as: crew.owner }), routeParams({ id: testId }));
    expect(testDetailSchema.parse(await at.json()).shown).toEqual({ analysisId, version: 1, versionCount: 1, isCurrent: true });
  });
});

describe("picker answers match lib/contracts/records.ts (each list under its own key)", () => {
  it("sites, systems, jobs, profiles and members", async () => {
    const as = crew.owner;
    expect(sitesAnswerSchema.parse(await (await sitesGet(appRequest("/api/sites", { as }))).json()).items).toHaveLength(1);
    expect(systemsAnswerSchema.parse(await (await systemsGet(appRequest(`/api/systems?siteId=${siteId}`, { as }))).json()).items[0].name).toBe("Roof unit 1");
    expect(jobsAnswerSchema.parse(await (await jobsGet(appRequest("/api/jobs", { as }))).json()).items[0].reason).toBe("Install");
    expect(profilesAnswerSchema.parse(await (await profilesGet(appRequest("/api/profiles", { as }))).json()).items[0].id).toBeNull();
    expect(membersAnswerSchema.parse(await (await membersGet(appRequest("/api/members", { as }))).json()).members).toHaveLength(5);
  });
});
