/**
 * The tests API keeps an apprentice's practice test closed until their own call: the detail,
 * the list, the re-analysis and the report PDF give nothing of the analysis away first.
 * (Making the call before seeing the answer: common practice in training, no published source.)
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as testGet } from "@/app/api/vacuum-tests/[id]/route";
import { GET as testList } from "@/app/api/vacuum-tests/route";
import { POST as reanalyse } from "@/app/api/vacuum-tests/[id]/analyses/route";
import { GET as reportPdf } from "@/app/api/vacuum-tests/[id]/report/route";
import { POST as callPost } from "@/app/api/practice/tests/[id]/call/route";
import type { Role } from "@/lib/permissions";
import { appRequest, createCrew, routeParams, type TestMember } from "./helpers/members";
import { seedTest } from "./helpers/seed-test";

const post = (path: string, as: TestMember, body: unknown) =>
  appRequest(path, { method: "POST", as, body: JSON.stringify(body), headers: { "content-type": "application/json" } });

let crew: Record<Role, TestMember>;
let practiceId: string;

beforeAll(async () => {
  crew = await createCrew();
  practiceId = await seedTest(crew.apprentice, { verdict: "leak", isPractice: true, title: "Practice: basement split" });
});
afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

describe("practice tests through the tests API", () => {
  it("before the call: detail answers 403 naming where to call, and the body has no verdict", async () => {
    const res = await testGet(appRequest(`/api/vacuum-tests/${practiceId}`, { as: crew.apprentice }), routeParams({ id: practiceId }));
    expect(res.status).toBe(403);
    const text = await res.text();
    expect(JSON.parse(text).error.details.practiceCallUrl).toBe(`/practice/${practiceId}`);
    expect(text).not.toMatch(/"verdict"|leak/i);
  });

  it("before the call: the list shows the row without verdict, numbers or finding codes", async () => {
    const res = await testList(appRequest("/api/vacuum-tests?isPractice=true", { as: crew.apprentice }));
    expect(res.status).toBe(200);
    const item = (await res.json()).items.find((i: { id: string }) => i.id === practiceId);
    expect(item).toBeTruthy();
    expect(item.verdict).toBeNull();
    expect(item.confidence).toBeNull();
    expect(item.findingCodes).toEqual([]);
  });

  it("before the call: re-analysis and the report PDF are refused with 403", async () => {
    const again = await reanalyse(post(`/api/vacuum-tests/${practiceId}/analyses`, crew.apprentice, { reason: "peek" }), routeParams({ id: practiceId }));
    expect(again.status).toBe(403);
    const pdf = await reportPdf(appRequest(`/api/vacuum-tests/${practiceId}/report`, { as: crew.apprentice }), routeParams({ id: practiceId }));
    expect(pdf.status).toBe(403);
  });

  it("the trainer sees the verdict all along; the apprentice sees it after the call", async () => {
    const trainer = await testGet(appRequest(`/api/vacuum-tests/${practiceId}`, { as: crew.trainer }), routeParams({ id: practiceId }));
    expect(trainer.status).toBe(200);
    expect((await trainer.json()).analysis.verdict).toBe("leak");
    const called = await callPost(post(`/api/practice/tests/${practiceId}/call`, crew.apprentice, { call: "leak", reason: "keeps climbing in a straight line" }), routeParams({ id: practiceId }));
    expect(called.status).toBeLessThan(300);
    const after = await testGet(appRequest(`/api/vacuum-tests/${practiceId}`, { as: crew.apprentice }), routeParams({ id: practiceId }));
    expect(after.status).toBe(200);
    expect((await after.json()).analysis.verdict).toBe("leak");
  });
});
