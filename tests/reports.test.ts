import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PDFParse } from "pdf-parse";
import { db } from "@/db/client";
import { createCustomer, createSite, createSystem } from "@/db/queries/records";
import { GET as reportGet } from "@/app/api/vacuum-tests/[id]/report/route";
import { POST as emailPost } from "@/app/api/vacuum-tests/[id]/email-report/route";
import { GET as eventsGet } from "@/app/api/vacuum-tests/[id]/events/route";
import { buildReportModel } from "@/lib/reports/model";
import { logAxisOf, renderReportPdf } from "@/lib/reports/pdf";
import { jobRunnerForFile } from "./helpers/jobs";
import { appRequest, createCrew, createShop, routeParams, type TestMember } from "./helpers/members";
import { waitForMail } from "./helpers/mailbox";
import { seedTest, seededSeries } from "./helpers/seed-test";
import type { Role } from "@/lib/permissions";

let crew: Record<Role, TestMember>;
let leakId: string;
jobRunnerForFile();
beforeAll(async () => {
  crew = await createCrew();
  const org = crew.owner.organizationId;
  const customer = await createCustomer(db(), { organizationId: org, name: "Harbor Lane Bakery", email: "office@harbor-lane.example.test" });
  const site = await createSite(db(), { organizationId: org, name: "Harbor Lane Bakery", address: "12 Harbor Lane, Springfield", customerId: customer.id });
  const system = await createSystem(db(), { organizationId: org, siteId: site.id, name: "Walk-in cooler", kind: "split", refrigerant: "R-448A", lineSetFeet: 40, liquidOd: "3/8", suctionOd: "7/8" });
  leakId = await seedTest(crew.technician, { verdict: "leak", title: "Walk-in cooler after valve repair", siteId: site.id, systemId: system.id });
});
afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

async function parsePdf(bytes: Uint8Array) {
  const parser = new PDFParse({ data: bytes });
  try {
    return await parser.getText();
  } finally {
    await parser.destroy();
  }
}

describe("the report PDF (pdfkit, read back with pdf-parse)", () => {
  it("answers a PDF whose text has the verdict, the job, the profile result and the cautions (trade primer cautions)", async () => {
    const res = await reportGet(appRequest(`/api/vacuum-tests/${leakId}/report`, { as: crew.lead }), routeParams({ id: leakId }));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect(new TextDecoder().decode(bytes.slice(0, 5))).toBe("%PDF-");
    const parsed = await parsePdf(bytes);
    // Letter page, one curve and the sections of lib/reports/document.ts: 2 to 3 pages (measured: 3).
    expect(parsed.total).toBeGreaterThanOrEqual(2);
    expect(parsed.total).toBeLessThanOrEqual(3);
    const text = parsed.text.replace(/\s+/g, " ");
    expect(text).toContain("Steady climb: leak likely");
    expect(text).toContain("Misses the profile “Common practice (no published source)”");
    expect(text).toContain("Not met: Climb under the leak rate (climbing 60 microns/min (threshold 20))");
    expect(text).toContain("12 Harbor Lane, Springfield");
    expect(text).toContain("R-448A");
    expect(text).toContain(crew.technician.name);
    expect(text).toContain("Never energise a compressor while the system is in deep vacuum.");
    expect(text).toContain("Submitted; no review asked.");
    expect(text).not.toContain("Not signed off");
    // A finding's checks are a numbered list, never joined as "Check: a.; b."
    expect(text).toContain("Check, in this order: 1. Test the rig on its own.");
    expect(text).not.toMatch(/\.;/);
  });

  it("draws the curve as vector paths: one line segment per reading, the hold shaded, dashed limit and isolation", async () => {
    const model = (await buildReportModel(db(), { organizationId: crew.owner.organizationId, testId: leakId }))!;
    const raw = (await renderReportPdf(model, { compress: false })).toString("latin1");
    const lineTos = raw.match(/^-?[\d.]+ -?[\d.]+ l$/gm) ?? [];
    const readings = seededSeries("leak").t.length; // 71 readings → 70 segments, plus grid/ticks/markers
    expect(lineTos.length).toBeGreaterThanOrEqual(readings - 1);
    expect(raw).toMatch(/ re$/m); // the shaded hold rectangle
    expect(raw).toMatch(/\[5 3\] 0 d/); // the dashed limit line
    expect(model.curve!.hold).toEqual({ startMinutes: 20, endMinutes: 35 });
    // The seeded log starts at 20,000 microns and bottoms at 400: decades 10^2 (100) to 10^5 (100,000).
    expect(logAxisOf(model.curve!)).toEqual({ minLog: 2, maxLog: 5 });
  });

  it("an apprentice gets 404, another shop 404, nobody signed in 401 (visibility rule, DEVELOPERS.md)", async () => {
    expect((await reportGet(appRequest(`/api/vacuum-tests/${leakId}/report`, { as: crew.apprentice }), routeParams({ id: leakId }))).status).toBe(404);
    const stranger = await createShop();
    expect((await reportGet(appRequest(`/api/vacuum-tests/${leakId}/report`, { as: stranger }), routeParams({ id: leakId }))).status).toBe(404);
    expect((await reportGet(appRequest(`/api/vacuum-tests/${leakId}/report`), routeParams({ id: leakId }))).status).toBe(401);
  });
});

