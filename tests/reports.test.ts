import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PDFParse } from "pdf-parse";
import { db } from "@/db/client";
import { createCustomer, createSite, createSystem } from "@/db/queries/records";
import { GET as reportGet } from "@/app/api/tests/[id]/report/route";
import { POST as emailPost } from "@/app/api/tests/[id]/email-report/route";
import { GET as eventsGet } from "@/app/api/tests/[id]/events/route";
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
    const res = await reportGet(appRequest(`/api/tests/${leakId}/report`, { as: crew.lead }), routeParams({ id: leakId }));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect(new TextDecoder().decode(bytes.slice(0, 5))).toBe("%PDF-");
    const parsed = await parsePdf(bytes);
    // Letter page, one curve and short sections: the layout fits on 2 pages (measured).
    expect(parsed.total).toBe(2);
    const text = parsed.text.replace(/\s+/g, " ");
    expect(text).toContain("Verdict: Leak likely");
    expect(text).toContain("Does not meet the acceptance profile");
    expect(text).toContain("NOT met: Stayed below the limit");
    expect(text).toContain("12 Harbor Lane, Springfield");
    expect(text).toContain("R-448A");
    expect(text).toContain(crew.technician.name);
    expect(text).toContain("Never energise a compressor while the system is in deep vacuum.");
    expect(text).toContain("Not signed off.");
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
    expect((await reportGet(appRequest(`/api/tests/${leakId}/report`, { as: crew.apprentice }), routeParams({ id: leakId }))).status).toBe(404);
    const stranger = await createShop();
    expect((await reportGet(appRequest(`/api/tests/${leakId}/report`, { as: stranger }), routeParams({ id: leakId }))).status).toBe(404);
    expect((await reportGet(appRequest(`/api/tests/${leakId}/report`), routeParams({ id: leakId }))).status).toBe(401);
  });
});

describe("e-mailing the report to a customer (reports.share is owner + lead, DEVELOPERS.md)", () => {
  const send = (as: TestMember, body: unknown) =>
    emailPost(appRequest(`/api/tests/${leakId}/email-report`, { method: "POST", as, body: JSON.stringify(body), headers: { "content-type": "application/json" } }), routeParams({ id: leakId }));

  it("the customer receives text, HTML and the PDF attached; the audit trail records it", async () => {
    const res = await send(crew.lead, { to: "office@harbor-lane.example.test", message: "As discussed on site." });
    expect(res.status).toBe(202);
    const mail = await waitForMail("office@harbor-lane.example.test", /Vacuum test report/);
    expect(mail.text).toContain("As discussed on site.");
    expect(mail.html).toContain("As discussed on site.");
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments[0]).toMatchObject({ contentType: "application/pdf" });
    expect(mail.attachments[0].filename).toMatch(/\.pdf$/);
    expect(mail.attachments[0].size).toBeGreaterThan(2000);
    const { events } = await (await eventsGet(appRequest(`/api/tests/${leakId}/events`, { as: crew.lead }), routeParams({ id: leakId }))).json();
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
