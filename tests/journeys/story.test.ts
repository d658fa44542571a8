/**
 * One truthful story per test, read as a technician and a lead would: the tiles, the sentence, the
 * profile rules, the report page and the PDF of one test quote the same start, last reading and
 * highest; a leak never sits beside a green "will pass"; "Passed" never stands on a test that misses
 * the profile. Real Chromium against the running Riseline, real database, S3 fake; the PDF is read
 * back with pdf-parse. Invented data (analysis/decay/simulate); thresholds: the default profile, common
 * practice, no published source.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { createHash } from "node:crypto";
import { PDFParse } from "pdf-parse";
import type { Page } from "playwright-core";
import { DESKTOP, PHONE, launch, signInThroughPage, type Session, typeMinuteReadings } from "./browser";
import { addMember, createShop, type TestMember } from "@/tests/helpers/members";
import { simulateLog } from "@/analysis/decay/simulate";

let session: Session;
let owner: TestMember;
let tech: TestMember;
let lead: TestMember;
const SHOTS = process.env.JOURNEY_SHOTS === "1";
const scratch = mkdtempSync(join(tmpdir(), "rl-story-"));
// A wet system (moisture): a 16-minute hold sampled every 10 s that levels off near 2,900 microns.
const MOISTURE = simulateLog({ scenario: "moisture", seed: 2, holdMinutes: 16, layout: "iso", sampleSeconds: 10 }).text;
// A tight curve isolated at about 711 microns, above the 500-micron target.
const HIGH_ISOLATION = simulateLog({ scenario: "target_not_reached", seed: 1, layout: "iso", sampleSeconds: 10 }).text;

beforeAll(async () => {
  session = await launch();
  owner = await createShop();
  tech = await addMember(owner.organizationId, "technician", "Theo Tech");
  lead = await addMember(owner.organizationId, "lead", "Lena Lead");
});
afterAll(async () => {
  await session?.close();
});

async function pageFor(member: TestMember, device: typeof PHONE | typeof DESKTOP = PHONE): Promise<{ page: Page; errors: string[]; close: () => Promise<void> }> {
  const context = await session.newContext(device);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on("pageerror", (e) => errors.push(e.message));
  await signInThroughPage(page, member.email, member.password);
  return { page, errors, close: () => context.close() };
}

/** The first number in a text ("2,700 microns (single highest reading 2,750)" → 2700). */
const int = (s: string | null | undefined) => Number((/\d[\d,]*(\.\d+)?/.exec(s ?? "")?.[0] ?? "NaN").replace(/,/g, ""));

async function upload(page: Page, name: string, text: string): Promise<string> {
  const path = join(scratch, name);
  writeFileSync(path, text);
  await page.goto("/vacuum-tests/new");
  await page.getByLabel("Gauge log file (CSV)").setInputFiles(path);
  await page.getByTestId("verdict-headline").waitFor({ timeout: 60_000 });
  await page.getByRole("link", { name: "Open the test page" }).click();
  await page.waitForURL(/\/vacuum-tests\/[0-9a-f-]{36}$/);
  return page.url().split("/").pop()!;
}

