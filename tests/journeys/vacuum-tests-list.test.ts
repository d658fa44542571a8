/**
 * The tests list on a phone, in a real Chromium: a lead filters a busy shop's tests by verdict and
 * leaves out practice runs, then pages through with "Load more". Every row shown carries the chosen
 * verdict in words, no practice run slips in, and the second page adds rows without repeating any.
 * Invented shop, people and tests (tests/helpers/seed-test.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Locator, Page } from "playwright-core";
import { launch, PHONE, signInThroughPage, type Session } from "./browser";
import { addMember, createShop, type TestMember } from "@/tests/helpers/members";
import { seedTest } from "@/tests/helpers/seed-test";
import { verdictText } from "@/components/verdict/words";

/** The list's page size (app/(app)/vacuum-tests/TestsList.tsx). */
const PAGE_SIZE = 20;
const LEAKS = 24;
const LEAK_PRACTICE = 3;
const PASSES = 6;

let session: Session;
let lead: TestMember;

async function shown(locator: Locator): Promise<void> {
  try {
    await locator.first().waitFor({ state: "visible", timeout: 30_000 });
  } catch (err) {
    await locator.page().screenshot({ path: "/tmp/rl-tests-list-journey-failure.png", fullPage: true }).catch(() => undefined);
    throw err;
  }
}

/** Each row's link and the words of its verdict chip. */
async function rowsOf(page: Page): Promise<{ href: string; verdict: string; text: string }[]> {
  return page.getByTestId("test-row").evaluateAll((links) =>
    links.map((a) => ({ href: a.getAttribute("href") ?? "", verdict: a.querySelector("span")?.textContent?.trim() ?? "", text: a.textContent ?? "" })),
  );
}

beforeAll(async () => {
  const owner = await createShop("Valley Air Service (invented)");
  lead = await addMember(owner.organizationId, "lead", "Lars Lead");
  const tech = await addMember(owner.organizationId, "technician", "Tara Tech");
  const apprentice = await addMember(owner.organizationId, "apprentice", "Abe Apprentice");
  const start = Date.now();
  const minutesAgo = (i: number) => new Date(start - i * 60_000);
  // Interleaved in time, so the leaks are spread across what would be several unfiltered pages.
  let i = 0;
  for (let n = 0; n < LEAKS; n++) await seedTest(tech, { verdict: "leak", title: `Leak run ${n + 1}`, testedAt: minutesAgo(i++) });
  for (let n = 0; n < PASSES; n++) await seedTest(tech, { verdict: "pass", title: `Pass run ${n + 1}`, testedAt: minutesAgo(i++ - 20) });
  for (let n = 0; n < LEAK_PRACTICE; n++) await seedTest(apprentice, { verdict: "leak", isPractice: true, title: `Practice leak ${n + 1}`, testedAt: minutesAgo(i++ - 30) });
  session = await launch();
});
afterAll(async () => {
  await session?.close();
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

describe("tests list journey (phone)", () => {
  it("filters by verdict and leaves out practice runs; Load more adds the rest of the leaks without duplicates", async () => {
    const ctx = await session.newContext(PHONE);
    const page = await ctx.newPage();
    await signInThroughPage(page, lead.email, lead.password);
    await page.goto("/vacuum-tests");
    await shown(page.getByTestId("test-row"));
    // Unfiltered, the first page is full and there is more.
    expect((await rowsOf(page)).length).toBe(PAGE_SIZE);

    await page.getByText("Filters", { exact: true }).click();
    await page.getByLabel("Verdict").selectOption("leak");
    await page.waitForURL(/verdict=leak/);
    await page.getByLabel("Practice runs").selectOption("false");
    await page.waitForURL(/isPractice=false/);
    await shown(page.getByText("Filters (2 on)"));

    const leakLabel = verdictText("leak").label;
    // Wait for the filtered page (while it loads the list is empty, and an empty list is vacuously "all leaks").
    await expect.poll(async () => {
      const rows = await rowsOf(page);
      return rows.length > 0 && rows.every((r) => r.verdict === leakLabel && !r.text.includes("Practice"));
    }, { timeout: 30_000 }).toBe(true);
    const first = await rowsOf(page);
    expect(first.length).toBe(PAGE_SIZE);

    const more = page.getByRole("button", { name: "Load more" });
    expect((await more.boundingBox())!.height).toBeGreaterThanOrEqual(48);
    await more.click();
    await expect.poll(async () => (await rowsOf(page)).length, { timeout: 30_000 }).toBe(LEAKS);
    const all = await rowsOf(page);
    expect(new Set(all.map((r) => r.href)).size).toBe(LEAKS);
    expect(all.slice(0, PAGE_SIZE).map((r) => r.href)).toEqual(first.map((r) => r.href));
    expect(all.every((r) => r.verdict === leakLabel)).toBe(true);
    expect(all.some((r) => /Pass run|Practice leak/.test(r.text))).toBe(false);
    // Everything is shown: no further page.
    expect(await more.count()).toBe(0);
    await shown(page.getByText(`Showing ${LEAKS} tests`));
    await ctx.close();
  }, 180_000);
});
