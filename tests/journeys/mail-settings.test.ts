/**
 * Mail settings in a real Chromium. The owner (desktop) names the shop as the sender and chooses
 * who receives review requests; a technician (phone) turns comment mail off on their own page; a
 * lead opens the unsubscribe link of a mail (RFC 8058 §3.1: the GET page changes nothing, its
 * button does) and the preference is recorded. Invented names and data.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Locator } from "playwright-core";
import { DESKTOP, launch, PHONE, signInThroughPage, type Session } from "./browser";
import { addMember, createShop, type TestMember } from "@/tests/helpers/members";
import { db } from "@/db/client";
import { getShopMailSettings, listMailOptOuts } from "@/db/queries/mail-settings";
import { unsubscribeUrl } from "@/lib/notify/unsubscribe";

let session: Session;
let owner: TestMember;
let lead: TestMember;
let tech: TestMember;

async function shown(locator: Locator): Promise<void> {
  try {
    await locator.first().waitFor({ state: "visible", timeout: 60_000 });
  } catch (err) {
    await locator.page().screenshot({ path: "/tmp/rl-mail-settings-journey-failure.png", fullPage: true }).catch(() => undefined);
    throw err;
  }
}

beforeAll(async () => {
  owner = await createShop("Fernhollow Cooling (invented)");
  lead = await addMember(owner.organizationId, "lead", "Lena Lead");
  tech = await addMember(owner.organizationId, "technician", "Teo Tech");
  session = await launch();
});
afterAll(async () => {
  await session?.close();
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

describe("mail settings journey", () => {
  it("the owner sets the sender name and sends review requests to one chosen lead", async () => {
    const ctx = await session.newContext(DESKTOP);
    const page = await ctx.newPage();
    await signInThroughPage(page, owner.email, owner.password);
    await page.goto("/settings/mail");
    const card = page.getByTestId("shop-mail-settings");
    await shown(card);
    await card.getByLabel("Sender name").fill("Fernhollow Cooling");
    await card.getByLabel("The people chosen below").check();
    await card.getByLabel(/Lena Lead/).check();
    await card.getByRole("button", { name: "Save mail settings" }).click();
    await shown(card.getByText("Saved."));
    expect(await getShopMailSettings(db(), { organizationId: owner.organizationId })).toEqual({ senderName: "Fernhollow Cooling", reviewMailTo: [lead.userId] });
    await ctx.close();
  }, 180_000);

  it("a technician turns comment mail off on their own page (phone)", async () => {
    const ctx = await session.newContext(PHONE);
    const page = await ctx.newPage();
    await signInThroughPage(page, tech.email, tech.password);
    await page.goto("/settings/my-mail");
    const card = page.getByTestId("my-mail");
    await shown(card);
    await card.getByLabel(/Comments/).uncheck();
    await card.getByRole("button", { name: "Save my mail settings" }).click();
    await shown(card.getByText("Saved."));
    expect(await listMailOptOuts(db(), { organizationId: owner.organizationId, userId: tech.userId })).toEqual(["comment"]);
    await ctx.close();
  }, 180_000);

  it("RFC 8058 §3.1: opening the unsubscribe link shows a button and changes nothing; pressing it records the preference", async () => {
    const ctx = await session.newContext(PHONE);
    const page = await ctx.newPage();
    await page.goto(unsubscribeUrl({ userId: lead.userId, organizationId: owner.organizationId, kind: "review_request" }));
    await shown(page.getByRole("heading", { name: "Stop “Review requests” mail?" }));
    expect(page.url()).toContain("/mail/unsubscribe?token=");
    expect(await listMailOptOuts(db(), { organizationId: owner.organizationId, userId: lead.userId })).toEqual([]);
    await page.getByRole("button", { name: "Stop this mail" }).click();
    await shown(page.getByText("Unsubscribed: you will no longer receive “Review requests” mail from this shop."));
    expect(await listMailOptOuts(db(), { organizationId: owner.organizationId, userId: lead.userId })).toEqual(["review_request"]);
    // An altered link shows the refusal and records nothing.
    await page.goto(unsubscribeUrl({ userId: lead.userId, organizationId: owner.organizationId, kind: "comment" }).replace(/.$/, "x"));
    await shown(page.getByRole("heading", { name: "This link is not valid" }).or(page.getByText("This unsubscribe link is not valid")));
    expect(await listMailOptOuts(db(), { organizationId: owner.organizationId, userId: lead.userId })).toEqual(["review_request"]);
    await ctx.close();
  }, 180_000);
});
