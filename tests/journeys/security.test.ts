/**
 * Security headers on every response the browser receives (OWASP ASVS 4.0.3 V14.4.1–V14.4.7;
 * the Next.js 16 CSP guide's nonce per request), a page that cannot be framed, and the practice
 * gate on a system's page as an apprentice sees it. CSP violations on any page fail the file
 * (tests/journeys/browser.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Response as PwResponse } from "playwright-core";
import { db } from "@/db/client";
import { createSite, createSystem } from "@/db/queries/records";
import { createTestShare } from "@/db/queries/visibility";
import { addMember, createShop, PASSWORD } from "../helpers/members";
import { seedTest } from "../helpers/seed-test";
import { APP_URL, DESKTOP, launch, signInThroughPage, type Session } from "./browser";

let s: Session;
beforeAll(async () => {
  s = await launch();
});
afterAll(async () => {
  await s?.close();
});

const EVERY_RESPONSE = ["x-content-type-options", "x-frame-options", "referrer-policy", "permissions-policy", "content-security-policy", "cross-origin-opener-policy"];

describe("security headers (OWASP ASVS 4.0.3 V14.4)", () => {
  it("are on every response from Riseline while a member signs in, uploads and reads a test with its chart", async () => {
    const owner = await createShop("Header Check HVAC");
    const ctx = await s.newContext(DESKTOP);
    const page = await ctx.newPage();
    const seen: PwResponse[] = [];
    page.on("response", (r) => {
      if (r.url().startsWith(APP_URL)) seen.push(r);
    });
    await signInThroughPage(page, owner.email, PASSWORD);
    const testId = await seedTest(owner, { verdict: "leak", title: "Header check" });
    await page.goto(`/vacuum-tests/${testId}`);
    await page.locator("canvas").first().waitFor({ timeout: 60_000 }); // chart.js drew under the CSP
    await page.goto("/records");
    await page.goto("/no-such-page");
    await page.waitForLoadState("networkidle");

    const kinds = new Set(seen.map((r) => (r.url().includes("/_next/static/") ? "static" : r.url().includes("/api/") ? "api" : "page")));
    expect([...kinds].sort()).toEqual(["api", "page", "static"]);
    const missing: string[] = [];
    for (const r of seen) {
      const h = await r.allHeaders();
      for (const name of EVERY_RESPONSE) if (!h[name]) missing.push(`${r.status()} ${r.url()}: ${name}`);
      if (h["x-content-type-options"] && h["x-content-type-options"] !== "nosniff") missing.push(`${r.url()}: nosniff`);
      if (!/frame-ancestors 'none'/.test(h["content-security-policy"] ?? "")) missing.push(`${r.url()}: frame-ancestors`);
    }
    expect(missing).toEqual([]);
    await ctx.close();
  });

  it("gives each page load its own nonce (strict-dynamic), and API answers a policy that loads nothing", async () => {
    const a = await fetch(`${APP_URL}/sign-in`);
    const b = await fetch(`${APP_URL}/sign-in`);
    const nonce = (r: Response) => /'nonce-([^']+)'/.exec(r.headers.get("content-security-policy") ?? "")?.[1];
    expect(nonce(a)).toBeTruthy();
    expect(nonce(a)).not.toBe(nonce(b));
    expect(a.headers.get("content-security-policy")).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic'/);
    expect(await a.text()).toContain(`nonce="${nonce(a)}"`);
    const api = await fetch(`${APP_URL}/api/health`);
    expect(api.headers.get("content-security-policy")).toMatch(/^default-src 'none'/);
    expect(api.headers.get("strict-transport-security")).toBeNull(); // HSTS in production only
  });

  it("cannot be framed by another page (frame-ancestors 'none', X-Frame-Options: DENY)", async () => {
    const ctx = await s.newContext(DESKTOP);
    const page = await ctx.newPage();
    await page.setContent(`<iframe id="f" src="${APP_URL}/sign-in" width="400" height="300"></iframe>`);
    await page.waitForTimeout(1500);
    const frame = page.frames().find((f) => f !== page.mainFrame());
    const text = frame ? await frame.evaluate(() => document.body?.innerText ?? "").catch(() => "") : "";
    expect(text).not.toMatch(/Sign in/);
    // The browser reports the refused framing as a CSP violation: that one is this test's point.
    const framing = s.cspViolations.filter((v) => /frame-ancestors/.test(v));
    expect(framing.length).toBeGreaterThan(0);
    s.cspViolations.splice(0, s.cspViolations.length, ...s.cspViolations.filter((v) => !/frame-ancestors/.test(v)));
    await ctx.close();
  });
});

describe("the practice gate on a system's page", () => {
  it("shows an apprentice the uncalled practice test with 'Make your call', not its verdict", async () => {
    const owner = await createShop("Practice Page Cooling");
    const apprentice = await addMember(owner.organizationId, "apprentice", "Avery Apprentice");
    const trainer = await addMember(owner.organizationId, "trainer", "Tess Trainer");
    const site = await createSite(db(), { organizationId: owner.organizationId, name: "Orchard Street", address: null, customerId: null });
    const system = await createSystem(db(), { organizationId: owner.organizationId, siteId: site.id, name: "Orchard heat pump" });
    const testId = await seedTest(trainer, { verdict: "leak", isPractice: true, title: "Practice: orchard", siteId: site.id, systemId: system.id });
    await createTestShare(db(), { organizationId: owner.organizationId, testId, userId: apprentice.userId });

    const ctx = await s.newContext(DESKTOP);
    const page = await ctx.newPage();
    await signInThroughPage(page, apprentice.email, PASSWORD);
    await page.goto(`/records/systems/${system.id}`);
    const row = page.getByTestId("system-tests").getByRole("listitem").filter({ hasText: "Practice: orchard" });
    await expect.poll(() => row.getByRole("link", { name: "Make your call" }).count()).toBe(1);
    expect(await row.textContent()).not.toMatch(/leak/i);
    await ctx.close();
  });
});
