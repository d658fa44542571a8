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
import { recordDemoSystem } from "@/tests/helpers/planner-system";

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
  await recordDemoSystem(tech, "Unit B7 heat pump", 2);
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
    // A range with its assumptions beside it, and never a negative saving (common practice, no published source).
    await expect(result.getByTestId("plan-range").textContent()).resolves.toMatch(/\d+ (min|s|h).* – \d+ (min|s|h)/);
    await expect(result.getByTestId("plan-assumptions").textContent()).resolves.toMatch(/Water and outgassing/);
    await expect(table.textContent()).resolves.not.toMatch(/[−-]\d+ ?%/);
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
    await page.getByLabel("Rated test pressure (psig)").fill("450");
    // CHECK-VALUES worked example (ideal gas, computed; Gay-Lussac's law): 294.17 psig expected.
    await expect(page.getByTestId("expected-end").textContent()).resolves.toBe("294.17");
    // A test without a start and end time or a duration cannot be saved.
    await expect(page.getByRole("button", { name: "Save the test" }).isDisabled()).resolves.toBe(true);
    await page.getByLabel("Or the duration (minutes)").fill("60");
    await page.getByRole("button", { name: "Save the test" }).click();
    await page.getByRole("heading", { name: "Saved" }).waitFor();
    await page.getByTestId("recent-pressure-tests").getByText("Holds").waitFor();
    await shot("pressure-test");
  });

  it("stops a test with a 480 psig reading in the middle against a 450 rating: warning at the top, no 'Holds', Save needs the acknowledgement (common practice, no published source)", async () => {
    await page.goto("/tools/pressure-test");
    await page.getByLabel("Start pressure (psig)").fill("300");
    await page.getByLabel("Start temperature (°F)").fill("80");
    await page.getByLabel("End pressure (psig)").fill("294");
    await page.getByLabel("End temperature (°F)").fill("70");
    await page.getByLabel("Or the duration (minutes)").fill("60");
    await page.getByLabel("Rated test pressure (psig)").fill("450");
    await page.getByRole("button", { name: "Add a reading" }).click();
    await page.getByLabel("Reading 1: minutes from the start").fill("20");
    await page.getByLabel("Reading 1: pressure (psig)").fill("480");
    const result = page.getByTestId("pressure-result");
    const warning = result.getByTestId("over-pressure-warning");
    await warning.waitFor();
    await expect(warning.textContent()).resolves.toMatch(/480 psig at 20 min/);
    await expect(result.getByTestId("pressure-verdict").textContent()).resolves.toBe("Stopped: above the rated test pressure");
    await expect(result.textContent()).resolves.not.toMatch(/Holds/);
    // The warning is the first thing in the result, above the verdict and above the Save button.
    const save = page.getByRole("button", { name: "Save the stopped test" });
    const [w, v, b] = await Promise.all([warning.boundingBox(), result.getByTestId("pressure-verdict").boundingBox(), save.boundingBox()]);
    expect(w!.y).toBeLessThan(v!.y);
    expect(w!.y).toBeLessThan(b!.y);
    await expect(save.isDisabled()).resolves.toBe(true);
    await page.getByLabel(/I have released the pressure through the regulator/).check();
    await expect(save.isDisabled()).resolves.toBe(false);
    await save.click();
    await page.getByRole("heading", { name: "Saved" }).waitFor();
    await page.getByTestId("recent-pressure-tests").getByText("Stopped: above the rated test pressure").first().waitFor();
    await shot("pressure-test-over");
  });

  it("asks gauge or absolute for a logger CSV whose header says only kPa, and labels the fields in kPa", async () => {
    await page.goto("/tools/pressure-test");
    await page.getByRole("radio", { name: "Logger CSV" }).click();
    await page.getByLabel("Logger CSV").setInputFiles({ name: "n2.csv", mimeType: "text/csv", buffer: Buffer.from("seconds,Pressure (kPa),temp C\n0,1900,20\n600,1905,20\n1200,1899,20\n") });
    await page.getByLabel(/says kPa but not gauge or absolute/).waitFor();
    await page.getByLabel("Rated test pressure (kPa gauge)").fill("2000");
    await page.getByLabel("Atmosphere").selectOption("entered");
    await page.getByLabel("Atmosphere (kPa abs)").waitFor();
    await expect(page.getByTestId("pressure-result").count()).resolves.toBe(0);
    await page.getByLabel(/says kPa but not gauge or absolute/).selectOption("gauge");
    await page.getByTestId("pressure-result").waitFor();
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

  it("shows a recorded system's own pull-downs beside the plan", async () => {
    await page.goto("/tools/planner");
    await page.getByLabel("A system from your records").selectOption({ label: "Planner test site · Unit B7 heat pump" });
    await expect.poll(() => page.getByLabel("Line-set length (ft)").inputValue()).toBe("35");
    const history = page.getByTestId("system-history");
    await history.getByTestId("recorded-vs-plan").first().waitFor();
    await expect(history.getByTestId("recorded-vs-plan").count()).resolves.toBe(2);
    await expect(history.getByTestId("recorded-vs-plan").first().textContent()).resolves.toMatch(/Recorded \d+.*plan .* – .*likely/);
    await page.getByRole("button", { name: "Plan the pull-down" }).click();
    await page.getByTestId("plan-result").waitFor();
    await shot("planner-history");
  });

  it("fills the planner's pump from the rig in the register", async () => {
    await page.goto("/tools/planner");
    await page.getByLabel("Use a rig from the register").selectOption({ label: "Van 7 kit" });
    await expect.poll(() => page.getByLabel("Pump free-air displacement").inputValue(), { timeout: 30_000 }).toBe("8");
    expect(errors).toEqual([]);
  });
});