describe("one story per test", () => {
  it("tiles, sentence, profile rules, the report page and the PDF quote the same start, last reading and highest", async () => {
    const { page, errors, close } = await pageFor(tech);
    const id = await upload(page, "wet-system.csv", MOISTURE);
    await page.getByTestId("number-last").waitFor({ timeout: 30_000 });
    expect(await page.getByTestId("verdict-headline").textContent()).toBe("Levels off: moisture likely");
    const start = int(await page.getByTestId("number-start").textContent());
    const last = int(await page.getByTestId("number-last").textContent());
    const highest = int(await page.getByTestId("number-highest").textContent());
    expect(start).toBeGreaterThan(100);
    expect(highest).toBeGreaterThan(start); // the limit rule judges the highest over the whole hold
    const sentence = (await page.getByTestId("hold-sentence").textContent())!;
    const m = /From ([\d,]+) to a last reading of ([\d,]+) microns in [\d.]+ min; highest ([\d,]+) microns/.exec(sentence)!;
    expect([int(m[1]), int(m[2]), int(m[3])]).toEqual([start, last, highest]);
    // The limit rule quotes the same highest (smoothed, with the single highest reading beside it).
    const limitRule = (await page.getByTestId("rule-limit").textContent())!;
    expect(limitRule).toContain(`highest ${highest.toLocaleString("en-US")} microns`);
    // The hold ran past the profile's 10 minutes: what was measured then, not a forecast behind the data.
    expect(await page.getByTestId("early-call").getAttribute("data-kind")).toBe("measured");
    expect(await page.getByTestId("early-call").textContent()).toMatch(/^At 10\.0 min of hold \(measured\)/);
    expect(await page.getByTestId("confidence").textContent()).toMatch(/^\d+ % — (sure|likely|unsure)$/);
    if (SHOTS) await page.screenshot({ path: "/tmp/story-test-page-360.png", fullPage: true });

    // The report page: the report only, the same numbers and sentence.
    await page.goto(`/vacuum-tests/${id}/report`);
    await page.getByTestId("report").waitFor();
    expect(await page.getByTestId("review-panel").count()).toBe(0);
    expect(await page.getByTestId("report-hold-sentence").textContent()).toBe(sentence);
    const reportNumber = async (label: string) => int(await page.locator(`[data-testid="report-number"][data-label="${label}"]`).textContent());
    expect(await reportNumber("Hold start")).toBe(start);
    expect(await reportNumber("Last reading")).toBe(last);
    expect(await reportNumber("Highest")).toBe(highest);
    expect(await page.getByTestId("report-signoff").textContent()).not.toContain("Not signed off");
    if (SHOTS) await page.screenshot({ path: "/tmp/story-report-360.png", fullPage: true });

    // The PDF: the same sentence, the raw log's SHA-256 and the engine version.
    const res = await page.request.get(`/api/vacuum-tests/${id}/report`);
    expect(res.status()).toBe(200);
    const parser = new PDFParse({ data: new Uint8Array(await res.body()) });
    const text = (await parser.getText()).text.replace(/\s+/g, " ");
    await parser.destroy();
    expect(text).toContain(sentence);
    expect(text).toContain(limitRule.replace(/^✕ /, "").replace(/^[^:]+: /, ""));
    expect(text).toContain(createHash("sha256").update(MOISTURE).digest("hex"));
    expect(text).toMatch(/analysis engine \d+\.\d+\.\d+/);
    expect(text).not.toContain("!'");
    expect(errors).toEqual([]);
    await close();
  });

  it("typed minutes with an empty last row: isolation at the first reading, and a slow leak under the limit is an early fail, never a green pass", async () => {
    const { page, errors, close } = await pageFor(tech);
    await page.goto("/vacuum-tests/new");
    // 0–9 min, 350 microns climbing 40 per minute: 710 at minute 9, under the 1,000-micron limit, but a leak by rate.
    const readings = Array.from({ length: 10 }, (_, m) => 350 + 40 * m);
    await typeMinuteReadings(page, readings);
    await page.keyboard.press("Enter"); // an empty 11th row, as a technician leaves it
    await expect.poll(() => page.getByLabel("Row 11 minutes since isolation").inputValue()).toBe("10");
    await page.getByRole("button", { name: "Analyse readings" }).click();
    await page.getByTestId("verdict-headline").waitFor({ timeout: 60_000 });
    expect(await page.getByTestId("verdict-headline").textContent()).toBe("Unclear from this log");
    const banner = (await page.getByTestId("verdict").textContent())!;
    expect(banner).toContain("Isolated at 350 microns.");
    expect(banner).not.toContain("No isolation point found");
    expect(await page.getByTestId("early-call").getAttribute("data-kind")).toBe("early_fail");
    expect(await page.getByTestId("early-call").textContent()).toBe("Early call: will not pass (the leak rate)");
    expect(await page.getByText("on course to pass").count()).toBe(0);
    if (SHOTS) await page.screenshot({ path: "/tmp/story-typed-360.png", fullPage: true });
    expect(errors).toEqual([]);
    await close();
  });

  it("a tight curve isolated above the target is 'Tight and dry, misses profile' in the queue and the list, never 'Passed'", async () => {
    const t = await pageFor(tech);
    const id = await upload(t.page, "high-isolation.csv", HIGH_ISOLATION);
    expect(await t.page.getByTestId("verdict-headline").textContent()).toBe("Tight and dry");
    expect(await t.page.getByTestId("profile-statement").textContent()).toMatch(/Not met.*Reached the target before isolating: isolated at [\d,]+ microns \(target 500\)/);
    await t.close();
    const l = await pageFor(lead, DESKTOP);
    await l.page.goto("/review");
    const item = l.page.locator(`a[href="/vacuum-tests/${id}"]`).getByTestId("outcome-badge");
    await item.waitFor({ timeout: 30_000 });
    expect(await item.textContent()).toBe("Tight and dry, misses profile");
    await l.page.goto("/vacuum-tests");
    const row = l.page.locator(`a[href="/vacuum-tests/${id}"]`).getByTestId("outcome-badge");
    await row.waitFor({ timeout: 30_000 });
    expect(await row.textContent()).toBe("Tight and dry, misses profile");
    expect(await l.page.getByTestId("outcome-badge").filter({ hasText: /^Passed$/ }).count()).toBe(0);
    if (SHOTS) await l.page.screenshot({ path: "/tmp/story-list-desktop.png" });
    expect(l.errors).toEqual([]);
    await l.close();
  });
});
