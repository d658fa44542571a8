import { describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { vacuumTests, testEvents } from "@/db/schema";
import { GET as reviewGet, POST as reviewPost } from "@/app/api/vacuum-tests/[id]/review/route";
import { GET as eventsGet } from "@/app/api/vacuum-tests/[id]/events/route";
import { GET as queueGet } from "@/app/api/review/route";
import { routeNewTestToReview } from "@/lib/review/auto";
import { checkTransition, TRANSITIONS } from "@/lib/review/state";
import { TEST_STATUSES } from "@/db/schema";
import { appRequest, createShop, routeParams, type TestMember } from "./helpers/members";
import { jsonInit, crewForFile } from "./helpers/crew";
import { jobRunnerForFile } from "./helpers/jobs";
import { sendJob } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";
import { firstAppLink, waitForMail } from "./helpers/mailbox";
import { seedTest } from "./helpers/seed-test";
import { sampleText, uploadRequest } from "./helpers/uploads";
import { POST as uploadPost } from "@/app/api/vacuum-tests/route";

const post = (id: string, as: TestMember, body: unknown) =>
  reviewPost(appRequest(`/api/vacuum-tests/${id}/review`, jsonInit(as, body)), routeParams({ id }));

const crew = crewForFile();
jobRunnerForFile();

describe("review state machine (product rule, lib/review/state.ts)", () => {
  it("allows exactly the documented transitions and names the status in every refusal (product rule)", () => {
    let legal = 0;
    for (const from of TEST_STATUSES) {
      for (const action of Object.keys(TRANSITIONS) as (keyof typeof TRANSITIONS)[]) {
        const c = checkTransition(from, action);
        if (c.ok) legal++;
        else expect(c.message).toMatch(/^Cannot .+ a test that is /);
      }
    }
    // request_review 1 + ask_help 3 + sign_off 2 + accept_with_reason 2 + send_back 2 + resubmit 1 = 11 legal pairs of 24.
    expect(legal).toBe(11);
    expect(checkTransition("signed_off", "send_back").ok).toBe(false);
    expect(checkTransition("sent_back", "sign_off").ok).toBe(false);
    expect(checkTransition("sent_back", "resubmit")).toEqual({ ok: true, to: "waiting_review" });
  });
});

describe("review through the API (permission matrix, DEVELOPERS.md)", () => {
  it("technician asks for review → leads are e-mailed with a link back to the test", async () => {
    const id = await seedTest(crew.technician, { title: "Attic air handler" });
    const res = await post(id, crew.technician, { action: "request_review" });
    expect(res.status).toBe(200);
    expect((await res.json()).status).toBe("waiting_review");
    const mail = await waitForMail(crew.lead.email, /Review requested: Attic air handler/);
    expect(mail.text).toContain(crew.technician.name);
    expect(firstAppLink(mail)).toMatch(new RegExp(`/vacuum-tests/${id}$`));
    expect(mail.html).toContain(`/vacuum-tests/${id}`);
  });

  it("a technician cannot sign off (tests.review is owner + lead) → 403, status unchanged", async () => {
    const id = await seedTest(crew.technician);
    await post(id, crew.technician, { action: "request_review" });
    const res = await post(id, crew.technician, { action: "sign_off" });
    expect(res.status).toBe(403);
    const [row] = await db().select({ status: vacuumTests.status }).from(vacuumTests).where(eq(vacuumTests.id, id));
    expect(row.status).toBe("waiting_review");
  });

  it("an apprentice cannot see another technician's test → 404 on review and events (visibility rule, DEVELOPERS.md)", async () => {
    const id = await seedTest(crew.technician);
    expect((await post(id, crew.apprentice, { action: "request_review" })).status).toBe(404);
    expect((await eventsGet(appRequest(`/api/vacuum-tests/${id}/events`, { as: crew.apprentice }), routeParams({ id }))).status).toBe(404);
  });

  it("another shop's lead gets 404, never 403 (cross-organization rule, DEVELOPERS.md)", async () => {
    const id = await seedTest(crew.technician);
    const stranger = await createShop();
    expect((await post(id, stranger, { action: "sign_off" })).status).toBe(404);
    expect((await reviewGet(appRequest(`/api/vacuum-tests/${id}/review`, { as: stranger }), routeParams({ id }))).status).toBe(404);
  });

  it("send back needs a request; sign off of a sent-back test is 409; resubmit then sign off; signed off is final (product rule)", async () => {
    const id = await seedTest(crew.technician, { title: "Rooftop unit 3" });
    await post(id, crew.technician, { action: "request_review" });
    expect((await post(id, crew.lead, { action: "send_back" })).status).toBe(400);
    const back = await post(id, crew.lead, { action: "send_back", note: "Pull down again and hold 15 minutes." });
    expect(back.status).toBe(200);
    const backMail = await waitForMail(crew.technician.email, /Sent back: Rooftop unit 3/);
    expect(backMail.text).toContain("Pull down again and hold 15 minutes.");

    const early = await post(id, crew.lead, { action: "sign_off" });
    expect(early.status).toBe(409);
    expect((await early.json()).error.message).toMatch(/sent back/);

    expect((await post(id, crew.technician, { action: "resubmit", note: "Held 15 min at 380 microns." })).status).toBe(200);
    const signed = await post(id, crew.lead, { action: "sign_off" });
    expect(signed.status).toBe(200);
    expect((await signed.json()).status).toBe("signed_off");
    await waitForMail(crew.technician.email, /Signed off: Rooftop unit 3/);

    const again = await post(id, crew.owner, { action: "send_back", note: "x" });
    expect(again.status).toBe(409);
    expect((await again.json()).error.message).toMatch(/final/);

    const ev = await eventsGet(appRequest(`/api/vacuum-tests/${id}/events`, { as: crew.technician }), routeParams({ id }));
    const { events } = await ev.json();
    expect(events.map((e: { kind: string }) => e.kind)).toEqual(["review_requested", "sent_back", "resubmitted", "signed_off"]);
    expect(events[1]).toMatchObject({ actorName: crew.lead.name, fromStatus: "waiting_review", toStatus: "sent_back", note: "Pull down again and hold 15 minutes." });
    expect(Number.isNaN(Date.parse(events[3].createdAt))).toBe(false);
  });

  it("GET review lists only the actions the role may take (permission matrix, DEVELOPERS.md)", async () => {
    const id = await seedTest(crew.technician);
    const asTech = await (await reviewGet(appRequest(`/api/vacuum-tests/${id}/review`, { as: crew.technician }), routeParams({ id }))).json();
    expect(asTech.actions).toEqual(["request_review", "ask_help"]);
    const asLead = await (await reviewGet(appRequest(`/api/vacuum-tests/${id}/review`, { as: crew.lead }), routeParams({ id }))).json();
    expect(asLead.actions).toEqual(["request_review", "ask_help", "sign_off", "send_back"]);
  });
});

describe("automatic routing into the lead's queue (product rule)", () => {
  it("a leak goes to waiting_review by Riseline itself, once; a pass and a practice leak stay submitted", async () => {
    const leak = await seedTest(crew.technician, { verdict: "leak", title: "Condenser swap" });
    const pass = await seedTest(crew.technician, { verdict: "pass" });
    const practice = await seedTest(crew.technician, { verdict: "leak", isPractice: true });
    const first = await routeNewTestToReview(db(), { organizationId: crew.owner.organizationId, testId: leak, actorId: crew.technician.userId });
    expect(first.routed).toBe(true);
    expect(first.reasons.join(" ")).toMatch(/Steady climb: leak likely/);
    const second = await routeNewTestToReview(db(), { organizationId: crew.owner.organizationId, testId: leak, actorId: crew.technician.userId });
    expect(second.routed).toBe(false);
    expect((await routeNewTestToReview(db(), { organizationId: crew.owner.organizationId, testId: pass, actorId: null })).routed).toBe(false);
    expect((await routeNewTestToReview(db(), { organizationId: crew.owner.organizationId, testId: practice, actorId: null })).routed).toBe(false);
    const evs = await db().select().from(testEvents).where(and(eq(testEvents.testId, leak)));
    expect(evs).toHaveLength(1);
    expect(evs[0]).toMatchObject({ actorId: null, kind: "review_requested", toStatus: "waiting_review" });
    await waitForMail(crew.lead.email, /Review requested: Condenser swap/);
  });

  it("an uploaded leak is queued by the upload itself; the leads' mail names the technician and the site (new or existing)", async () => {
    const leakLog = sampleText("sample-2-elapsed-mtorr.csv"); // a leak per fixtures/samples/EXPECTED.md
    const upload = async (fields: Record<string, string>) => {
      const res = await uploadPost(uploadRequest("/api/vacuum-tests", { as: crew.technician, file: { body: leakLog, name: "leak.csv" }, fields }));
      expect(res.status).toBe(201);
      return ((await res.json()) as { test: { id: string; status: string; site: { id: string } | null } }).test;
    };
    const first = await upload({ title: "Rooftop unit 7", newSiteName: "Harbor Street Deli" });
    expect(first.status).toBe("waiting_review");
    const mailNew = await waitForMail(crew.lead.email, /Review requested: Rooftop unit 7/);
    expect(mailNew.text).toContain(crew.technician.name);
    expect(mailNew.text).toContain("Site: Harbor Street Deli.");
    await upload({ title: "Rooftop unit 8", siteId: first.site!.id });
    const mailExisting = await waitForMail(crew.lead.email, /Review requested: Rooftop unit 8/);
    expect(mailExisting.text).toContain("Site: Harbor Street Deli.");
    expect(mailExisting.text).toContain(crew.technician.name);
  });

  it("a help request on a passing test also enters the queue (product rule)", async () => {
    const id = await seedTest(crew.technician, { verdict: "pass", helpRequested: true });
    const out = await routeNewTestToReview(db(), { organizationId: crew.owner.organizationId, testId: id, actorId: null });
    expect(out.reasons).toEqual(["the technician asked for help"]);
  });

  it("the review sweep job moves new failing tests in (reading the queue writes nothing), oldest first, with a sparkline; technicians get 403 (permission matrix)", async () => {
    const shop = await createShop();
    const older = await seedTest(shop, { verdict: "moisture", testedAt: new Date(Date.now() - 3600_000) });
    const newer = await seedTest(shop, { verdict: "leak" });
    // Stored without the upload's rule (as a script would): a read of the queue leaves them submitted.
    expect((await (await queueGet(appRequest("/api/review", { as: shop }))).json()).items).toEqual([]);
    const statusOf = async (id: string) => (await db().select({ s: vacuumTests.status }).from(vacuumTests).where(eq(vacuumTests.id, id)))[0].s;
    expect(await statusOf(older)).toBe("submitted");
    // The scheduled sweep (every minute in the app) as one job through the queue.
    await sendJob(db(), QUEUES.reviewSweep.name, {});
    await expect.poll(() => statusOf(newer), { timeout: 15_000 }).toBe("waiting_review");
    const res = await queueGet(appRequest("/api/review", { as: shop }));
    expect(res.status).toBe(200);
    const { items } = await res.json();
    expect(items.map((i: { id: string }) => i.id)).toEqual([older, newer]);
    expect(items[0].sparkline.microns.length).toBeLessThanOrEqual(48);
    expect(items[0].sparkline.isolationMinutes).toBe(20);
    expect((await queueGet(appRequest("/api/review", { as: crew.technician }))).status).toBe(403);
    const filtered = await (await queueGet(appRequest("/api/review?verdict=leak", { as: shop }))).json();
    expect(filtered.items.map((i: { id: string }) => i.id)).toEqual([newer]);
  });
});
