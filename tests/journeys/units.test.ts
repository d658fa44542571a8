/**
 * Units as a shop setting, on a desktop: the owner switches the shop to metric; a technician sees
 * °C and metres on the test page, the report and the upload form and kPa in the nitrogen tool; then chooses
 * imperial for themself and sees °F and feet while the report stays in the shop's units.
 * Real Chromium against the running Riseline (next build + next start) and the real database.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { Page } from "playwright-core";
import { DESKTOP, launch, signInThroughPage, type Session } from "./browser";
import { db } from "@/db/client";
import { vacuumTests } from "@/db/schema";
import { addMember, createShop, type TestMember } from "@/tests/helpers/members";
import { seedTest } from "@/tests/helpers/seed-test";

let session: Session;
let owner: TestMember;
let tech: TestMember;
let testId: string;
const errors: string[] = [];

async function signedIn(member: TestMember): Promise<Page> {
  const context = await session.newContext(DESKTOP);
  context.setDefaultTimeout(60_000);
  const page = await context.newPage();
  page.on("pageerror", (e) => errors.push(e.message));
  await signInThroughPage(page, member.email, member.password);
  return page;
}

/** The "How the log was read" box of the test page, opened. */
async function recordBox(page: Page): Promise<string> {
  await page.goto(`/vacuum-tests/${testId}`);
  await page.getByText("How the log was read").click();
  return page.locator("details").filter({ hasText: "Ambient" }).innerText();
}

beforeAll(async () => {
  session = await launch();
  owner = await createShop();
  tech = await addMember(owner.organizationId, "technician", "Tomas Tech");
  testId = await seedTest(tech, { title: "Units journey" });
  await db().update(vacuumTests).set({ lineSetFeet: 25, ambientC: 21.5 }).where(eq(vacuumTests.id, testId));
});

afterAll(async () => {
  await session?.close();
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

describe("units journey (NIST SP 811: 1 ft = 0.3048 m, 1 psi = 6.894757 kPa, °F = °C·9/5+32)", () => {
  it("owner switches the shop to metric; the technician sees °C, m and kPa; then their own imperial override", async () => {
    const o = await signedIn(owner);
    await o.goto("/settings/members");
    const card = o.getByTestId("units-settings");
    await card.getByLabel("Shop units").selectOption("metric");
    await card.getByRole("button", { name: "Save shop units" }).click();
    await expect(card.getByText(/The shop works in Metric/).waitFor()).resolves.toBeUndefined();

    const t = await signedIn(tech);
    const metric = await recordBox(t);
    expect(metric).toContain("21.5 °C");
    expect(metric).toContain("7.6 m");
    expect(metric).not.toContain("°F");
    await t.goto(`/vacuum-tests/${testId}/report`);
    const report = await t.locator("main").innerText();
    expect(report).toContain("21.5 °C");
    expect(report).toMatch(/7\.6 m,/);
    await t.goto("/tools/pressure-test");
    await expect(t.getByLabel("Pressure unit").inputValue()).resolves.toBe("kpa_gauge");
    // The upload form asks in the reader's units (stored in feet and °C as before).
    await t.goto("/vacuum-tests/new");
    await t.getByText("Add job, site and system").click();
    await expect(t.getByLabel("Line-set length (metres)").waitFor()).resolves.toBeUndefined();
    await expect(t.getByLabel("Unit", { exact: true }).inputValue()).resolves.toBe("C");

    await t.goto("/settings/members");
    const mine = t.getByTestId("units-settings");
    await mine.getByLabel("Your units").selectOption("imperial");
    await mine.getByRole("button", { name: "Save your units" }).click();
    await expect(mine.getByText(/\(your own choice\)/).waitFor()).resolves.toBeUndefined();
    const imperial = await recordBox(t);
    expect(imperial).toContain("71 °F");
    expect(imperial).toContain("25 ft");
    // The report is the shop's document: still in the shop's units.
    await t.goto(`/vacuum-tests/${testId}/report`);
    expect(await t.locator("main").innerText()).toContain("21.5 °C");
    expect(errors).toEqual([]);
  });
});
