import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as listRigs, POST as createRig } from "@/app/api/rigs/route";
import { GET as getRig, PATCH as patchRig } from "@/app/api/rigs/[id]/route";
import { POST as addItem } from "@/app/api/rigs/[id]/items/route";
import { POST as addEvent } from "@/app/api/rigs/[id]/events/route";
import { GET as rigOfTest, PUT as setRigOfTest } from "@/app/api/rigs/by-test/[testId]/route";
import { db } from "@/db/client";
import { insertTest } from "@/db/queries/vacuum-tests";
import { rigReminders, type ReminderEvent, type ReminderItem } from "@/lib/rigs/reminders";
import type { Role } from "@/lib/permissions";
import { addMember, appRequest, createCrew, createShop, routeParams, type TestMember } from "./helpers/members";

const post = (body: unknown, as: TestMember, method = "POST") => ({ method, body: JSON.stringify(body), headers: { "content-type": "application/json" }, as });

describe("rig reminders on fixed dates (our own rules, common practice, no published source)", () => {
  const pump: ReminderItem = { id: "p1", kind: "pump", label: "Pump A", blankOffRatingMicrons: 15, oilEveryHours: 10, oilEveryDays: 30, checkEveryDays: null, addedOn: "2026-01-01" };
  const gauge: ReminderItem = { id: "g1", kind: "gauge", label: "Gauge A", blankOffRatingMicrons: null, oilEveryHours: null, oilEveryDays: null, checkEveryDays: 90, addedOn: "2026-01-01" };
  const ev = (kind: string, occurredOn: string, extra: Partial<ReminderEvent> = {}): ReminderEvent => ({ itemId: null, kind, occurredOn, lowestMicrons: null, pumpHours: null, ...extra });

  it("oil falls due 30 days after the last change, with a 7-day 'soon' warning before", () => {
    const events = [ev("oil_changed", "2026-03-01")];
    const codes = (today: string) => rigReminders([pump], events, today).map((r) => r.code);
    expect(codes("2026-03-22")).toEqual([]); // 21 days: not yet within 7 days of 03-31
    expect(codes("2026-03-24")).toEqual(["oil_due_soon"]); // 7 days before
    expect(codes("2026-03-30")).toEqual(["oil_due_soon"]);
    const due = rigReminders([pump], events, "2026-03-31");
    expect(due.map((r) => r.code)).toEqual(["oil_due"]);
    expect(due[0].dueOn).toBe("2026-03-31");
  });

  it("oil falls due after 10 pumping hours by the hour meter, before the date", () => {
    const events = [ev("oil_changed", "2026-03-01", { pumpHours: 120 }), ev("pump_hours", "2026-03-05", { pumpHours: 129.5 })];
    expect(rigReminders([pump], events, "2026-03-06").map((r) => r.code)).toEqual([]);
    events.push(ev("pump_hours", "2026-03-08", { pumpHours: 130 }));
    expect(rigReminders([pump], events, "2026-03-09").map((r) => r.code)).toEqual(["oil_due"]);
  });

  it("flags a blank-off that keeps getting worse and one far above the maker's rating", () => {
    const events = [
      ev("oil_changed", "2026-03-20"),
      ev("blank_off", "2026-03-01", { lowestMicrons: 18 }),
      ev("blank_off", "2026-03-10", { lowestMicrons: 22 }),
      ev("blank_off", "2026-03-20", { lowestMicrons: 35 }),
    ];
    const codes = rigReminders([pump], events, "2026-03-21").map((r) => r.code);
    expect(codes).toContain("blank_off_worse");
    expect(codes).toContain("blank_off_above_rating"); // 35 > 2 × 15
    const better = [...events, ev("blank_off", "2026-03-21", { lowestMicrons: 16 })];
    expect(rigReminders([pump], better, "2026-03-22").map((r) => r.code)).toEqual([]);
  });

  it("a gauge check is overdue 90 days after the last check against a reference", () => {
    const events = [ev("gauge_checked", "2026-02-01"), ev("gauge_cleaned", "2026-04-01")];
    expect(rigReminders([gauge], events, "2026-05-01").map((r) => r.code)).toEqual([]); // 89 days
    const overdue = rigReminders([gauge], events, "2026-05-02");
    expect(overdue.map((r) => r.code)).toEqual(["gauge_check_overdue"]);
    expect(overdue[0].dueOn).toBe("2026-05-02");
  });
});

