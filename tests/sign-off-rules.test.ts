/**
 * Sign-off rules (product rule, DEVELOPERS.md "Review"): a test whose curve is not tight and dry, or
 * that misses its acceptance profile, is never signed off plainly; a lead can only accept it with a
 * reason, which is stored in the audit trail and told by the review state, the e-mail and the
 * report (its document and its PDF). Real PostgreSQL, SMTP catcher; invented shop and data.
 */
import { describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { PDFParse } from "pdf-parse";
import { db } from "@/db/client";
import { analyses, testEvents, vacuumTests } from "@/db/schema";
import { GET as reviewGet, POST as reviewPost } from "@/app/api/vacuum-tests/[id]/review/route";
import { GET as eventsGet } from "@/app/api/vacuum-tests/[id]/events/route";
import { buildReportModel } from "@/lib/reports/model";
import { reportDocument } from "@/lib/reports/document";
import { renderReportPdf } from "@/lib/reports/pdf";
import { availableActions, signOffNeedsReason } from "@/lib/review/state";
import { appRequest, routeParams, type TestMember } from "./helpers/members";
import { crewForFile, jsonInit } from "./helpers/crew";
import { jobRunnerForFile } from "./helpers/jobs";
import { waitForMail } from "./helpers/mailbox";
import { seedTest } from "./helpers/seed-test";

const crew = crewForFile();
jobRunnerForFile();

const post = (id: string, as: TestMember, body: unknown) => reviewPost(appRequest(`/api/tests/${id}/review`, jsonInit(as, body)), routeParams({ id }));
const state = async (id: string, as: TestMember) => (await reviewGet(appRequest(`/api/tests/${id}/review`, { as }), routeParams({ id }))).json();
const statusOf = async (id: string) => (await db().select({ s: vacuumTests.status }).from(vacuumTests).where(eq(vacuumTests.id, id)))[0].s;

async function pdfText(bytes: Uint8Array): Promise<string> {
  const parser = new PDFParse({ data: bytes });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

describe("which tests need a reason to be signed off (product rule)", () => {
  it("only a tight-and-dry curve that meets its profile signs off plainly; leak, moisture, both, unclear or a missed profile need a reason", () => {
    expect(signOffNeedsReason("pass", true)).toBe(false);
    expect(signOffNeedsReason("pass", null)).toBe(false);
    expect(signOffNeedsReason("pass", false)).toBe(true);
    for (const v of ["leak", "moisture", "leak_and_moisture", "inconclusive", null]) expect(signOffNeedsReason(v, true)).toBe(true);
    expect(availableActions("waiting_review", true, true)).toEqual(["ask_help", "accept_with_reason", "send_back"]);
    expect(availableActions("waiting_review", true, false)).toEqual(["ask_help", "sign_off", "send_back"]);
    expect(availableActions("waiting_review", false, true)).toEqual(["ask_help"]);
  });
});

describe("signing off a failing test through the API (product rule)", () => {
  it("a leak: plain sign-off is 409 and changes nothing; acceptance needs a reason (400); with one it is final and the reason is everywhere", async () => {
    const id = await seedTest(crew.technician, { verdict: "leak", title: "Dental office condenser" });
    await post(id, crew.technician, { action: "request_review" });
    const before = await state(id, crew.lead);
    expect(before.signOffNeedsReason).toBe(true);
    expect(before.actions).toContain("accept_with_reason");
    expect(before.actions).not.toContain("sign_off");

    const plain = await post(id, crew.lead, { action: "sign_off" });
    expect(plain.status).toBe(409);
    expect((await plain.json()).error.message).toMatch(/accepted with a reason/);
    expect(await statusOf(id)).toBe("waiting_review");

    const bare = await post(id, crew.lead, { action: "accept_with_reason", note: "   " });
    expect(bare.status).toBe(400);
    expect((await bare.json()).error.message).toMatch(/^note: say why/);
    expect(await statusOf(id)).toBe("waiting_review");

    const reason = "Customer declined the braze repair today; recorded on the work order, re-test booked.";
    const ok = await post(id, crew.lead, { action: "accept_with_reason", note: reason });
    expect(ok.status).toBe(200);
    expect((await ok.json()).status).toBe("signed_off");

    const [event] = await db().select().from(testEvents).where(sql`${testEvents.testId} = ${id} and ${testEvents.kind} = 'accepted_with_reason'`);
    expect(event).toMatchObject({ actorId: crew.lead.userId, fromStatus: "waiting_review", toStatus: "signed_off", note: reason });
    const { events } = await (await eventsGet(appRequest(`/api/tests/${id}/events`, { as: crew.technician }), routeParams({ id }))).json();
    expect(events.map((e: { kind: string }) => e.kind)).toEqual(["review_requested", "accepted_with_reason"]);

    const after = await state(id, crew.technician);
    expect(after.lastStep).toMatchObject({ kind: "accepted_with_reason", by: crew.lead.name, note: reason });
    const mail = await waitForMail(crew.technician.email, /Accepted with a reason: Dental office condenser/);
    expect(mail.text).toContain(reason);

    const model = (await buildReportModel(db(), { organizationId: crew.owner.organizationId, testId: id }))!;
    expect(model.review.headline).toMatch(new RegExp(`^Accepted with a reason by ${crew.lead.name} on .+; the test does not pass\\.$`));
    expect(model.review.acceptedWithReason).toMatchObject({ by: crew.lead.name, reason });
    const doc = JSON.stringify(reportDocument(model));
    expect(doc).toContain(`Reason for accepting it: ${reason}`);
    expect(doc).not.toMatch(/"Signed off by/);
    const pdf = await pdfText(await renderReportPdf(model, { compress: false }));
    expect(pdf.replace(/\s+/g, " ")).toContain("Reason for accepting it: Customer declined the braze repair today");

    expect((await post(id, crew.owner, { action: "accept_with_reason", note: "again" })).status).toBe(409);
  });

  it("a tight curve that misses its profile needs a reason too; a passing test cannot be 'accepted' (409), only signed off", async () => {
    const missed = await seedTest(crew.technician, { verdict: "pass", title: "Tight but short hold" });
    const [t] = await db().select({ a: vacuumTests.currentAnalysisId }).from(vacuumTests).where(eq(vacuumTests.id, missed));
    await db().update(analyses).set({ result: sql`jsonb_set(${analyses.result}, '{meetsProfile}', 'false')` }).where(eq(analyses.id, t.a!));
    expect((await state(missed, crew.lead)).actions).toContain("accept_with_reason");
    expect((await post(missed, crew.lead, { action: "sign_off" })).status).toBe(409);
    expect((await post(missed, crew.lead, { action: "accept_with_reason", note: "Hold cut short by the customer; curve flat." })).status).toBe(200);

    const passed = await seedTest(crew.technician, { verdict: "pass", title: "Clean pass" });
    const wrong = await post(passed, crew.lead, { action: "accept_with_reason", note: "no need" });
    expect(wrong.status).toBe(409);
    expect((await wrong.json()).error.message).toMatch(/passes: sign it off/);
    expect((await post(passed, crew.lead, { action: "sign_off" })).status).toBe(200);
    const model = (await buildReportModel(db(), { organizationId: crew.owner.organizationId, testId: passed }))!;
    expect(model.review.headline).toMatch(/^Signed off by /);
    expect(model.review.acceptedWithReason).toBeNull();
  });

  it("a technician cannot accept a failing test (tests.review is owner + lead) → 403", async () => {
    const id = await seedTest(crew.technician, { verdict: "leak" });
    expect((await post(id, crew.technician, { action: "accept_with_reason", note: "mine" })).status).toBe(403);
  });

  it("a sent-back test tells the technician the lead's words and who asked (GET review lastStep)", async () => {
    const id = await seedTest(crew.technician, { verdict: "leak", title: "Rooftop 7" });
    await post(id, crew.lead, { action: "send_back", note: "Replace the core caps and hold 15 minutes." });
    const s = await state(id, crew.technician);
    expect(s.lastStep).toMatchObject({ kind: "sent_back", by: crew.lead.name, note: "Replace the core caps and hold 15 minutes." });
    expect(s.retest).toBe(true);
  });
});