describe("e-mailing the report to a customer (reports.share is owner + lead, DEVELOPERS.md)", () => {
  const send = (as: TestMember, body: unknown) =>
    emailPost(appRequest(`/api/vacuum-tests/${leakId}/email-report`, { method: "POST", as, body: JSON.stringify(body), headers: { "content-type": "application/json" } }), routeParams({ id: leakId }));

  it("the customer receives text, HTML and the PDF attached; the audit trail records it", async () => {
    const res = await send(crew.lead, { to: "office@harbor-lane.example.test", message: "As discussed on site." });
    expect(res.status).toBe(202);
    const mail = await waitForMail("office@harbor-lane.example.test", /Vacuum test report/);
    expect(mail.text).toContain("As discussed on site.");
    // The message quotes the report's own statements and numbers (lib/verdict/story.ts).
    expect(mail.text).toContain("Steady climb: leak likely. The shop's profile was not met.");
    expect(mail.text).toMatch(/From 400 to a last reading of 1,300 microns in 15\.0 min/);
    expect(mail.html).toContain("As discussed on site.");
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments[0]).toMatchObject({ contentType: "application/pdf" });
    expect(mail.attachments[0].filename).toMatch(/\.pdf$/);
    expect(mail.attachments[0].size).toBeGreaterThan(2000);
    const { events } = await (await eventsGet(appRequest(`/api/vacuum-tests/${leakId}/events`, { as: crew.lead }), routeParams({ id: leakId }))).json();
    expect(events.at(-1)).toMatchObject({ kind: "report_emailed", note: "To office@harbor-lane.example.test.", actorName: crew.lead.name });
  });

  it("a technician cannot e-mail reports (403); a bad address is 400", async () => {
    expect((await send(crew.technician, { to: "x@example.test" })).status).toBe(403);
    expect((await send(crew.lead, { to: "not-an-address" })).status).toBe(400);
  });
});

describe("a system's history (visibility rule, DEVELOPERS.md)", () => {
  it("lists every test on the system newest first with a curve; apprentices see only their own; another shop 404", async () => {
    const { GET: systemGet } = await import("@/app/api/systems/[id]/route");
    const { POST: customerPost, GET: customersGet } = await import("@/app/api/customers/route");
    const org = crew.owner.organizationId;
    const site = await createSite(db(), { organizationId: org, name: "Maple Street duplex" });
    const system = await createSystem(db(), { organizationId: org, siteId: site.id, name: "Upstairs heat pump" });
    const old = await seedTest(crew.technician, { systemId: system.id, siteId: site.id, testedAt: new Date("2026-01-10T15:00:00Z") });
    const mid = await seedTest(crew.apprentice, { systemId: system.id, siteId: site.id, testedAt: new Date("2026-02-10T15:00:00Z") });
    const recent = await seedTest(crew.technician, { systemId: system.id, siteId: site.id, verdict: "leak", testedAt: new Date("2026-03-10T15:00:00Z") });
    const asLead = await (await systemGet(appRequest(`/api/systems/${system.id}`, { as: crew.lead }), routeParams({ id: system.id }))).json();
    expect(asLead.tests.map((t: { id: string }) => t.id)).toEqual([recent, mid, old]);
    expect(asLead.tests[0].curve.isolationMinutes).toBe(20);
    const asApprentice = await (await systemGet(appRequest(`/api/systems/${system.id}`, { as: crew.apprentice }), routeParams({ id: system.id }))).json();
    expect(asApprentice.tests.map((t: { id: string }) => t.id)).toEqual([mid]);
    const stranger = await createShop();
    expect((await systemGet(appRequest(`/api/systems/${system.id}`, { as: stranger }), routeParams({ id: system.id }))).status).toBe(404);

    const made = await customerPost(appRequest("/api/customers", { method: "POST", as: crew.technician, body: JSON.stringify({ name: "Maple Street Rentals", email: "" }), headers: { "content-type": "application/json" } }));
    expect(made.status).toBe(201);
    expect((await made.json()).customer.email).toBeNull();
    expect((await customerPost(appRequest("/api/customers", { method: "POST", as: crew.trainer, body: JSON.stringify({ name: "x" }), headers: { "content-type": "application/json" } }))).status).toBe(403);
    const names = (await (await customersGet(appRequest("/api/customers", { as: stranger }))).json()).items.map((c: { name: string }) => c.name);
    expect(names).not.toContain("Maple Street Rentals");
  });
});

