import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { launch, PHONE, type Session } from "./browser";
import { createShop, uniqueEmail, PASSWORD } from "../helpers/members";
import { firstAppLink, waitForMail } from "../helpers/mailbox";

let s: Session;
beforeAll(async () => {
  s = await launch();
});
afterAll(async () => {
  await s?.close();
});

describe("foundation journey on a 360 px phone (common practice, no published source)", () => {
  it("starts a shop, invites a technician, and the technician joins from the mailed link", async () => {
    const shopName = `Northwind Cooling ${randomUUID().slice(0, 4)}`;
    const ownerEmail = uniqueEmail("journey-owner");
    const techEmail = uniqueEmail("journey-tech");

    // 1. The owner starts a shop.
    const ownerCtx = await s.newContext(PHONE);
    // A dev server compiles each page on first visit, which can take tens of seconds on a busy machine.
    ownerCtx.setDefaultTimeout(90_000);
    const page = await ownerCtx.newPage();
    await page.goto("/sign-up");
    await page.getByLabel("Your name").fill("Opal Owner");
    await page.getByLabel("E-mail").fill(ownerEmail);
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByLabel("Shop name").fill(shopName);
    await page.getByRole("button", { name: "Create account and shop" }).click();
    await page.waitForURL(/\/home$/, { timeout: 90_000 });

    // 2. Inside the shell: the bottom bar shows on a phone, the sidebar does not.
    await expect.poll(() => page.getByTestId("bottom-nav").isVisible()).toBe(true);
    expect(await page.getByTestId("sidebar").isVisible()).toBe(false);
    expect(await page.getByTestId("member-role").filter({ visible: true }).first().textContent()).toBe("Owner");

    // 3. Shop (behind "More" on a phone) → invite a technician.
    await page.getByTestId("more-button").click();
    await page.getByTestId("more-sheet").getByRole("link", { name: "Shop" }).click();
    await page.waitForURL(/\/settings\/members$/);
    await page.getByLabel("Their e-mail").fill(techEmail);
    await page.getByLabel("Role", { exact: true }).selectOption("technician");
    await page.getByRole("button", { name: "Send invitation" }).click();
    await expect.poll(() => page.getByText(`Invitation sent to ${techEmail}.`).isVisible(), { timeout: 60_000 }).toBe(true);
    await expect.poll(() => page.getByTestId("invitation-list").textContent()).toContain(techEmail);

    // 4. The dev mailbox shows the invitation; its link is read from the page.
    let inviteHref: string | null = null;
    for (let i = 0; i < 20 && !inviteHref; i++) {
      await page.goto("/dev/mailbox");
      const item = page.getByTestId("mail-list").getByRole("link").filter({ hasText: techEmail }).first();
      if (await item.count()) {
        await item.click();
        await page.getByTestId("mail-message").waitFor();
        inviteHref = await page.getByTestId("mail-message").locator('a[href*="/invite/"]').first().getAttribute("href");
      } else await page.waitForTimeout(500);
    }
    // The link carries the key that proves the address is the reader's (lib/invitation-key.ts).
    expect(inviteHref).toMatch(/\/invite\/[A-Za-z0-9_-]+\?key=[A-Za-z0-9_-]+$/);
    await ownerCtx.close();

    // 5. The technician opens the link in a fresh browser and creates the account.
    const techCtx = await s.newContext(PHONE);
    techCtx.setDefaultTimeout(90_000);
    const tech = await techCtx.newPage();
    await tech.goto(inviteHref!);
    expect(await tech.getByRole("heading", { level: 1 }).textContent()).toBe(`Join ${shopName}`);
    expect(await tech.getByLabel("E-mail").inputValue()).toBe(techEmail);
    await tech.getByLabel("Your name").fill("Tomas Tech");
    await tech.getByLabel("Choose a password").fill(PASSWORD);
    await tech.getByRole("button", { name: "Create account and join" }).click();
    await tech.waitForURL(/\/home$/, { timeout: 90_000 });

    // 6. Signed in as the technician inside the shop.
    await expect.poll(() => tech.getByTestId("bottom-nav").isVisible()).toBe(true);
    expect(await tech.getByTestId("member-role").filter({ visible: true }).first().textContent()).toBe("Technician");
    expect(await tech.getByTestId("shop-name").filter({ visible: true }).first().textContent()).toBe(shopName);
    // A technician does not sign tests off, so Review is not among the places.
    expect(await tech.getByTestId("bottom-nav").getByRole("link", { name: "Review" }).count()).toBe(0);
    await techCtx.close();
  });

  it("resets a forgotten password from the e-mailed link and signs in with the new one", async () => {
    const owner = await createShop("Cedar Service Co");
    const ctx = await s.newContext(PHONE);
    ctx.setDefaultTimeout(90_000);
    const page = await ctx.newPage();
    await page.goto("/sign-in");
    await page.getByRole("link", { name: "Forgot password?" }).click();
    await page.waitForURL(/\/forgot-password/);
    await page.getByLabel("E-mail").fill(owner.email);
    await page.getByRole("button", { name: "Send the reset link" }).click();
    await expect.poll(() => page.getByText("Check your e-mail").isVisible(), { timeout: 60_000 }).toBe(true);

    const mail = await waitForMail(owner.email, /reset/i, 30_000);
    await page.goto(firstAppLink(mail));
    await page.waitForURL(/\/reset-password\?token=/);
    const newPassword = "a-fresh-password-for-cedar";
    await page.getByLabel("New password", { exact: true }).fill(newPassword);
    await page.getByLabel("New password again").fill(newPassword);
    await page.getByRole("button", { name: "Save the new password" }).click();
    await page.waitForURL(/\/sign-in\?reset=1/);

    // The old password no longer works; the new one opens the shop.
    await page.getByLabel("E-mail").fill(owner.email);
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect.poll(() => page.getByText("That e-mail and password do not match", { exact: false }).isVisible(), { timeout: 60_000 }).toBe(true);
    await page.getByLabel("Password").fill(newPassword);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(/\/home$/);
    expect(await page.getByTestId("shop-name").filter({ visible: true }).first().textContent()).toBe("Cedar Service Co");
    await ctx.close();
  });
});
