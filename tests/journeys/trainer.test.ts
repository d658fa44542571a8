/**
 * The trainer's bench in a real Chromium against the running Riseline: a trainer builds a
 * collection, adds three curves, pins a note on one, and overlays the three; an apprentice on a
 * phone makes a practice call on the bare curve and then sees the analysis beside it.
 * Screenshots at 360 px and 1280 px when JOURNEY_SHOTS=1 (written to $JOURNEY_SHOTS_DIR or /tmp).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { DESKTOP, launch, PHONE, signInThroughPage, type Session } from "./browser";
import { addMember, createShop, type TestMember } from "@/tests/helpers/members";
import { seedTest } from "@/tests/helpers/seed-test";

const SHOTS = process.env.JOURNEY_SHOTS === "1";
const SHOTS_DIR = process.env.JOURNEY_SHOTS_DIR ?? "/tmp";

let session: Session;
let trainer: TestMember;
let apprentice: TestMember;
let practiceId: string;
const titles = ["Bench: tight and dry", "Bench: steady leak", "Bench: second leak"];

beforeAll(async () => {
  session = await launch();
  const owner = await createShop();
  trainer = await addMember(owner.organizationId, "trainer", "Tamsin Trainer");
  apprentice = await addMember(owner.organizationId, "apprentice", "Arlo Apprentice");
  const lead = await addMember(owner.organizationId, "lead", "Lee Lead");
  await seedTest(lead, { verdict: "pass", title: titles[0] });
  await seedTest(lead, { verdict: "leak", title: titles[1] });
  await seedTest(lead, { verdict: "leak", title: titles[2] });
  practiceId = await seedTest(apprentice, { verdict: "leak", title: "My practice: garage heat pump", isPractice: true });
});

afterAll(async () => {
  await session?.close();
});

async function pageFor(member: TestMember, device: typeof PHONE | typeof DESKTOP): Promise<{ page: Page; errors: string[] }> {
  const context = await session.newContext(device);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on("pageerror", (e) => errors.push(e.message));
  await signInThroughPage(page, member.email, member.password);
  return { page, errors };
}

async function inkOf(page: Page, testId: string): Promise<number> {
  const canvas = page.getByTestId(testId).first().locator("canvas");
  await canvas.waitFor({ state: "visible", timeout: 60_000 });
  await page.waitForTimeout(300);
  return canvas.evaluate((c: HTMLCanvasElement) => {
    const data = c.getContext("2d")!.getImageData(0, 0, c.width, c.height).data;
    let n = 0;
    for (let i = 3; i < data.length; i += 4) if (data[i] > 0) n++;
    return n;
  });
}

async function shot(page: Page, name: string) {
  if (!SHOTS) return;
  for (const [w, h] of [[360, 740], [1280, 860]]) {
    await page.setViewportSize({ width: w, height: h });
    await page.waitForTimeout(400);
    await page.screenshot({ path: `${SHOTS_DIR}/rl-${name}-${w}.png`, fullPage: true });
  }
}

describe("trainer's bench journeys", () => {
  it("a trainer builds a collection, pins a note and overlays three curves", async () => {
    const { page, errors } = await pageFor(trainer, DESKTOP);
    await page.goto("/casebook");
    await page.getByLabel("Title").fill("Leaks versus a tight system");
    await page.getByLabel("What it teaches (optional)").fill("Three hold curves side by side.");
    await page.getByRole("button", { name: "Create collection" }).click();
    await page.waitForURL(/\/casebook\/[0-9a-f-]{36}$/);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toContain("Leaks versus a tight system");

    for (const t of titles) {
      const option = await page.getByLabel("Test").locator("option", { hasText: t }).getAttribute("value");
      await page.getByLabel("Test").selectOption(option!);
      await page.getByLabel("Title for the casebook").fill(`Case: ${t.replace("Bench: ", "")}`);
      await page.getByLabel("Notes").last().fill("Look at the slope after isolation.");
      await page.getByRole("button", { name: "Add to collection" }).click();
      await expect.poll(async () => page.getByTestId("casebook-entry").filter({ hasText: `Case: ${t.replace("Bench: ", "")}` }).count(), { timeout: 60_000 }).toBe(1);
    }
    expect(await page.getByTestId("casebook-entry").count()).toBe(3);

    // pin a note on the steady leak at minute 30
    const leak = page.getByTestId("casebook-entry").filter({ hasText: "Case: steady leak" });
    await leak.getByLabel("Pin at minute").fill("30");
    await leak.getByLabel("Note to pin").fill("Still climbing: leak");
    await leak.getByRole("button", { name: "Pin note" }).click();
    await expect.poll(() => leak.getByRole("list", { name: "Pinned notes" }).textContent(), { timeout: 60_000 }).toContain("Still climbing: leak");
    await expect.poll(() => leak.getByRole("list", { name: "Pinned notes" }).textContent()).toContain("30 min");
    expect(await inkOf(page, "entry-chart")).toBeGreaterThan(1000);
    await shot(page, "casebook-collection");

    // tick all three and compare
    for (const box of await page.getByRole("checkbox", { name: "Compare" }).all()) await box.check();
    await expect.poll(() => page.getByTestId("compare-link").textContent()).toContain("Compare 3 curves");
    await page.getByTestId("compare-link").click();
    await page.waitForURL(/\/compare\?tests=/);
    const ids = new URL(page.url()).searchParams.get("tests")!.split(",");
    expect(ids).toHaveLength(3);
    await page.getByTestId("overlay-table").waitFor({ timeout: 60_000 });
    expect(await page.getByTestId("overlay-table").locator("tbody tr").count()).toBe(3);
    expect(await inkOf(page, "overlay-chart")).toBeGreaterThan(1000);
    const table = await page.getByTestId("overlay-table").textContent();
    for (const t of titles) expect(table).toContain(t);
    await page.getByRole("button", { name: "Rise" }).click();
    await expect.poll(() => page.getByRole("button", { name: "Rise" }).getAttribute("aria-pressed")).toBe("true");
    expect(await inkOf(page, "overlay-chart")).toBeGreaterThan(1000);
    await shot(page, "compare");
    expect(errors).toEqual([]);
  });

  it("an apprentice makes a practice call on the bare curve, then sees the analysis beside it", async () => {
    const { page, errors } = await pageFor(apprentice, PHONE);
    await page.goto("/practice");
    await page.getByTestId("practice-tests").getByRole("link", { name: /My practice: garage heat pump/ }).click();
    await page.waitForURL(new RegExp(`/practice/${practiceId}$`));
    expect(await inkOf(page, "practice-chart")).toBeGreaterThan(1000);
    // no verdict on the page before the call
    expect(await page.getByTestId("practice-analysis").count()).toBe(0);
    expect(await page.getByText("leak likely").count()).toBe(0);
    await shot(page, "practice-before");
    await page.getByLabel("Leak", { exact: true }).check();
    await page.getByLabel("Why? (a few words)").fill("It keeps climbing in a straight line.");
    await page.getByRole("button", { name: "Make my call" }).click();
    await page.getByTestId("practice-analysis").waitFor({ timeout: 60_000 });
    expect(await page.getByTestId("my-call").textContent()).toContain("It keeps climbing in a straight line.");
    expect(await page.getByTestId("call-match").textContent()).toContain("matches the analysis");
    expect(await page.getByTestId("practice-analysis").textContent()).toContain("Steady climb: leak likely");
    await shot(page, "practice-after");
    expect(errors).toEqual([]);

    // the trainer sees the call and the match rate
    const t = await pageFor(trainer, DESKTOP);
    await t.page.goto("/practice");
    const row = t.page.getByTestId("apprentice-scores").getByRole("row", { name: /Arlo Apprentice/ });
    await expect.poll(() => row.textContent()).toContain("100 %");
    await shot(t.page, "practice-trainer");
  });
});
