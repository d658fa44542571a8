/**
 * The technician in a basement: the installable app, the outbox on the phone and the provisional
 * verdict, on the production build with the real service worker (public/sw.js from `serwist build`).
 * Real Chromium (playwright-core), real server, database and S3 fake. Timings are printed, not asserted
 * tightly (the 2-second aim is a figure to read; the test allows 20 s on a shared machine).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { BrowserContext, Page } from "playwright-core";
import { APP_URL, launch, PHONE, signInThroughPage, type Session, typeMinuteReadings } from "./browser";
import { addMember, createShop, type TestMember } from "@/tests/helpers/members";
import { simulateLog } from "@/analysis/decay/simulate";

let session: Session;
let tech: TestMember;
let other: TestMember;
const scratch = mkdtempSync(join(tmpdir(), "rl-offline-"));

function logFile(name: string, text: string): string {
  const p = join(scratch, name);
  writeFileSync(p, text);
  return p;
}

// 1-hour logs at 1 Hz (3,600 readings of the hold, plus the pull-down).
const PASS_1H = logFile("basement-pass.csv", simulateLog({ scenario: "tight_dry", seed: 31, sampleSeconds: 1, holdMinutes: 60, layout: "iso" }).text);
const LEAK_1H = logFile("crawlspace-leak.csv", simulateLog({ scenario: "leak", seed: 32, sampleSeconds: 1, holdMinutes: 60, layout: "iso" }).text);
const MOIST_1H = logFile("rooftop-moist.csv", simulateLog({ scenario: "moisture", seed: 33, sampleSeconds: 1, holdMinutes: 60, layout: "iso" }).text);
const SAMPLE_PASS = "fixtures/samples/sample-1-iso-microns.csv";

beforeAll(async () => {
  session = await launch();
  const owner = await createShop();
  tech = await addMember(owner.organizationId, "technician", "Basil Basement");
  other = await addMember(owner.organizationId, "technician", "Opal Other");
});

afterAll(async () => {
  await session?.close();
});

/** Signed in, on /vacuum-tests/new, with the service worker controlling the page and the page kept for offline. */
async function readyPhone(): Promise<{ context: BrowserContext; page: Page }> {
  const context = await session.newContext(PHONE);
  const page = await context.newPage();
  if (process.env.OFFLINE_DEBUG) {
    context.on("page", (p) => p.on("console", (m) => console.log("[page]", m.type(), m.text())));
    page.on("console", (m) => console.log("[page]", m.type(), m.text()));
    page.on("pageerror", (e) => console.log("[pageerror]", e.message));
  }
  await signInThroughPage(page, tech.email, tech.password);
  await page.goto("/vacuum-tests/new");
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null, null, { timeout: 60_000 });
  await page.waitForFunction(async () => !!(await caches.match("/vacuum-tests/new")), null, { timeout: 60_000, polling: 250 });
  await page.waitForFunction(() => Object.keys(localStorage).some((k) => k.startsWith("riseline-profile:")), null, { timeout: 30_000 });
  return { context, page };
}

async function myTests(page: Page, who: TestMember = tech): Promise<{ id: string; verdict: string | null; title: string }[]> {
  const res = await page.request.get(`/api/vacuum-tests?technicianId=${who.userId}&limit=50`);
  expect(res.status()).toBe(200);
  return ((await res.json()) as { items: { id: string; verdict: string | null; title: string }[] }).items;
}

/** Captures one file offline; returns the ms until its provisional verdict showed. */
async function captureFile(page: Page, path: string, n: number): Promise<number> {
  await page.getByRole("tab", { name: "Gauge file" }).click();
  const t0 = Date.now();
  await page.getByLabel("Gauge log file (CSV)").setInputFiles(path);
  await page.getByTestId("outbox-item").nth(n).getByTestId("provisional-verdict").waitFor({ timeout: 20_000 });
  return Date.now() - t0;
}

async function captureTyped(page: Page, n: number): Promise<number> {
  const readings = Array.from({ length: 12 }, (_, m) => 300 + 60 * m);
  await typeMinuteReadings(page, readings);
  const t0 = Date.now();
  await page.getByRole("button", { name: "Analyse readings" }).click();
  await page.getByTestId("outbox-item").nth(n).getByTestId("provisional-verdict").waitFor({ timeout: 20_000 });
  return Date.now() - t0;
}

