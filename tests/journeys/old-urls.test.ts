/**
 * Saved links and scripts from before the vacuum decay test moved to /vacuum-tests: a page address
 * redirects permanently (RFC 9110 §15.4.9, 308), an API address answers as an alias of the new
 * one — with the same session, same-origin (OWASP ASVS 4.0.3 V4.2.2) and CSP rules (next.config.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createShop, PASSWORD, type TestMember } from "../helpers/members";
import { seedTest } from "../helpers/seed-test";
import { APP_URL, DESKTOP, launch, signInThroughPage, type Session } from "./browser";

let s: Session;
let owner: TestMember;
let testId: string;
beforeAll(async () => {
  s = await launch();
  owner = await createShop("Old Links HVAC");
  testId = await seedTest(owner, { verdict: "leak", title: "Old link check" });
});
afterAll(async () => {
  await s?.close();
});

const asOwner = (init: RequestInit = {}) => ({ ...init, headers: { cookie: owner.cookie, ...(init.headers as Record<string, string>) } });

describe("addresses from before /vacuum-tests", () => {
  it("an old page address redirects permanently (308, RFC 9110 §15.4.9) to the same page, query kept, and the page opens", async () => {
    const res = await fetch(`${APP_URL}/tests/${testId}?analysis=x`, { redirect: "manual", ...asOwner() });
    expect(res.status).toBe(308);
    expect(new URL(res.headers.get("location")!, APP_URL).pathname + new URL(res.headers.get("location")!, APP_URL).search).toBe(`/vacuum-tests/${testId}?analysis=x`);
    const list = await fetch(`${APP_URL}/tests`, { redirect: "manual", ...asOwner() });
    expect(list.status).toBe(308);
    expect(new URL(list.headers.get("location")!, APP_URL).pathname).toBe("/vacuum-tests");

    const ctx = await s.newContext(DESKTOP);
    const page = await ctx.newPage();
    await signInThroughPage(page, owner.email, PASSWORD);
    await page.goto(`/tests/${testId}`);
    await page.waitForURL(new RegExp(`/vacuum-tests/${testId}$`));
    await expect.poll(() => page.getByText("Old link check").first().isVisible(), { timeout: 60_000 }).toBe(true);
    await ctx.close();
  });

  it("an old API address answers like the new one, for reads and writes, without a redirect", async () => {
    const oldRead = await fetch(`${APP_URL}/api/tests/${testId}`, { redirect: "manual", ...asOwner() });
    expect(oldRead.status).toBe(200);
    const newRead = await fetch(`${APP_URL}/api/vacuum-tests/${testId}`, asOwner());
    expect((await oldRead.json()).test).toEqual((await newRead.json()).test);

    const list = await fetch(`${APP_URL}/api/tests?limit=5`, asOwner());
    expect(list.status).toBe(200);
    expect((await list.json()).items.map((i: { id: string }) => i.id)).toContain(testId);

    const patch = await fetch(`${APP_URL}/api/tests/${testId}`, asOwner({ method: "PATCH", headers: { origin: APP_URL, "content-type": "application/json" }, body: JSON.stringify({ customerNote: "Saved through the old address" }) }));
    expect(patch.status).toBe(200);
    const after = await (await fetch(`${APP_URL}/api/vacuum-tests/${testId}`, asOwner())).json();
    expect(after.test.customerNote).toBe("Saved through the old address");
  });

  it("the old API address keeps the same-origin check (OWASP ASVS 4.0.3 V4.2.2), sign-in check and non-page CSP", async () => {
    const forged = await fetch(`${APP_URL}/api/tests/${testId}`, asOwner({ method: "PATCH", headers: { origin: "https://attacker.example", "content-type": "application/json" }, body: JSON.stringify({ customerNote: "forged" }) }));
    expect(forged.status).toBe(403);
    const anonymous = await fetch(`${APP_URL}/api/tests/${testId}`);
    expect(anonymous.status).toBe(401);
    const read = await fetch(`${APP_URL}/api/tests/${testId}`, asOwner());
    expect(read.headers.get("content-security-policy")).toContain("default-src 'none'");
    const pdf = await fetch(`${APP_URL}/api/tests/${testId}/report`, asOwner());
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toContain("application/pdf");
    expect(pdf.headers.get("content-security-policy")).toContain("object-src 'self'");
  });
});
