/**
 * Debian's Chromium driven by playwright-core (which gives every launch a fresh, temporary profile).
 * APP_URL is where Riseline runs (scripts/test.sh starts `next start` there).
 */
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { expect } from "vitest";
import { env } from "@/lib/env";

export const APP_URL = env().BETTER_AUTH_URL;

/** A 360 × 740 phone, touch on, as technicians use Riseline in the truck. */
export const PHONE = { viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 };
export const DESKTOP = { viewport: { width: 1280, height: 860 } };

export interface Session {
  browser: Browser;
  newContext: (opts?: Parameters<Browser["newContext"]>[0]) => Promise<BrowserContext>;
  /** Closes the browser; throws if any page met a Content-Security-Policy violation meanwhile. */
  close: () => Promise<void>;
  /** What the browser refused under the Content-Security-Policy so far, page by page. */
  cspViolations: string[];
}

/**
 * Every page of every context reports what the CSP blocked: Chromium logs each refusal to the
 * console ("Refused to … because it violates the following Content Security Policy directive").
 * The journeys then prove the app — charts included — works under the policy (proxy.ts).
 */
function watchCsp(context: BrowserContext, violations: string[]): BrowserContext {
  const watch = (page: Page) =>
    page.on("console", (msg) => {
      const text = msg.text();
      if (/Content Security Policy|Content-Security-Policy/i.test(text)) violations.push(`${page.url()}: ${text.slice(0, 300)}`);
    });
  context.pages().forEach(watch);
  context.on("page", watch);
  return context;
}

export async function launch(): Promise<Session> {
  const browser = await chromium.launch({
    executablePath: "/usr/bin/chromium",
    args: [
      "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
      "--disable-background-networking", "--disable-component-update", "--disable-sync",
    ],
  });
  const cspViolations: string[] = [];
  return {
    browser,
    cspViolations,
    newContext: async (opts) => watchCsp(await browser.newContext({ baseURL: APP_URL, ...opts }), cspViolations),
    close: async () => {
      await browser.close();
      if (cspViolations.length) throw new Error(`Content-Security-Policy violations:\n${cspViolations.join("\n")}`);
    },
  };
}

/** Signs in through the real sign-in page. */
export async function signInThroughPage(page: Page, email: string, password: string): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/home/);
}

/**
 * On the new-test page: the "Typed readings" tab, "Minutes since isolation", and the readings typed
 * with Enter between rows (Enter moves the focus to the next row's microns cell on the next frame,
 * so each value is typed only once it is there).
 */
export async function typeMinuteReadings(page: Page, readings: number[]): Promise<void> {
  await page.getByRole("tab", { name: "Typed readings" }).click();
  await page.getByRole("radio", { name: "Minutes since isolation" }).check({ force: true });
  await page.getByLabel("Row 1 microns").fill(String(readings[0]));
  for (const [i, v] of readings.slice(1).entries()) {
    await page.keyboard.press("Enter");
    const next = page.getByLabel(`Row ${i + 2} microns`);
    await expect.poll(() => next.evaluate((el) => el === document.activeElement)).toBe(true);
    await page.keyboard.type(String(v));
  }
}
