/**
 * Practice calls against the real database: an apprentice's practice test shows its curve only
 * until the apprentice has called it (no verdict, findings or fitted numbers in the JSON), then
 * the analysis beside the call; the trainer sees calls, match rates and comments; practiceGate;
 * another shop → 404.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as practiceList } from "@/app/api/practice/tests/route";
import { GET as practiceGet } from "@/app/api/practice/tests/[id]/route";
import { POST as callPost } from "@/app/api/practice/tests/[id]/call/route";
import { GET as callsGet } from "@/app/api/practice/calls/route";
import { POST as commentPost } from "@/app/api/practice/calls/[id]/comments/route";
import { db } from "@/db/client";
import { practiceGate } from "@/lib/practice/gate";
import type { Role } from "@/lib/permissions";
import { addMember, appRequest, createCrew, createShop, routeParams, type TestMember } from "./helpers/members";
import { seedTest } from "./helpers/seed-test";

const post = (path: string, as: TestMember, body: unknown) =>
  appRequest(path, { method: "POST", as, body: JSON.stringify(body), headers: { "content-type": "application/json" } });
const view = (id: string, as: TestMember) => practiceGet(appRequest(`/api/practice/tests/${id}`, { as }), routeParams({ id }));
const call = (id: string, as: TestMember, body: unknown) => callPost(post(`/api/practice/tests/${id}/call`, as, body), routeParams({ id }));

/** Keys that carry the answer; none may appear anywhere in the JSON before the call. */
const ANSWER_KEYS = ["verdict", "findings", "decay", "reasons", "isolationAt", "holds", "phases", "forecast", "confidence", "profileRules", "leakRate", "analysisVerdict"];
function keysOf(v: unknown, out = new Set<string>()): Set<string> {
  if (Array.isArray(v)) v.forEach((x) => keysOf(x, out));
  else if (v && typeof v === "object")
    for (const [k, x] of Object.entries(v)) {
      out.add(k);
      keysOf(x, out);
    }
  return out;
}

let crew: Record<Role, TestMember>;
let leakId: string;
let passId: string;

beforeAll(async () => {
  crew = await createCrew();
  leakId = await seedTest(crew.apprentice, { verdict: "leak", isPractice: true, title: "Practice: garage split" });
  passId = await seedTest(crew.apprentice, { verdict: "pass", isPractice: true, title: "Practice: attic unit" });
});
afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

describe("the call comes before the verdict (practice calls; common practice in training, no published source)", () => {
  it("before the call: the JSON holds the curve and no verdict, findings or fitted numbers", async () => {
    const res = await view(leakId, crew.apprentice);
    expect(res.status).toBe(200);
    const text = await res.text();
    const body = JSON.parse(text);
    expect(body.state).toBe("awaiting_call");
    expect(body.analysis).toBeNull();
    expect(body.call).toBeNull();
    expect(body.series.t.length).toBe(body.series.p.length);
    expect(body.series.t.length).toBeGreaterThan(10);
    const keys = keysOf(body);
    for (const k of ANSWER_KEYS) expect(keys.has(k), `key "${k}" leaked before the call`).toBe(false);
    expect(text).not.toMatch(/steady_climb|"leak"/);
    // the list says "not called" and nothing else
    const list = await (await practiceList(appRequest("/api/practice/tests", { as: crew.apprentice }))).json();
    const item = list.tests.find((t: { id: string }) => t.id === leakId);
    expect(item).toMatchObject({ called: false, matched: null });
    expect(keysOf(list).has("verdict")).toBe(false);
  });

  it("practiceGate says hidden for the apprentice before the call, visible for a trainer and after the call", async () => {
    const org = crew.owner.organizationId;
    const gate = (m: TestMember, testId = passId) => practiceGate(db(), { organizationId: org, testId, userId: m.userId, role: m.role });
    expect(await gate(crew.apprentice)).toBe("hidden");
    expect(await gate(crew.trainer)).toBe("visible");
    expect(await gate(crew.owner)).toBe("visible");
    const normal = await seedTest(crew.apprentice, { verdict: "pass", isPractice: false });
    expect(await gate(crew.apprentice, normal)).toBe("visible");
    // fails closed for an apprentice on an unknown test
    expect(await gate(crew.apprentice, "00000000-0000-4000-8000-000000000000")).toBe("hidden");
  });

  it("the call is recorded with the verdict of the time, then the analysis is shown beside it", async () => {
    const res = await call(leakId, crew.apprentice, { call: "moisture", reason: "It rose fast at the start." });
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.state).toBe("revealed");
    expect(body.call).toMatchObject({ call: "moisture", reason: "It rose fast at the start.", analysisVerdict: "leak", matched: false });
    expect(body.analysis.verdict).toBe("leak");
    expect(body.analysis.findings.map((f: { code: string }) => f.code)).toEqual(["steady_climb"]);
    expect(body.analysis.decay.leakRateMicronsPerMinute).toBe(60);
    // later reads show the same
    const again = await (await view(leakId, crew.apprentice)).json();
    expect(again.state).toBe("revealed");
    expect(again.call.matched).toBe(false);
    expect(await practiceGate(db(), { organizationId: crew.owner.organizationId, testId: leakId, userId: crew.apprentice.userId, role: "apprentice" })).toBe("visible");
  });

  it("the first call stands (409 on a second), and a blank reason or an unknown call is 400", async () => {
    expect((await call(leakId, crew.apprentice, { call: "leak", reason: "Changed my mind." })).status).toBe(409);
    expect((await call(passId, crew.apprentice, { call: "pass", reason: "" })).status).toBe(400);
    expect((await call(passId, crew.apprentice, { call: "no_idea", reason: "Not sure at all" })).status).toBe(400);
    expect((await view(passId, crew.apprentice)).status).toBe(200);
    expect((await (await view(passId, crew.apprentice)).json()).state).toBe("awaiting_call");
  });

  it("a matching call counts as matched", async () => {
    const body = await (await call(passId, crew.apprentice, { call: "pass", reason: "Small rise, settles low." })).json();
    expect(body.call).toMatchObject({ matched: true, analysisVerdict: "pass" });
  });

  it("only apprentices make calls (403 for others); a trainer sees the analysis directly", async () => {
    expect((await call(passId, crew.trainer, { call: "pass", reason: "I know this one" })).status).toBe(403);
    expect((await call(passId, crew.technician, { call: "pass", reason: "I know this one" })).status).toBe(403);
    const t = await (await view(passId, crew.trainer)).json();
    expect(t.state).toBe("revealed");
    expect(t.analysis.verdict).toBe("pass");
  });
});