describe("/api/rigs roles and scoping", () => {
  let crew: Record<Role, TestMember>;
  let otherTech: TestMember;
  let outsider: TestMember;
  let rigId: string;
  let pumpId: string;

  beforeAll(async () => {
    crew = await createCrew();
    otherTech = await addMember(crew.owner.organizationId, "technician", "Second Tech");
    outsider = await createShop();
    const res = await createRig(appRequest("/api/rigs", post({ name: "Van 3 kit", truck: "Van 3" }, crew.technician)));
    expect(res.status).toBe(201);
    rigId = (await res.json()).rig.id;
  });

  it("a technician keeps the rig they create and manages it: items and an oil change", async () => {
    const item = await addItem(appRequest(`/api/rigs/${rigId}/items`, post({ kind: "pump", label: "6 CFM pump", freeAirCfm: 6, blankOffRatingMicrons: 15, oilEveryDays: 30 }, crew.technician)), routeParams({ id: rigId }));
    expect(item.status).toBe(201);
    pumpId = (await item.json()).item.id;
    const oil = await addEvent(appRequest(`/api/rigs/${rigId}/events`, post({ kind: "oil_changed", itemId: pumpId, occurredOn: "2026-03-01", oilReason: "after_burnout" }, crew.technician)), routeParams({ id: rigId }));
    expect(oil.status).toBe(201);
    const detail = await getRig(appRequest(`/api/rigs/${rigId}?today=2026-04-02`, { as: crew.technician }), routeParams({ id: rigId }));
    const body = await detail.json();
    expect(body.rig.keeperId).toBe(crew.technician.userId);
    expect(body.canManage).toBe(true);
    expect(body.events[0].oilReason).toBe("after_burnout");
    expect(body.reminders.map((r: { code: string }) => r.code)).toEqual(["oil_due"]);
  });

  it("refuses an oil change without a reason (400)", async () => {
    const res = await addEvent(appRequest(`/api/rigs/${rigId}/events`, post({ kind: "oil_changed", occurredOn: "2026-03-02" }, crew.technician)), routeParams({ id: rigId }));
    expect(res.status).toBe(400);
  });

  it("takes the lowest reading of an uploaded blank-off log as the blank-off", async () => {
    const logText = "elapsed_s,vacuum (microns)\n0,900\n10,120\n20,42\n30,37\n40,38\n50,39\n";
    const res = await addEvent(appRequest(`/api/rigs/${rigId}/events`, post({ kind: "blank_off", itemId: pumpId, occurredOn: "2026-03-03", logText }, crew.technician)), routeParams({ id: rigId }));
    expect(res.status).toBe(201);
    expect((await res.json()).event.lowestMicrons).toBe(37);
  });

  it("leads and owners see and manage every rig", async () => {
    for (const who of [crew.lead, crew.owner]) {
      const list = await (await listRigs(appRequest("/api/rigs", { as: who }))).json();
      expect(list.rigs.map((r: { id: string }) => r.id)).toContain(rigId);
      const patch = await patchRig(appRequest(`/api/rigs/${rigId}`, post({ notes: `checked by ${who.role}` }, who, "PATCH")), routeParams({ id: rigId }));
      expect(patch.status).toBe(200);
    }
  });

  it("another technician gets 404 on someone else's rig and does not list it", async () => {
    const res = await getRig(appRequest(`/api/rigs/${rigId}`, { as: otherTech }), routeParams({ id: rigId }));
    expect(res.status).toBe(404);
    const event = await addEvent(appRequest(`/api/rigs/${rigId}/events`, post({ kind: "hose_gaskets_replaced", occurredOn: "2026-03-04" }, otherTech)), routeParams({ id: rigId }));
    expect(event.status).toBe(404);
    const list = await (await listRigs(appRequest("/api/rigs", { as: otherTech }))).json();
    expect(list.rigs).toEqual([]);
  });

  it("a member of another shop gets 404", async () => {
    const res = await getRig(appRequest(`/api/rigs/${rigId}`, { as: outsider }), routeParams({ id: rigId }));
    expect(res.status).toBe(404);
  });

  it("an apprentice sees the rig they keep but may not change it (403); may not create one (403)", async () => {
    const made = await createRig(appRequest("/api/rigs", post({ name: "Apprentice kit", keeperId: crew.apprentice.userId }, crew.lead)));
    expect(made.status).toBe(201);
    const id = (await made.json()).rig.id;
    const seen = await getRig(appRequest(`/api/rigs/${id}`, { as: crew.apprentice }), routeParams({ id }));
    expect(seen.status).toBe(200);
    expect((await seen.json()).canManage).toBe(false);
    const change = await patchRig(appRequest(`/api/rigs/${id}`, post({ name: "Mine now" }, crew.apprentice, "PATCH")), routeParams({ id }));
    expect(change.status).toBe(403);
    const create = await createRig(appRequest("/api/rigs", post({ name: "Nope" }, crew.apprentice)));
    expect(create.status).toBe(403);
  });

  it("records which rig a test used and returns that rig's recent history for the test", async () => {
    const testId = randomUUID();
    await insertTest(db(), { id: testId, organizationId: crew.owner.organizationId, createdById: crew.technician.userId, title: "Rig link test", source: "typed" });
    const put = await setRigOfTest(appRequest(`/api/rigs/by-test/${testId}`, post({ rigId }, crew.technician, "PUT")), routeParams({ testId }));
    expect(put.status).toBe(200);
    const asLead = await rigOfTest(appRequest(`/api/rigs/by-test/${testId}?today=2026-03-05`, { as: crew.lead }), routeParams({ testId }));
    const body = await asLead.json();
    expect(body.rig.id).toBe(rigId);
    expect(body.events.map((e: { kind: string }) => e.kind)).toEqual(expect.arrayContaining(["oil_changed", "blank_off"]));
    expect(body.blankOffTrend.map((b: { lowestMicrons: number }) => b.lowestMicrons)).toEqual([37]);
    const other = await rigOfTest(appRequest(`/api/rigs/by-test/${testId}`, { as: otherTech }), routeParams({ testId }));
    expect(other.status).toBe(404);
    const foreign = await rigOfTest(appRequest(`/api/rigs/by-test/${testId}`, { as: outsider }), routeParams({ testId }));
    expect(foreign.status).toBe(404);
  });

  it("takes the lowest of a 300,000-row blank-off log (a day and a half at 2 s) without spreading the readings onto the call stack (V8's limit; engine behaviour, no published source)", async () => {
    const rows = ["elapsed_s,vacuum (microns)"];
    for (let i = 0; i < 300_000; i++) rows.push(`${i * 2},${Math.round(25 + 20000 * Math.exp(-i / 200)) + (i % 7)}`);
    rows[250_001] = "500002,21";
    const res = await addEvent(appRequest(`/api/rigs/${rigId}/events`, post({ kind: "blank_off", itemId: pumpId, occurredOn: "2026-03-04", logText: rows.join("\n") }, crew.technician)), routeParams({ id: rigId }));
    expect(res.status).toBe(201);
    expect((await res.json()).event.lowestMicrons).toBe(21);
  });

  it("anonymous callers get 401", async () => {
    const res = await listRigs(appRequest("/api/rigs", { as: null }));
    expect(res.status).toBe(401);
  });
});