async function provisionalOf(page: Page): Promise<{ key: string; verdict: string; engine: string; ms: number }[]> {
  return page.getByTestId("outbox-item").evaluateAll((els) =>
    els.map((el) => {
      const p = el.querySelector("[data-testid=provisional-verdict]") as HTMLElement | null;
      return { key: el.getAttribute("data-key") ?? "", verdict: p?.dataset.verdict ?? "", engine: p?.dataset.engine ?? "", ms: Number(p?.dataset.ms ?? NaN) };
    }),
  );
}

async function confirmedOf(page: Page): Promise<{ key: string; verdict: string; engine: string; same: boolean }[]> {
  return page.getByTestId("outbox-item").evaluateAll((els) =>
    els.map((el) => {
      const c = el.querySelector("[data-testid=confirmed-verdict]") as HTMLElement | null;
      return { key: el.getAttribute("data-key") ?? "", verdict: c?.dataset.verdict ?? "", engine: c?.dataset.engine ?? "", same: !!el.querySelector("[data-testid=outbox-same]") };
    }),
  );
}

/** Offline: three captures (two files, one typed), the page closed and opened again without signal. */
async function captureThreeOffline(context: BrowserContext, page: Page, files: [string, string]): Promise<{ page: Page; provisional: Awaited<ReturnType<typeof provisionalOf>> }> {
  await context.setOffline(true);
  await page.getByTestId("offline-banner").waitFor();
  const times = [await captureFile(page, files[0], 0), await captureFile(page, files[1], 1), await captureTyped(page, 2)];
  const provisional = await provisionalOf(page);
  console.log(`[offline] provisional verdicts shown after ${times.join(", ")} ms (click to verdict); engine in the worker ${provisional.map((p) => p.ms).join(", ")} ms`);
  expect(provisional.map((p) => p.verdict).every(Boolean)).toBe(true);
  for (const t of times) expect(t).toBeLessThan(20_000);
  await expect.poll(() => page.getByTestId("outbox-status").allTextContents()).toEqual(["Saved on phone", "Saved on phone", "Saved on phone"]);
  await expect.poll(() => page.getByText("On this phone — not yet confirmed").count()).toBe(3);
  expect(await page.getByTestId("storage-used").textContent()).toMatch(/on this phone/);

  // Close the tab and open the app again, still without signal: served by the service worker.
  await page.close();
  const again = await context.newPage();
  await again.goto("/vacuum-tests/new");
  await again.getByTestId("offline-banner").waitFor();
  await expect.poll(() => again.getByTestId("outbox-item").count(), { timeout: 20_000 }).toBe(3);
  expect(await provisionalOf(again)).toEqual(provisional);
  return { page: again, provisional };
}

