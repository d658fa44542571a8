/**
 * The tools around the vacuum on a phone (360 × 740, touch): plan a pull-down with what-ifs,
 * record a nitrogen standing-pressure test, and log a pump oil change on a new rig.
 * Real Chromium against the running Riseline and the real database.
 * Set JOURNEY_SHOTS=1 to keep screenshots in $JOURNEY_SHOTS_DIR (default /tmp/rl-tools-shots).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { launch, PHONE, signInThroughPage, type Session } from "./browser";
import { addMember, createShop, type TestMember } from "@/tests/helpers/members";

const SHOTS = process.env.JOURNEY_SHOTS === "1";
const SHOTS_DIR = process.env.JOURNEY_SHOTS_DIR ?? "/tmp/rl-tools-shots";

let session: Session;
let tech: TestMember;
let page: Page;
const errors: string[] = [];

async function shot(name: string) {
  if (!SHOTS) return;
  mkdirSync(SHOTS_DIR, { recursive: true });
  await page.screenshot({ path: `${SHOTS_DIR}/${name}.png`, fullPage: true });
}

beforeAll(async () => {
  session = await launch();
  const owner = await createShop();
  tech = await addMember(owner.organizationId, "technician", "Tomas Tech");
  const context = await session.newContext(PHONE);
  // A dev server compiles each page on first visit, which can take tens of seconds on a busy machine.
  context.setDefaultTimeout(90_000);
  page = await context.newPage();
  page.on("pageerror", (e) => errors.push(e.message));
  await signInThroughPage(page, tech.email, tech.password);
});

afterAll(async () => {
  await session?.close();
});

describe("tools journey on a 360 px phone (common practice, no published source)", () => {
  it("plans a pull-down and compares what-ifs", async () => {
    await page.goto("/tools");
    await page.getByRole("link", { name: /Pull-down planner/ }).click();
    await page.waitForURL(/\/tools\/planner/);
    await page.getByLabel("Line-set length (ft)").fill("30");
    await page.getByRole("button", { name: "Plan the pull-down" }).click();
    const result = page.getByTestId("plan-result");
    await expect(result.getByTestId("time-to-target").textContent()).resolves.toMatch(/\d+ (min|s)/);
    const table = page.getByRole("table", { name: "What-ifs side by side" });
    await expect(table.getByText("3/8 in hoses").count()).resolves.toBe(1);
    await expect(table.getByText("Cores out").count()).resolves.toBe(1);
    await expect(page.getByText(/gas-only estimate/).count()).resolves.toBeGreaterThan(0);
    await page.locator("canvas").first().waitFor();
    await shot("planner");
  });

  it("records a nitrogen standing-pressure test with the correction worked out", async () => {
    await page.goto("/tools/pressure-test");
    await expect(page.getByText("Never pressurise with oxygen or compressed air.").count()).resolves.toBe(1);
    await page.getByLabel("Start pressure (psig)").fill("300");
    await page.getByLabel("Start temperature (°F)").fill("80");
    await page.getByLabel("End pressure (psig)").fill("294");
    await page.getByLabel("End temperature (°F)").fill("70");
    await page.getByLabel("Rated test pressure (nameplate, gauge)").fill("450");
    // CHECK-VALUES worked example (ideal gas, computed): 294.17 psig expected.
    await expect(page.getByTestId("expected-end").textContent()).resolves.toBe("294.17");
    await page.getByRole("button", { name: "Save the test" }).click();
    await page.getByRole("heading", { name: "Saved" }).waitFor();
    await page.getByTestId("recent-pressure-tests").getByText("Holds").waitFor();
    await shot("pressure-test");
  });

  it("adds a rig with a pump and logs an oil change", async () => {
    await page.goto("/tools/rigs");
    await page.getByLabel("Rig name").fill("Van 7 kit");
    await page.getByRole("button", { name: "Add rig" }).click();
    await page.waitForURL(/\/tools\/rigs\/[0-9a-f-]{36}/);
    await page.getByLabel("Name or label").fill("8 CFM pump");
    await page.getByLabel("Free-air displacement (CFM)").fill("8");
    await page.getByRole("button", { name: "Add equipment" }).click();
    await page.getByText("8 CFM · oil every 30 days").waitFor();
    await page.getByLabel("Equipment").selectOption({ label: "Vacuum pump: 8 CFM pump" });
    await page.getByLabel("Why").selectOption("cloudy_oil");
    await page.getByRole("button", { name: "Log it" }).click();
    await page.getByTestId("rig-history").getByText(/Oil changed/).waitFor();
    await expect(page.getByTestId("rig-history").getByText(/oil cloudy or yellow/).count()).resolves.toBe(1);
    await shot("rig");
  });

  it("fills the planner's pump from the rig in the register", async () => {
    await page.goto("/tools/planner");
    await page.getByLabel("Use a rig from the register").selectOption({ label: "Van 7 kit" });
    await expect.poll(() => page.getByLabel("Pump free-air displacement").inputValue(), { timeout: 30_000 }).toBe("8");
    expect(errors).toEqual([]);
  });
});
