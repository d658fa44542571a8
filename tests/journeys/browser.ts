/**
 * Debian's Chromium driven by playwright-core (which gives every launch a fresh, temporary profile).
 * APP_URL is where Riseline runs (scripts/test.sh starts `next start` there).
 */
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { env } from "@/lib/env";

export const APP_URL = env().BETTER_AUTH_URL;

/** A 360 × 740 phone, touch on, as technicians use Riseline in the truck. */
export const PHONE = { viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 };
export const DESKTOP = { viewport: { width: 1280, height: 860 } };

export interface Session {
  browser: Browser;
  newContext: (opts?: Parameters<Browser["newContext"]>[0]) => Promise<BrowserContext>;
  close: () => Promise<void>;
}

export async function launch(): Promise<Session> {
  const browser = await chromium.launch({
    executablePath: "/usr/bin/chromium",
    args: [
      "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
      "--disable-background-networking", "--disable-component-update", "--disable-sync",
    ],
  });
  return {
    browser,
    newContext: (opts) => browser.newContext({ baseURL: APP_URL, ...opts }),
    close: () => browser.close(),
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
