/**
 * A long gauge log on a phone: a 30-hour data-logger export (about 1.4 MB, invented) is stored and
 * analysed by a queued job; the upload page says so, follows the job, and shows the verdict and the
 * curve once the test is made. Real Chromium against the running Riseline (which runs the jobs).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { launch, PHONE, signInThroughPage, type Session } from "./browser";
import { addMember, createShop, type TestMember } from "@/tests/helpers/members";

let session: Session;
let tech: TestMember;
const file = join(mkdtempSync(join(tmpdir(), "rl-long-")), "logger-30h.csv");

beforeAll(async () => {
  const rows = ["elapsed_s,vacuum_microns"];
  for (let t = 0; t < 30 * 3600; t++) rows.push(`${t},${(t < 1800 ? 300 + 19700 * Math.exp(-t / 240) : 300 + 80 * (1 - Math.exp(-(t - 1800) / 900))).toFixed(1)}`);
  writeFileSync(file, rows.join("\n") + "\n");
  session = await launch();
  const owner = await createShop();
  tech = await addMember(owner.organizationId, "technician", "Lorna Logger");
});

afterAll(async () => {
  await session?.close();
});

describe("a long log on a phone (our rule: over 1 MB it is a queued job)", () => {
  it("says the long log is being analysed, follows the job and shows the verdict and the curve", async () => {
    const context = await session.newContext(PHONE);
    const page = await context.newPage();
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await signInThroughPage(page, tech.email, tech.password);
    await page.goto("/vacuum-tests/new", { waitUntil: "networkidle" }); // hydrated: a file picked before it would be lost
    const polled: string[] = [];
    page.on("request", (r) => {
      if (/\/api\/tasks\//.test(r.url())) polled.push(r.url());
    });
    await page.getByLabel("Gauge log file (CSV)").setInputFiles(file);
    const wait = page.getByTestId("analysis-wait");
    await wait.waitFor({ state: "visible", timeout: 60_000 });
    expect(await wait.textContent()).toContain("logger-30h.csv is a long log");
    await page.getByTestId("upload-result").waitFor({ state: "visible", timeout: 90_000 });
    expect((await page.getByTestId("verdict-headline").textContent())?.length).toBeGreaterThan(3);
    await page.getByTestId("decay-chart").locator("canvas").waitFor({ state: "visible", timeout: 30_000 });
    expect(polled.length).toBeGreaterThan(0);
    const list = await page.request.get(`/api/vacuum-tests?technicianId=${tech.userId}&limit=5`);
    expect(((await list.json()) as { items: unknown[] }).items).toHaveLength(1);
    expect(errors).toEqual([]);
    await context.close();
  }, 180_000);
});
