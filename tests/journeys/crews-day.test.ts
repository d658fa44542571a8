/**
 * Each role's day without detours, in a real Chromium against `next start`: the technician on a
 * phone finds the lead's request on the home card and first on the test page, with one safety box;
 * the lead's home counts the review queue, a chart tap does the one thing chosen (a comment never
 * moves the isolation used by "Analyse again"), and a leak can only be accepted with a reason,
 * which the Review box, the audit trail and the report then show. Invented shop, people and data.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Locator, Page } from "playwright-core";
import { DESKTOP, launch, PHONE, signInThroughPage, type Session } from "./browser";
import { addMember, appRequest, createShop, routeParams, type TestMember } from "@/tests/helpers/members";
import { jsonInit } from "@/tests/helpers/crew";
import { seedTest } from "@/tests/helpers/seed-test";
import { sampleText, uploadRequest } from "@/tests/helpers/uploads";
import { POST as uploadPost } from "@/app/api/vacuum-tests/route";
import { POST as reviewPost } from "@/app/api/vacuum-tests/[id]/review/route";
import { routeNewTestToReview } from "@/lib/review/auto";
import { db } from "@/db/client";
import { createCustomer, createJob, createSite, createSystem } from "@/db/queries/records";

let session: Session;
let lead: TestMember;
let tech: TestMember;
let sentBackId: string;
let leakId: string;
let owner: TestMember;
let siteId: string;
let systemId: string;
let dupSiteId: string;
let apprentice: TestMember;
let trainer: TestMember;
let practiceId: string;
const REQUEST = "Replace both core caps, pull down again and hold 15 minutes.";
const REASON = "Customer declined the braze repair today; noted on the work order.";

async function shown(locator: Locator): Promise<void> {
  try {
    await locator.first().waitFor({ state: "visible", timeout: 30_000 });
  } catch (err) {
    await locator.page().screenshot({ path: "/tmp/rl-crews-day-failure.png", fullPage: true }).catch(() => undefined);
    throw err;
  }
}

async function as(member: TestMember, device: typeof PHONE | typeof DESKTOP): Promise<{ ctx: BrowserContext; page: Page }> {
  const ctx = await session.newContext(device);
  const page = await ctx.newPage();
  await signInThroughPage(page, member.email, member.password);
  return { ctx, page };
}

beforeAll(async () => {
  owner = await createShop("Tidewater Comfort (invented)");
  lead = await addMember(owner.organizationId, "lead", "Lena Lead");
  tech = await addMember(owner.organizationId, "technician", "Theo Tech");
  sentBackId = await seedTest(tech, { verdict: "leak", title: "Harbor Lane Dental rooftop" });
  await reviewPost(appRequest(`/api/vacuum-tests/${sentBackId}/review`, jsonInit(lead, { action: "send_back", note: REQUEST })), routeParams({ id: sentBackId }));
  leakId = await seedTest(tech, { verdict: "leak", title: "Bakery walk-in after coil swap" });
  await routeNewTestToReview(db(), { organizationId: owner.organizationId, testId: leakId, actorId: null });
  const customer = await createCustomer(db(), { organizationId: owner.organizationId, name: "Harbor Lane Dental" });
  const site = await createSite(db(), { organizationId: owner.organizationId, name: "Harbor Lane Dental — main office", customerId: customer.id });
  const system = await createSystem(db(), { organizationId: owner.organizationId, siteId: site.id, name: "Rooftop heat pump", kind: "heat_pump", refrigerant: "R-454B", factoryChargeKg: 2.5, lineSetFeet: 35 });
  siteId = site.id;
  await createJob(db(), { organizationId: owner.organizationId, visitedOn: "2026-12-02", siteId: site.id, reason: "New install", reference: "WO-4147" });
  dupSiteId = (await createSite(db(), { organizationId: owner.organizationId, name: "Harbour Dental", customerId: null })).id;
  systemId = system.id;
  await seedTest(tech, { verdict: "pass", title: "Rooftop heat pump start-up", siteId, systemId });
  apprentice = await addMember(owner.organizationId, "apprentice", "Ada Apprentice");
  trainer = await addMember(owner.organizationId, "trainer", "Tara Trainer");
  // A real upload (sample-2, a leak per fixtures/samples/EXPECTED.md), so the analysis has a fitted hold to draw.
  const up = await uploadPost(uploadRequest("/api/vacuum-tests", { as: apprentice, file: { body: sampleText("sample-2-elapsed-mtorr.csv"), name: "practice.csv" }, fields: { isPractice: "true", title: "Practice: garage split" } }));
  expect(up.status).toBe(201);
  practiceId = (await up.json()).test.id;
  session = await launch();
});
afterAll(async () => {
  await session?.close();
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

describe("crews' day (phone technician, desktop lead)", () => {
  it("technician: the lead's request is on the home card and first on the test page; one safety box; the trail never says 'Sent back → Sent back'", async () => {
    const t = await as(tech, PHONE);
    await t.page.goto("/home");
    const card = t.page.getByTestId("home-sent-back");
    await shown(card);
    expect(await card.getByTestId("home-sent-back-request").textContent()).toBe(`Lena Lead asks: ${REQUEST}`);
    await card.getByRole("link", { name: "Harbor Lane Dental rooftop" }).click();
    await t.page.waitForURL(new RegExp(`/vacuum-tests/${sentBackId}$`));
    const next = t.page.getByTestId("next-step");
    await shown(next);
    expect(await next.getByTestId("next-step-request").textContent()).toBe(`Lena Lead asks: ${REQUEST}`);
    await shown(t.page.getByTestId("decay-chart"));
    const nextBox = (await next.boundingBox())!;
    const chartBox = (await t.page.getByTestId("decay-chart").boundingBox())!;
    expect(nextBox.y).toBeLessThan(chartBox.y);
    expect(nextBox.y + nextBox.height).toBeLessThan(740); // on the first screen of a 360 × 740 phone
    expect(await t.page.getByTestId("safety-note").count()).toBe(1);
    expect(await t.page.getByTestId("findings").getByRole("note").count()).toBe(0);
    const panel = t.page.getByTestId("review-panel");
    await shown(panel.getByTestId("review-last-step"));
    expect(await panel.getByTestId("review-last-step").textContent()).toContain(REQUEST);
    const trail = t.page.getByTestId("audit-trail");
    await shown(trail.getByText("Sent back"));
    expect(await trail.textContent()).not.toMatch(/Sent back\s*→\s*(now )?sent back/i);

    // A new test: the job picker names customer and site; typing "Harbour Dental" warns of the site on file.
    await t.page.goto("/vacuum-tests/new");
    await t.page.getByText("Add job, site and system").click();
    const job = t.page.getByLabel("Job", { exact: true });
    await expect.poll(async () => job.locator("option").allTextContents()).toContain("WO-4147 · 2026-12-02 · New install — Harbor Lane Dental, Harbor Lane Dental — main office");
    await t.page.getByLabel("Site", { exact: true }).fill("Harbor Dental office");
    const similar = t.page.getByTestId("similar-site");
    await shown(similar);
    expect(await similar.textContent()).toContain("Harbor Lane Dental — main office");
    await similar.getByRole("listitem").filter({ hasText: "Harbor Lane Dental — main office" }).getByRole("button", { name: "Use this site" }).click();
    expect(await t.page.getByLabel("Site", { exact: true }).inputValue()).toBe("Harbor Lane Dental — main office");
    expect(await t.page.getByTestId("similar-site").count()).toBe(0);
    await t.ctx.close();
  }, 120_000);

  it("lead: home counts the queue; a comment tap never moves the isolation; a leak is accepted only with a reason, shown in the box, trail and report", async () => {
    const l = await as(lead, DESKTOP);
    await l.page.goto("/home");
    const attention = l.page.getByTestId("attention");
    await shown(attention.getByTestId("attention-queue"));
    expect(await attention.getByTestId("attention-queue").textContent()).toMatch(/^1 test waits for your review$/);
    expect(await attention.textContent()).toContain("Needs your attention (1)");

    await l.page.goto("/review");
    const item = l.page.getByTestId("queue-item").filter({ hasText: "Bakery walk-in after coil swap" });
    await shown(item);
    expect(await item.textContent()).toContain("Sign-off needs a reason");

    await l.page.goto(`/vacuum-tests/${leakId}`);
    const chart = l.page.getByTestId("decay-chart").locator("canvas");
    await shown(chart);
    const mode = l.page.getByTestId("chart-tap-mode");
    expect(await mode.getByLabel("Comment at a minute").isChecked()).toBe(true);
    const box = (await chart.boundingBox())!;
    await chart.click({ position: { x: box.width * 0.8, y: box.height / 2 } });
    const thread = l.page.getByTestId("comment-thread");
    const minute = thread.getByLabel(/At minute on the curve/);
    await expect.poll(async () => minute.inputValue()).not.toBe("");
    const isolation = l.page.getByTestId("reanalyse-form").getByLabel("Isolation time");
    expect(await isolation.inputValue()).toBe("");

    await mode.getByLabel("Move the isolation").check();
    await chart.click({ position: { x: box.width * 0.6, y: box.height / 2 } });
    await expect.poll(async () => isolation.inputValue()).not.toBe("");
    const commentMinute = await minute.inputValue();
    expect(Number(await isolation.inputValue())).not.toBe(Number(commentMinute));

    const panel = l.page.getByTestId("review-panel");
    expect(await panel.getByRole("button", { name: "Sign off" }).count()).toBe(0);
    await panel.getByRole("button", { name: "Accept with a reason" }).click();
    await shown(panel.getByTestId("accept-warning"));
    expect(await panel.getByTestId("accept-warning").textContent()).toContain("This test does not pass");
    await panel.getByLabel("Why do you accept a test that does not pass?").fill(REASON);
    await panel.getByRole("button", { name: "Accept with a reason" }).click();
    await shown(panel.getByText("Signed off", { exact: true }));
    await shown(panel.getByTestId("review-last-step"));
    expect(await panel.getByTestId("review-last-step").textContent()).toContain(`Reason for accepting it: ${REASON}`);
    const trail = l.page.getByTestId("audit-trail");
    await shown(trail.getByText("Accepted with a reason"));
    expect(await trail.textContent()).toContain(REASON);

    await l.page.goto(`/vacuum-tests/${leakId}/report`);
    await shown(l.page.getByTestId("report-signoff"));
    expect(await l.page.getByTestId("report-signoff").textContent()).toMatch(/^Accepted with a reason by Lena Lead on .+; the test does not pass\.$/);
    expect(await l.page.getByTestId("report-accepted-reason").textContent()).toBe(`Reason for accepting it: ${REASON}`);
    await l.ctx.close();
  }, 120_000);

  it("owner: no snake_case code and no metric figure standing alone on any page of the shop; distinct icons; Copy on a share link; a new profile starts from the shop's standard", async () => {
    const o = await as(owner, DESKTOP);
    const pages = [
      "/home", "/vacuum-tests", `/vacuum-tests/${leakId}`, `/vacuum-tests/${leakId}/report`, `/vacuum-tests/${sentBackId}`, "/review", "/records", `/records/sites/${siteId}`,
      `/records/systems/${systemId}`, "/casebook", "/tools", "/tools/water", "/tools/planner", "/tools/pressure-test", "/tools/rigs",
      "/settings/profiles", "/settings/mail", "/settings/members", "/vacuum-tests/new",
    ];
    const problems: string[] = [];
    for (const path of pages) {
      const res = await o.page.goto(path);
      expect(res?.status(), path).toBe(200);
      await o.page.waitForLoadState("networkidle");
      const text = await o.page.locator("main").innerText();
      // An e-mail address or a web address may hold underscores; nothing else on a page may.
      const words = text.replace(/\S+@\S+|https?:\/\/\S+/g, " ");
      for (const m of words.matchAll(/\b[a-z][a-z0-9]*(?:_[a-z0-9]+)+\b/g)) problems.push(`${path}: code "${m[0]}"`);
      // The shop works in °F, ft, lb·oz and psig: a metric figure is only ever beside its imperial one, in brackets.
      const outsideBrackets = words.replace(/\([^()]*\)/g, " ");
      for (const m of outsideBrackets.matchAll(/\d\s*(?:kg|°C|kPa)\b|\d\s*°C/g)) problems.push(`${path}: metric "${m[0]}" without its imperial value`);
    }
    expect(problems).toEqual([]);

    await o.page.goto(`/records/systems/${systemId}`);
    expect(await o.page.locator("main").innerText()).toContain("Heat pump");
    expect(await o.page.locator("main").innerText()).toContain("5 lb 8 oz (2.5 kg)");
    await o.page.goto("/records");
    expect(await o.page.getByRole("heading", { level: 1 }).textContent()).toBe("Customers");
    const icons = async (label: string) => o.page.getByRole("navigation").getByRole("link", { name: label }).first().locator("svg").innerHTML();
    const [customers, mail, shop, review, acceptance] = await Promise.all(["Customers", "Mail", "Shop", "Review", "Acceptance"].map(icons));
    expect(new Set([customers, mail, shop]).size).toBe(3);
    expect(review).not.toBe(acceptance);

    // The shop's standard: a default profile at 10 microns/min; "New profile" starts from it.
    await o.page.goto("/settings/profiles");
    const newForm = o.page.locator("form").last();
    await newForm.getByLabel("Name").fill("Tidewater standard");
    await newForm.getByLabel("Leak if climbing at (microns/min)").fill("10");
    await newForm.getByLabel("The shop's default").check();
    await newForm.getByRole("button", { name: "Add profile" }).click();
    await shown(o.page.getByRole("heading", { name: "Tidewater standard" }));
    await expect.poll(async () => o.page.locator("form").last().getByLabel("Leak if climbing at (microns/min)").inputValue()).toBe("10");
    expect(await o.page.locator("form").last().getByLabel("Name").inputValue()).toBe("");

    await o.page.goto("/tools/water");
    expect(await o.page.getByLabel("Unit").inputValue()).toBe("F");

    // The duplicate site is merged into the one kept; the kept site's page opens.
    await o.page.goto(`/records/sites/${dupSiteId}`);
    const merge = o.page.getByTestId("merge-site");
    await merge.getByLabel("Keep this site instead").selectOption({ label: "Harbor Lane Dental — main office · Harbor Lane Dental" });
    await merge.getByRole("checkbox").check();
    await merge.getByRole("button", { name: "Merge into the site kept" }).click();
    await o.page.waitForURL(new RegExp(`/records/sites/${siteId}$`));
    expect((await o.page.goto(`/records/sites/${dupSiteId}`))?.status()).toBe(404);

    await o.ctx.grantPermissions(["clipboard-read", "clipboard-write"]);
    await o.page.goto(`/vacuum-tests/${leakId}`);
    const share = o.page.getByTestId("share-actions");
    await share.getByRole("button", { name: /Make a read-only link/ }).click();
    await shown(share.getByRole("button", { name: "Copy the link" }));
    const url = await share.getByLabel("Share link").inputValue();
    await share.getByRole("button", { name: "Copy the link" }).click();
    await shown(share.getByText("Copied", { exact: true }));
    expect(await o.page.evaluate(() => navigator.clipboard.readText())).toBe(url);
    await o.ctx.close();
  }, 180_000);

  it("apprentice (phone): the practice chart's log axis reads at 1-2-5 steps with round minutes; 'Can't tell' is an answer; the reveal draws the fit and the limit", async () => {
    const a = await as(apprentice, PHONE);
    await a.page.goto(`/practice/${practiceId}`);
    const canvas = a.page.getByTestId("practice-chart").locator("canvas");
    await shown(canvas);
    await expect.poll(async () => canvas.getAttribute("data-y-ticks")).toBeTruthy();
    const yTicks = (await canvas.getAttribute("data-y-ticks"))!.split(",").map(Number);
    expect(yTicks.length).toBeGreaterThanOrEqual(4);
    for (const v of yTicks) expect([1, 2, 5]).toContain(Math.round(v / 10 ** Math.floor(Math.log10(v))));
    const xTicks = (await canvas.getAttribute("data-x-ticks"))!.split(",").map(Number);
    for (const v of xTicks) expect(Number.isInteger(v)).toBe(true);
    await a.page.getByLabel("Can't tell").check();
    await a.page.getByLabel("Why? (a few words)").fill("The hold is short and I cannot see it settle.");
    await a.page.getByRole("button", { name: "Make my call" }).click();
    await shown(a.page.getByTestId("my-call"));
    expect(await a.page.getByTestId("my-call").textContent()).toContain("Can't tell");
    await shown(a.page.getByTestId("practice-chart-revealed").getByTestId("decay-chart"));
    const legend = await a.page.getByTestId("practice-chart-revealed").textContent();
    expect(legend).toContain("Fitted hold");
    expect(legend).toContain("Limit");
    await a.ctx.close();
  }, 120_000);

  it("trainer: 'Add to casebook' and 'Compare with…' on the test page; the overlay's minute ticks are round", async () => {
    const tr = await as(trainer, DESKTOP);
    const made = await tr.page.request.post("/api/casebook", { data: { title: "Leaks that look like moisture" }, headers: { origin: new URL(tr.page.url()).origin } });
    expect(made.status()).toBe(201);
    const collectionId = (await made.json()).collection.id as string;
    await tr.page.goto(`/vacuum-tests/${leakId}`);
    const box = tr.page.getByTestId("trainer-shortcuts");
    await shown(box);
    await box.getByRole("button", { name: "Add to casebook" }).click();
    await shown(box.getByText("Added to the collection."));
    await tr.page.goto(`/casebook/${collectionId}`);
    await shown(tr.page.getByText("Bakery walk-in after coil swap"));
    // The picker: searchable, one line per test with site, technician, date and the verdict in words.
    await tr.page.getByLabel("Find by site, technician, date or verdict").fill("rooftop heat pump passed");
    const picked = tr.page.getByLabel("Test", { exact: true });
    const line = await picked.locator("option:checked").textContent();
    expect(line).toMatch(/^Rooftop heat pump start-up · Harbor Lane Dental — main office · Theo Tech · .+ · Passed$/);
    expect(await picked.locator("option").allTextContents()).not.toContainEqual(expect.stringMatching(/_/));

    await tr.page.goto(`/vacuum-tests/${leakId}`);
    await tr.page.getByTestId("trainer-shortcuts").getByRole("link", { name: "Compare with…" }).click();
    await tr.page.waitForURL(new RegExp(`/compare\\?tests=${leakId}`));
    const canvas = tr.page.locator("canvas").first();
    await shown(canvas);
    await expect.poll(async () => canvas.getAttribute("data-x-ticks")).toBeTruthy();
    const xTicks = (await canvas.getAttribute("data-x-ticks"))!.split(",").map(Number);
    expect(xTicks.length).toBeGreaterThanOrEqual(2);
    // A figure, not a check: how long /compare takes from navigation to the drawn chart (warm server).
    for (let i = 0; i < 3; i++) {
      const start = Date.now();
      await tr.page.goto(`/compare?tests=${leakId},${sentBackId}`);
      await tr.page.locator("canvas[data-x-ticks]").first().waitFor({ state: "attached", timeout: 30_000 });
      console.log(`/compare with 2 curves, navigation to drawn chart: ${Date.now() - start} ms`);
    }
    const step = xTicks[1] - xTicks[0];
    expect([1, 2, 5].map((m) => m * 10 ** Math.floor(Math.log10(step)))).toContain(Number(step.toPrecision(6)));
    for (const v of xTicks) expect(Math.abs(v / step - Math.round(v / step))).toBeLessThan(1e-9);
    await tr.ctx.close();
  }, 120_000);
});