describe("the trainer's view: calls, match rate, comments", () => {
  it("shows each apprentice's calls and how often they matched (1 of 2 = 0.5)", async () => {
    const res = await callsGet(appRequest("/api/practice/calls", { as: crew.trainer }));
    expect(res.status).toBe(200);
    const body = await res.json();
    const me = body.apprentices.find((a: { apprentice: { id: string } }) => a.apprentice.id === crew.apprentice.userId);
    expect(me).toMatchObject({ calls: 2, matched: 1, matchRate: 0.5 });
    expect(body.calls).toHaveLength(2);
  });

  it("a trainer comments; the apprentice sees the comment on their own calls; another apprentice sees none of it", async () => {
    const { calls } = await (await callsGet(appRequest("/api/practice/calls", { as: crew.trainer }))).json();
    const leakCall = calls.find((c: { testId: string }) => c.testId === leakId);
    const res = await commentPost(post(`/api/practice/calls/${leakCall.id}/comments`, crew.trainer, { body: "It never levels off — look at the slope at the end." }), routeParams({ id: leakCall.id }));
    expect(res.status).toBe(201);
    const own = await (await callsGet(appRequest("/api/practice/calls", { as: crew.apprentice }))).json();
    const mine = own.calls.find((c: { id: string }) => c.id === leakCall.id);
    expect(mine.comments.map((c: { body: string; author: { name: string } }) => [c.body, c.author.name])).toEqual([["It never levels off — look at the slope at the end.", crew.trainer.name]]);
    const other = await addMember(crew.owner.organizationId, "apprentice", "Other Apprentice");
    const theirs = await (await callsGet(appRequest("/api/practice/calls", { as: other }))).json();
    expect(theirs.calls).toEqual([]);
    expect((await commentPost(post(`/api/practice/calls/${leakCall.id}/comments`, other, { body: "me too" }), routeParams({ id: leakCall.id }))).status).toBe(404);
  });

  it("another shop: 404 for the practice test, the call and the comment", async () => {
    const stranger = await createShop();
    const strangerApprentice = await addMember(stranger.organizationId, "apprentice");
    expect((await view(passId, stranger)).status).toBe(404);
    expect((await call(passId, strangerApprentice, { call: "pass", reason: "guessing here" })).status).toBe(404);
    const { calls } = await (await callsGet(appRequest("/api/practice/calls", { as: crew.trainer }))).json();
    expect((await commentPost(post(`/api/practice/calls/${calls[0].id}/comments`, stranger, { body: "hi" }), routeParams({ id: calls[0].id }))).status).toBe(404);
    expect((await (await callsGet(appRequest("/api/practice/calls", { as: stranger }))).json()).calls).toEqual([]);
  });
});
