/**
 * The lead's desk, in a real Chromium on a phone. Outgoing mail: a sign-off notice Riseline gave
 * up on (the dead-letter state: the receiving server refused it) sits in the outbox as "Gave up",
 * and a comment notice waits for its next automatic try; the lead opens Mail from the "More" sheet,
 * reads the problems in plain words, presses "Send again" on the first, sees the delivery job send
 * it, and the message is read back from the real SMTP catcher. Earlier versions: the lead opens version 1 of a re-analysed test from its
 * history, sees the banner and version 1's verdict, and goes back to the current one.
 * Invented names and data.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Locator } from "playwright-core";
import { launch, PHONE, signInThroughPage, type Session } from "./browser";
import { addMember, createShop, uniqueEmail, type TestMember } from "@/tests/helpers/members";
import { waitForMail } from "@/tests/helpers/mailbox";
import { seededResult, seededSeries, seedTest } from "@/tests/helpers/seed-test";
import { verdictLabel } from "@/lib/reports/words";
import { insertAnalysis } from "@/db/queries/analyses";
import { updateTestCurrentAnalysis } from "@/db/queries/vacuum-tests";
import { db } from "@/db/client";
import { claimOutboxMailById, insertOutboxMail, markOutboxMailDead, markOutboxMailFailed } from "@/db/queries/outbox";

let session: Session;
let lead: TestMember;
let testId: string;
let outboxId: string;
let waitingId: string;
let tech: TestMember;
let versionedId: string;
const to = uniqueEmail("tech-mail");
const subject = `Signed off: Dairy cooler condenser ${Date.now()}`;
const waitingSubject = `Comment on: Dairy cooler condenser ${Date.now()}`;

/** Waits (the dev server compiles a page on first use) until it is visible. */
async function shown(locator: Locator): Promise<void> {
  try {
    await locator.first().waitFor({ state: "visible", timeout: 30_000 });
  } catch (err) {
    await locator.page().screenshot({ path: "/tmp/rl-desk-journey-failure.png", fullPage: true }).catch(() => undefined);
    throw err;
  }
}

