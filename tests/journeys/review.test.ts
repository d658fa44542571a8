/**
 * The lead's desk, end to end in a real Chromium on a phone: a technician asks for review, the
 * lead comments at a time on the curve and sends it back with a request, the technician
 * uploads the re-test's gauge log (a passing fixture) onto the same test, which goes back to the
 * lead with a new current analysis; the lead signs off and e-mails the report, and the customer's
 * mail (with the PDF) is read back from the real SMTP catcher. Invented names and data.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Locator, Page } from "playwright-core";
import { launch, PHONE, signInThroughPage, type Session } from "./browser";
import { addMember, createShop, type TestMember } from "@/tests/helpers/members";
import { waitForMail } from "@/tests/helpers/mailbox";
import { verdictLabel } from "@/lib/reports/words";
import { seedTest } from "@/tests/helpers/seed-test";

/** A pass per fixtures/samples/EXPECTED.md: the re-test after the gasket was replaced. */
const RETEST_LOG = "fixtures/samples/sample-1-iso-microns.csv";

let session: Session;
let lead: TestMember;
let tech: TestMember;
let testId: string;
const customer = `customer-${Date.now()}@example.test`;

/** Waits (dev server compiles on first use; mail is delivered before the answer) until it is visible. */
async function shown(locator: Locator): Promise<void> {
  try {
    await locator.first().waitFor({ state: "visible", timeout: 30_000 });
  } catch (err) {
    await locator.page().screenshot({ path: "/tmp/rl-review-journey-failure.png", fullPage: true }).catch(() => undefined);
    throw err;
  }
}

async function as(member: TestMember): Promise<{ ctx: BrowserContext; page: Page }> {
  const ctx = await session.newContext(PHONE);
  const page = await ctx.newPage();
  await signInThroughPage(page, member.email, member.password);
  return { ctx, page };
}

beforeAll(async () => {
  const owner = await createShop("Northside Cooling (invented)");
  lead = await addMember(owner.organizationId, "lead", "Lena Lead");
  tech = await addMember(owner.organizationId, "technician", "Theo Tech");
  testId = await seedTest(tech, { verdict: "leak", title: "Bakery walk-in after coil swap" });
  session = await launch();
});
afterAll(async () => {
  await session?.close();
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

describe("review journey (phone)", () => {
  it("ask → comment at a time and send back → upload the re-test log (sample-1, a pass per fixtures/samples/EXPECTED.md) → sign off → report e-mailed", async () => {
    // Technician asks for review.
    // The lead's desk lives on the test page; the report page shows the report only.
    const t = await as(tech);
    await t.page.goto(`/vacuum-tests/${testId}`);
    const techPanel = t.page.getByTestId("review-panel");
    await techPanel.getByRole("button", { name: "Ask for review" }).click();
    await shown(techPanel.getByText("Waiting for review"));
    await waitForMail(lead.email, /Review requested: Bakery walk-in/);

    // Lead finds it in the queue, opens it, comments at minute 25 and sends it back.
    const l = await as(lead);
    await l.page.goto("/review");
    const item = l.page.getByTestId("queue-item").filter({ hasText: "Bakery walk-in after coil swap" });
    await shown(item);
    await l.page.goto(`/vacuum-tests/${testId}`);
    const thread = l.page.getByTestId("comment-thread");
    await thread.getByLabel("Comment").fill("The rise at 25 min looks like the hose gasket.");
    await thread.getByLabel(/At minute on the curve/).fill("25");
    await thread.getByRole("button", { name: "Add comment" }).click();
    await shown(thread.getByText("at 25.0 min"));
    const leadPanel = l.page.getByTestId("review-panel");
    await leadPanel.getByRole("button", { name: "Send back" }).click();
    await leadPanel.getByLabel("What should the technician do?").fill("Pull down again and hold 15 minutes.");
    await leadPanel.getByRole("button", { name: "Send back" }).click();
    await shown(leadPanel.getByText("Sent back", { exact: true }));
    const back = await waitForMail(tech.email, /Sent back: Bakery walk-in/);
    expect(back.text).toContain("Pull down again and hold 15 minutes.");

    // Technician re-tests and uploads the new log onto the same test; the lead's comment is on the thread at its time.
    await t.page.reload();
    await shown(t.page.getByTestId("comment-thread").getByText("at 25.0 min"));
    await techPanel.getByRole("button", { name: "Upload the re-test log" }).click();
    await techPanel.getByLabel("Re-test log file (CSV)").setInputFiles(RETEST_LOG);
    await techPanel.getByLabel(/What did you do/).fill("Replaced the hose gasket, pulled down to 350 microns, held 15 minutes.");
    await techPanel.getByRole("button", { name: "Send the re-test" }).click();
    await shown(techPanel.getByTestId("retest-done"));
    expect(await techPanel.getByTestId("retest-done").textContent()).toContain("version 2");
    await shown(techPanel.getByText("Waiting for review"));
    const retestMail = await waitForMail(lead.email, /Re-test to review: Bakery walk-in/);
    expect(retestMail.text).toContain("Replaced the hose gasket");

    // Lead signs off; the report shows the sign-off; then e-mails the report to the customer.
    await l.page.reload();
    await leadPanel.getByRole("button", { name: "Sign off" }).click();
    await leadPanel.getByRole("button", { name: "Sign off" }).click();
    await shown(leadPanel.getByText("Signed off", { exact: true }));
    await waitForMail(tech.email, /Signed off: Bakery walk-in/);
    await l.page.goto(`/vacuum-tests/${testId}/report`);
    await shown(l.page.getByTestId("report-signoff").getByText("Signed off by Lena Lead"));
    expect(await l.page.getByTestId("review-panel").count()).toBe(0);
    // The report shows the re-test's analysis (the seeded first analysis was a leak).
    expect(await l.page.getByTestId("report-curve-headline").textContent()).toBe(verdictLabel("pass"));
    await l.page.goto(`/vacuum-tests/${testId}`);
    const share = l.page.getByTestId("share-actions");
    await share.getByLabel("E-mail the report to").fill(customer);
    await share.getByRole("button", { name: "Send the report" }).click();
    await shown(share.getByText("Report sent with the PDF attached."));
    const mail = await waitForMail(customer, /Vacuum test report/);
    expect(mail.attachments.map((a) => a.contentType)).toEqual(["application/pdf"]);

    // The audit trail on the page tells the whole story with names.
    await l.page.reload();
    const trail = l.page.getByTestId("audit-trail");
    for (const words of ["Asked for review", "Commented", "Sent back", "Uploaded the re-test log and resubmitted", "Signed off", "E-mailed the report"]) {
      await shown(trail.getByText(words, { exact: false }));
    }
    await t.ctx.close();
    await l.ctx.close();
  }, 240_000);
});