describe("offline capture on a phone (W3C Service Workers, WHATWG Background Sync draft, IETF draft-ietf-httpapi-idempotency-key-header)", () => {
  it("installable: manifest fields and icons (W3C Web App Manifest), a service worker controlling the page and /vacuum-tests/new starting offline (W3C Service Workers)", async () => {
    const { context, page } = await readyPhone();
    const manifestHref = await page.locator('link[rel="manifest"]').getAttribute("href");
    expect(manifestHref).toBeTruthy();
    const res = await page.request.get(new URL(manifestHref!, APP_URL).toString());
    expect(res.status()).toBe(200);
    const m = (await res.json()) as { name: string; short_name: string; start_url: string; display: string; theme_color: string; background_color: string; icons: { src: string; sizes: string; type: string; purpose?: string }[] };
    expect(m.name).toMatch(/Riseline/);
    expect(m.short_name).toBe("Riseline");
    expect(m.display).toBe("standalone");
    expect(m.start_url).toBe("/vacuum-tests/new");
    expect(m.theme_color).toBe("#0b6e69");
    // Installability as Chromium checks it: a 192 px and a 512 px PNG icon that load as images.
    for (const size of ["192x192", "512x512"]) {
      const icon = m.icons.find((i) => i.sizes === size && i.type === "image/png" && (i.purpose ?? "any").includes("any"));
      expect(icon, size).toBeTruthy();
      const img = await page.request.get(icon!.src);
      expect(img.status()).toBe(200);
      expect(img.headers()["content-type"]).toBe("image/png");
      const body = await img.body();
      expect(body.subarray(1, 4).toString("ascii")).toBe("PNG");
      expect(body.readUInt32BE(16)).toBe(Number(size.split("x")[0]));
    }
    const sw = await page.evaluate(async () => {
      const reg = await navigator.serviceWorker.ready;
      return { scope: reg.scope, active: reg.active?.state, controller: navigator.serviceWorker.controller?.scriptURL ?? null };
    });
    expect(sw.active).toBe("activated");
    expect(sw.controller).toMatch(/\/sw\.js$/);
    expect(sw.scope).toBe(`${new URL(APP_URL).origin}/`);
    // The engine's chunk is precached but not loaded by the page until a test is captured offline.
    const before = await page.evaluate(() => performance.getEntriesByType("resource").map((e) => e.name).filter((n) => /worker/i.test(n)));
    expect(before).toEqual([]);

    await context.setOffline(true);
    const offlinePage = await context.newPage();
    const t0 = Date.now();
    await offlinePage.goto("/vacuum-tests/new");
    await offlinePage.getByRole("heading", { name: "New test" }).waitFor();
    await offlinePage.getByTestId("offline-banner").waitFor();
    await offlinePage.getByRole("tab", { name: "Typed readings" }).click();
    await offlinePage.getByLabel("Row 1 microns").waitFor();
    console.log(`[offline] /vacuum-tests/new started offline in ${Date.now() - t0} ms`);
    await context.close();
  });

  it("three tests captured offline (2 files, 1 typed) get a provisional verdict each, survive a closed tab, and arrive exactly once with the same verdicts when the signal returns", async () => {
    const { context, page } = await readyPhone();
    const before = (await myTests(page)).length;
    const { page: again, provisional } = await captureThreeOffline(context, page, [PASS_1H, LEAK_1H]);
    expect(provisional.map((p) => p.verdict).slice(0, 2)).toEqual(["pass", "leak"]);

    await context.setOffline(false);
    await expect.poll(() => again.getByTestId("outbox-status").allTextContents(), { timeout: 60_000 }).toEqual(["Confirmed", "Confirmed", "Confirmed"]);
    const confirmed = await confirmedOf(again);
    // Same engine on the phone (bundled into the worker) and on the server: same verdicts, nothing changed.
    expect(confirmed.map((c) => c.verdict)).toEqual(provisional.map((p) => p.verdict));
    expect(confirmed.map((c) => c.engine)).toEqual(provisional.map((p) => p.engine));
    expect(confirmed.every((c) => c.same)).toBe(true);
    const after = await myTests(again);
    expect(after.length - before).toBe(3);
    await context.close();
  });

  it("with the server answering 503 after storing (the answer lost) and before, each capture still arrives exactly once (IETF draft-ietf-httpapi-idempotency-key-header)", async () => {
    const { context, page } = await readyPhone();
    const before = (await myTests(page)).length;
    let answered503 = 0;
    let reachedServer = 0;
    const keys: string[] = [];
    await context.route("**/api/vacuum-tests", async (route) => {
      if (route.request().method() !== "POST") return route.continue();
      keys.push(route.request().headers()["idempotency-key"] ?? "");
      if (answered503 < 2) {
        // Stored by the server, but the phone hears 503: it must try again with the same key.
        answered503++;
        reachedServer++;
        await route.fetch();
        return route.fulfill({ status: 503, headers: { "retry-after": "1", "content-type": "application/json" }, body: JSON.stringify({ error: { code: "unavailable", message: "Riseline could not store this just now." } }) });
      }
      if (answered503 < 4) {
        // Not reaching the server at all.
        answered503++;
        return route.fulfill({ status: 503, headers: { "retry-after": "1", "content-type": "application/json" }, body: JSON.stringify({ error: { code: "unavailable", message: "Riseline could not store this just now." } }) });
      }
      reachedServer++;
      return route.continue();
    });
    const { page: again, provisional } = await captureThreeOffline(context, page, [SAMPLE_PASS, MOIST_1H]);
    await context.setOffline(false);
    await expect.poll(() => again.getByTestId("outbox-status").allTextContents(), { timeout: 90_000 }).toEqual(["Confirmed", "Confirmed", "Confirmed"]);
    const confirmed = await confirmedOf(again);
    expect(confirmed.map((c) => c.verdict)).toEqual(provisional.map((p) => p.verdict));
    expect(answered503).toBe(4);
    console.log(`[offline] 503 round: ${keys.length} POSTs for 3 captures, ${reachedServer} reached the server`);
    // Every try of a capture carried that capture's key.
    expect(new Set(keys)).toEqual(new Set(provisional.map((p) => p.key)));
    const after = await myTests(again);
    expect(after.length - before).toBe(3);
    await context.close();
  });

  it("a capture waits while the session has ended, is never sent under another person's account, and goes once its own person signs in again", async () => {
    const { context, page } = await readyPhone();
    const before = (await myTests(page)).length;
    await context.setOffline(true);
    await page.getByTestId("offline-banner").waitFor();
    await captureFile(page, LEAK_1H, 0);
    // The session ends while the phone is offline (the cookie is gone), then the signal returns.
    await context.clearCookies();
    await context.setOffline(false);
    await page.evaluate(() => window.dispatchEvent(new Event("online")));
    await expect.poll(() => page.getByTestId("outbox-status").allTextContents(), { timeout: 30_000 }).toEqual(["Waiting for sign-in"]);

    // Someone else signs in on this phone: the capture is neither shown nor sent under their account.
    await signInThroughPage(page, other.email, other.password);
    await page.goto("/vacuum-tests/new");
    await page.getByRole("heading", { name: "New test" }).waitFor();
    await page.waitForTimeout(1500);
    expect(await page.getByTestId("outbox-item").count()).toBe(0);
    expect((await myTests(page, other)).length).toBe(0);

    // Its own person signs in again: it is sent, once.
    await page.request.post("/api/auth/sign-out", { headers: { origin: new URL(APP_URL).origin }, data: {} });
    await context.clearCookies();
    await signInThroughPage(page, tech.email, tech.password);
    await page.goto("/vacuum-tests/new");
    await expect.poll(() => page.getByTestId("outbox-status").allTextContents(), { timeout: 30_000 }).toEqual(["Confirmed"]);
    expect((await myTests(page)).length - before).toBe(1);
    expect((await myTests(page, other)).length).toBe(0);
    await context.close();
  });

  it("with the app closed, the service worker sends the outbox by Background Sync once the signal returns (WHATWG Background Sync draft)", async () => {
    const { context, page } = await readyPhone();
    const before = (await myTests(page)).length;
    await context.setOffline(true);
    await page.getByTestId("offline-banner").waitFor();
    await captureFile(page, PASS_1H, 0);
    await page.close();
    await context.setOffline(false);
    const count = async () => {
      const res = await context.request.get(`/api/vacuum-tests?technicianId=${tech.userId}&limit=50`);
      return ((await res.json()) as { items: unknown[] }).items.length;
    };
    await expect.poll(count, { timeout: 90_000, interval: 1000 }).toBe(before + 1);
    await context.close();
  });

  it("a log nobody can read says so on the phone, fails with the server's reason when sent (no retry by itself), and can be discarded", async () => {
    const { context, page } = await readyPhone();
    const before = (await myTests(page)).length;
    await context.setOffline(true);
    await page.getByTestId("offline-banner").waitFor();
    await page.getByLabel("Gauge log file (CSV)").setInputFiles("fixtures/bad/bad-time.csv");
    await page.getByTestId("provisional-error").waitFor({ timeout: 20_000 });
    expect(await page.getByTestId("provisional-error").textContent()).toMatch(/line/i);
    await context.setOffline(false);
    await expect.poll(() => page.getByTestId("outbox-status").allTextContents(), { timeout: 30_000 }).toEqual(["Not sent"]);
    expect(await page.getByTestId("outbox-reason").textContent()).toMatch(/line/i);
    await page.getByRole("button", { name: "Send now" }).waitFor();
    page.once("dialog", (d) => void d.accept());
    await page.getByRole("button", { name: "Discard" }).click();
    await expect.poll(() => page.getByTestId("outbox-item").count()).toBe(0);
    expect((await myTests(page)).length).toBe(before);
    await context.close();
  });

  it("sign-out warns about unsent tests and clears the phone's outbox and the page kept for offline use", async () => {
    const { context, page } = await readyPhone();
    await context.setOffline(true);
    await captureFile(page, PASS_1H, 0);
    await context.setOffline(false);
    // Stop it being sent before signing out: the server refuses for now.
    await context.route("**/api/vacuum-tests", (route) => (route.request().method() === "POST" ? route.fulfill({ status: 503, body: "{}" }) : route.continue()));
    let warned = "";
    page.once("dialog", (d) => {
      warned = d.message();
      void d.accept();
    });
    // The phone keeps sign-out in its menu sheet; the desktop side bar has the same button.
    await page.getByTestId("sign-out").first().evaluate((el: HTMLElement) => el.click());
    await page.waitForURL(/\/sign-in/);
    expect(warned).toMatch(/not sent yet/);
    const left = await page.evaluate(
      () =>
        new Promise<number>((resolve) => {
          const req = indexedDB.open("riseline-outbox");
          req.onsuccess = () => {
            const tx = req.result.transaction("captures", "readonly");
            const c = tx.objectStore("captures").count();
            c.onsuccess = () => resolve(c.result);
          };
          req.onerror = () => resolve(-1);
        }),
    );
    expect(left).toBe(0);
    expect(await page.evaluate(async () => !!(await caches.match("/vacuum-tests/new")))).toBe(false);
    await context.close();
  });
});
