/**
 * A technician's field exports on a phone (360 × 740, touch): a wet system's log whose every reading is
 * written "d,ddd" with nothing else in the file to tell 4,150 from 4.15 — Riseline asks before any verdict,
 * with both readings written out, and the answer decides; and sample 7 (quoted TSV with thousands
 * separators, a wet system that used to read as a pass) reads as moisture straight away.
 * Real Chromium against the running Riseline, real database, real S3 fake.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { BrowserContext, Page } from "playwright-core";
import { launch, PHONE, signInThroughPage, type Session } from "./browser";
import { addMember, createShop, type TestMember } from "@/tests/helpers/members";

const SAMPLE_7 = "fixtures/samples/sample-7-tsv-quoted-thousands.csv";

let session: Session;
let tech: TestMember;
const scratch = mkdtempSync(join(tmpdir(), "rl-field-"));

beforeAll(async () => {
  session = await launch();
  const owner = await createShop();
  tech = await addMember(owner.organizationId, "technician", "Fern Field");
});

afterAll(async () => {
  await session?.close();
});

async function phonePage(): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await session.newContext(PHONE);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on("pageerror", (e) => errors.push(e.message));
  await signInThroughPage(page, tech.email, tech.password);
  return { context, page, errors };
}

describe("field exports on the upload screen (common practice, no published source)", () => {
  it("asks how '1,200' is written before any verdict, with both readings spelled out, and analyses with the answer", async () => {
    const { context, page, errors } = await phonePage();
    // a wet hold from 1,200 to about 12,000 microns, every reading 'd,ddd' in a tab file
    const rows = Array.from({ length: 80 }, (_, i) => `"${i * 15}"\t"${(1200 + Math.round(10800 * (1 - Math.exp(-i / 12)))).toLocaleString("en-US")}"`);
    const path = join(scratch, "ambiguous.tsv");
    writeFileSync(path, ['"t (s)"\t"Vacuum (microns)"', ...rows].join("\n") + "\n");
    await page.goto("/vacuum-tests/new", { waitUntil: "networkidle" }); // hydrated: a file picked before it would be lost
    await page.getByLabel("Gauge log file (CSV)").setInputFiles(path);
    const question = page.getByTestId("decimal-question");
    await question.waitFor({ timeout: 30_000 });
    await expect.poll(() => question.textContent()).toMatch(/1,200 microns.*1\.2 microns/);
    // no verdict yet, and nothing can be analysed until one reading is picked
    expect(await page.getByTestId("verdict-headline").count()).toBe(0);
    const analyse = page.getByRole("button", { name: "Analyse with these columns" });
    expect(await analyse.isDisabled()).toBe(true);
    await question.getByLabel(/1,200 microns/).check({ force: true });
    await analyse.click();
    await expect.poll(() => page.getByTestId("verdict-headline").textContent(), { timeout: 60_000 }).toBe("Levels off: moisture likely");
    expect(await page.getByTestId("decimal-doubt").count()).toBe(0);
    expect(errors).toEqual([]);
    await context.close();
  });

  it("sample 7 (quoted TSV, thousands separators) is a wet system straight away: moisture, no question asked (samples README)", async () => {
    const { context, page, errors } = await phonePage();
    await page.goto("/vacuum-tests/new", { waitUntil: "networkidle" }); // hydrated: a file picked before it would be lost
    await page.getByLabel("Gauge log file (CSV)").setInputFiles(SAMPLE_7);
    await expect.poll(() => page.getByTestId("verdict-headline").textContent(), { timeout: 60_000 }).toBe("Levels off: moisture likely");
    expect(await page.getByTestId("decimal-question").count()).toBe(0);
    expect(errors).toEqual([]);
    await context.close();
  });
});