describe("the report as the customer's and the warranty desk's copy", () => {
  it("writes times in the shop's time zone, keeps internal notes off and the note for the customer on, and tells a sent-back test as sent back", async () => {
    const { upsertOrganizationTimeZone } = await import("@/db/queries/settings");
    const { insertTestEvent, updateTestStatusById } = await import("@/db/queries/review");
    const shop = await createCrew();
    const org = shop.owner.organizationId;
    await upsertOrganizationTimeZone(db(), { organizationId: org, timeZone: "America/Chicago" });
    const id = await seedTest(shop.technician, {
      verdict: "leak", title: "Rooftop unit 3", testedAt: new Date("2026-01-15T20:05:00Z"),
      notes: "Internal: customer's dog bit the hose.", customerNote: "We will return Friday to find the leak.",
    });
    await updateTestStatusById(db(), { organizationId: org, testId: id, fromStatus: "submitted", toStatus: "sent_back" });
    await insertTestEvent(db(), { organizationId: org, testId: id, actorId: shop.lead.userId, kind: "sent_back", fromStatus: "waiting_review", toStatus: "sent_back", note: "Pull down again and hold 15 minutes." });
    const model = (await buildReportModel(db(), { organizationId: org, testId: id }))!;
    expect(model.testedAtWords).toBe("January 15, 2026 at 2:05 PM CST"); // 20:05 UTC is 14:05 in Chicago in January (UTC−6)
    const res = await reportGet(appRequest(`/api/vacuum-tests/${id}/report`, { as: shop.lead }), routeParams({ id }));
    const text = (await parsePdf(new Uint8Array(await res.arrayBuffer()))).text.replace(/\s+/g, " ");
    expect(text).toContain("January 15, 2026 at 2:05 PM CST");
    expect(text).toContain("We will return Friday to find the leak.");
    expect(text).not.toContain("dog bit");
    expect(text).toMatch(/Sent back by .+ on .+ CS?T: Pull down again and hold 15 minutes\./);
    expect(text).not.toContain("Not signed off");
    expect(text).toContain("Times in America/Chicago.");
  });

  it("prints every character in the embedded IBM Plex Sans (no arrows that turn into !') and embeds that font", async () => {
    const fontkitModule = (await import("fontkit")) as unknown as { default?: { openSync(p: string): unknown }; openSync?(p: string): unknown };
    const fontkit = fontkitModule.openSync ? (fontkitModule as { openSync(p: string): unknown }) : fontkitModule.default!; // pdfkit's own font reader
    const { PDF_FONTS } = await import("@/lib/reports/pdf");
    const model = (await buildReportModel(db(), { organizationId: crew.owner.organizationId, testId: leakId }))!;
    const bytes = await renderReportPdf(model, { compress: false });
    expect(bytes.toString("latin1")).toMatch(/\/BaseFont \/[A-Z]{6}\+IBMPlexSans/);
    expect(bytes.toString("latin1")).not.toContain("Helvetica");
    const font = fontkit.openSync(PDF_FONTS.regular) as unknown as { hasGlyphForCodePoint(cp: number): boolean };
    const text = (await parsePdf(new Uint8Array(bytes))).text;
    const missing = [...new Set([...text].filter((c) => c.trim() !== "" && !font.hasGlyphForCodePoint(c.codePointAt(0)!)))];
    expect(missing).toEqual([]);
    expect(text).not.toContain("!'");
  });
});