beforeAll(async () => {
  const owner = await createShop("Harbor Refrigeration (invented)");
  lead = await addMember(owner.organizationId, "lead", "Lina Lead");
  tech = await addMember(owner.organizationId, "technician", "Tomas Tech");
  testId = await seedTest(tech, { verdict: "pass", title: "Dairy cooler condenser" });
  // Two notices as the delivery job leaves them: one given up after the receiving server refused
  // it twice, one waiting an hour for its next try (no job is queued for either here).
  [outboxId, waitingId] = await insertOutboxMail(db(), {
    mails: [
      { organizationId: owner.organizationId, testId, to, subject, text: `Lina Lead signed off the test.\n`, html: "<p>Lina Lead signed off the test.</p>" },
      { organizationId: owner.organizationId, testId, to, subject: waitingSubject, text: "A comment.\n", html: "<p>A comment.</p>" },
    ],
  });
  await db().transaction(async (tx) => {
    const claimed = await claimOutboxMailById(tx, { organizationId: owner.organizationId, id: outboxId });
    if (!claimed) throw new Error("outbox row not claimed");
    await markOutboxMailDead(tx, { organizationId: owner.organizationId, ids: [outboxId], error: "Can't send mail - all recipients were rejected: 550 5.1.1 user unknown" });
    await claimOutboxMailById(tx, { organizationId: owner.organizationId, id: waitingId });
    await markOutboxMailFailed(tx, { organizationId: owner.organizationId, id: waitingId, error: "connect ECONNREFUSED 127.0.0.1:9", nextAttemptAt: new Date(Date.now() + 3600_000) });
  });
  // A test first judged a leak (version 1), then re-analysed as a pass (version 2, current).
  versionedId = await seedTest(tech, { verdict: "leak", title: "Rooftop unit 3 after brazing" });
  await db().transaction(async (tx) => {
    const a = await insertAnalysis(tx, {
      organizationId: owner.organizationId, testId: versionedId, version: 2, options: { isolationAtSeconds: 1200 }, result: seededResult("pass"),
      series: seededSeries("pass"), reason: "isolation moved to the valve closing", createdById: lead.userId,
    });
    await updateTestCurrentAnalysis(tx, { organizationId: owner.organizationId, testId: versionedId, analysisId: a.id, verdict: "pass" });
  });
  session = await launch();
});
afterAll(async () => {
  await session?.close();
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

describe("outgoing mail journey (phone)", () => {
  it("lead opens Mail, sees the given-up notice and the waiting one in words, sends the first again and it reaches the catcher", async () => {
    const ctx = await session.newContext(PHONE);
    const page = await ctx.newPage();
    await signInThroughPage(page, lead.email, lead.password);

    await page.getByTestId("more-button").click();
    await page.getByTestId("more-sheet").getByRole("link", { name: "Mail" }).click();
    await page.waitForURL(/\/settings\/mail$/, { timeout: 60_000 });

    const row = page.getByTestId("mail-row").filter({ hasText: subject });
    await shown(row);
    expect(await row.getAttribute("data-status")).toBe("dead");
    await shown(row.getByText("Gave up", { exact: true }));
    expect(await row.getByTestId("mail-error").textContent()).toBe("The receiving server refused the address. Check the e-mail address.");
    const waiting = page.getByTestId("mail-row").filter({ hasText: waitingSubject });
    expect(await waiting.getAttribute("data-status")).toBe("failed");
    await shown(waiting.getByText("Not sent yet", { exact: true }));
    expect(await waiting.getByTestId("mail-error").textContent()).toBe("The mail server refused the connection (it may be down).");
    expect(await waiting.getByTestId("mail-next-try").textContent()).toMatch(/, by itself$/);
    expect(await row.getByRole("link", { name: "Open the test" }).getAttribute("href")).toBe(`/vacuum-tests/${testId}`);
    // Phone targets: the action is at least 48 px tall.
    const sendAgain = row.getByRole("button", { name: "Send again" });
    expect((await sendAgain.boundingBox())!.height).toBeGreaterThanOrEqual(48);

    // The filter keeps only the given-up mail; that row is there.
    await page.getByLabel("Show").selectOption("dead");
    await shown(page.getByTestId("mail-row").filter({ hasText: subject }));
    await page.getByLabel("Show").selectOption("");

    await row.getByRole("button", { name: "Send again" }).click();
    await shown(page.getByText("1 message queued to send now; this list follows them."));
    // The delivery job sends it; the list refreshes itself while anything is unsent.
    await shown(row.getByText("Sent", { exact: true }));
    expect(await row.getAttribute("data-status")).toBe("sent");
    expect(await row.getByRole("button", { name: "Send again" }).count()).toBe(0);

    const mail = await waitForMail(to, new RegExp(subject.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")));
    expect(mail.text).toContain("Lina Lead signed off the test.");
    await ctx.close();
  }, 180_000);

  it("lead opens version 1 of a re-analysed test from the history, sees it marked, and goes back to the current one", async () => {
    const ctx = await session.newContext(PHONE);
    const page = await ctx.newPage();
    await signInThroughPage(page, lead.email, lead.password);
    await page.goto(`/vacuum-tests/${versionedId}`);
    const headline = page.getByTestId("verdict-headline");
    await shown(headline);
    expect(await headline.textContent()).toBe(verdictLabel("pass"));
    expect(await page.getByTestId("version-banner").count()).toBe(0);

    await page.getByRole("link", { name: "View version 1" }).click();
    await page.waitForURL(/\?analysis=/);
    const banner = page.getByTestId("version-banner");
    await shown(banner.getByText("Showing analysis v1 of 2"));
    await expect.poll(() => headline.textContent(), { timeout: 30_000 }).toBe(verdictLabel("leak"));
    // The earlier version is not re-analysed from this page.
    expect(await page.getByRole("button", { name: /Analyse again/ }).count()).toBe(0);

    await banner.getByRole("link", { name: "Back to current" }).click();
    await page.waitForURL(new RegExp(`/vacuum-tests/${versionedId}$`));
    await expect.poll(() => headline.textContent(), { timeout: 30_000 }).toBe(verdictLabel("pass"));
    expect(await page.getByTestId("version-banner").count()).toBe(0);
    expect(await page.getByRole("button", { name: "Analyse again" }).count()).toBe(1);
    await ctx.close();
  }, 180_000);
});
