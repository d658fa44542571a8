/**
 * Rig upkeep reminders by e-mail (lib/rigs/reminder-mail.ts, our rule): the daily job mails the
 * rig's keeper a reminder once when it comes up, not again the next day, and again only after it
 * cleared and came back; a rig nobody keeps goes to the leads. Real database, pg-boss, catcher.
 */
import { describe, expect, it } from "vitest";
import { POST as createRig } from "@/app/api/rigs/route";
import { POST as addItem } from "@/app/api/rigs/[id]/items/route";
import { POST as addEvent } from "@/app/api/rigs/[id]/events/route";
import { db } from "@/db/client";
import { mailRigReminders } from "@/lib/rigs/reminder-mail";
import { crewForFile, jsonInit } from "./helpers/crew";
import { jobRunnerForFile } from "./helpers/jobs";
import { readMailbox, waitForMail } from "./helpers/mailbox";
import { appRequest, routeParams } from "./helpers/members";

const crew = crewForFile();
jobRunnerForFile();

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

describe("rig upkeep reminders by e-mail (our rule, common practice, no published source)", () => {
  it("mails the keeper once when oil comes due, not the next day, and again after an oil change once it is due again", async () => {
    const org = crew.owner.organizationId;
    const rig = await (await createRig(appRequest("/api/rigs", jsonInit(crew.technician, { name: "Van 9 kit" })))).json();
    const rigId = rig.rig.id;
    const item = await addItem(appRequest(`/api/rigs/${rigId}/items`, jsonInit(crew.technician, { kind: "pump", label: "Van 9 pump", oilEveryDays: 30 })), routeParams({ id: rigId }));
    expect(item.status).toBe(201);
    const pumpId = (await item.json()).item.id;
    const mine = () => readMailbox().filter((m) => m.to.includes(crew.technician.email) && /Rig upkeep: Oil change due: Van 9 pump/.test(m.subject));

    expect((await mailRigReminders(db(), { today: day(10), organizationId: org })).mailed).toBe(0);
    expect((await mailRigReminders(db(), { today: day(30), organizationId: org })).mailed).toBe(1);
    const first = await waitForMail(crew.technician.email, /Rig upkeep: Oil change due: Van 9 pump/);
    expect(first.text).toContain("Van 9 kit");
    expect(first.text).toMatch(/\/tools\/rigs\//);
    expect((await mailRigReminders(db(), { today: day(31), organizationId: org })).mailed).toBe(0);

    const oil = await addEvent(appRequest(`/api/rigs/${rigId}/events`, jsonInit(crew.technician, { kind: "oil_changed", itemId: pumpId, occurredOn: day(31), oilReason: "routine" })), routeParams({ id: rigId }));
    expect(oil.status).toBe(201);
    expect((await mailRigReminders(db(), { today: day(32), organizationId: org })).mailed).toBe(0); // cleared
    expect((await mailRigReminders(db(), { today: day(61), organizationId: org })).mailed).toBe(1); // due again
    await expect.poll(() => mine().length, { timeout: 10_000 }).toBe(2);
  });

  it("sends a rig nobody keeps to the leads", async () => {
    const org = crew.owner.organizationId;
    const rig = await (await createRig(appRequest("/api/rigs", jsonInit(crew.lead, { name: "Shop spare kit", keeperId: null })))).json();
    const rigId = rig.rig.id;
    expect(rig.rig.keeperId).toBeNull();
    await addItem(appRequest(`/api/rigs/${rigId}/items`, jsonInit(crew.lead, { kind: "gauge", label: "Spare gauge", checkEveryDays: 90 })), routeParams({ id: rigId }));
    expect((await mailRigReminders(db(), { today: day(91), organizationId: org })).mailed).toBeGreaterThanOrEqual(1);
    const mail = await waitForMail(crew.lead.email, /Rig upkeep: Gauge check overdue: Spare gauge/);
    expect(mail.text).toContain("Shop spare kit");
  });
});
