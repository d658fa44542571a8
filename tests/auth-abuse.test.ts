/**
 * Password guessing: better-auth's rate limit per client address, kept in PostgreSQL (so every app
 * server counts the same requests), and the per-account lockout with back-off (lib/lockout.ts).
 * OWASP ASVS 4.0.3 V2.2.1 (anti-automation: soft lockout, rate limiting) and the OWASP
 * Authentication Cheat Sheet ("Account Lockout"). The address is the TCP peer, which Next.js puts
 * in X-Forwarded-For once proxy.ts has moved a client's own header aside; these requests reach the
 * route without Next.js, so X-Forwarded-For here plays the peer.
 */
process.env.AUTH_RATE_LIMIT = "on";

import { afterAll, describe, expect, it } from "vitest";
import { eq, like, sql } from "drizzle-orm";
import { POST as authPost } from "@/app/api/auth/[...all]/route";
import { db } from "@/db/client";
import { rateLimit, signInFailures } from "@/db/schema";
import { LOCKOUT_RULE } from "@/lib/lockout";
import { appRequest, createShop, PASSWORD } from "./helpers/members";

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

let peer = 0;
/** A new client address each call (TEST-NET-2, RFC 5737), unless one is given. */
const nextPeer = () => `198.51.100.${(peer++ % 250) + 1}`;

function signIn(email: string, password: string, from = nextPeer()) {
  return authPost(
    appRequest("/api/auth/sign-in/email", { method: "POST", body: JSON.stringify({ email, password }), headers: { "content-type": "application/json", "x-forwarded-for": from } }),
  );
}

describe("password guessing", () => {
  it("rate-limits one client address on sign-in (429 on the 4th try within 10 s) and keeps the count in PostgreSQL", async () => {
    const owner = await createShop();
    const from = "203.0.113.41";
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await signIn(owner.email, "wrong-password-here", from)).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
    const rows = await db().select().from(rateLimit).where(like(rateLimit.key, `${from}|%`));
    expect(rows.map((r) => r.key)).toContain(`${from}|/sign-in/email`);
    // Another address is not held back by this one's count.
    expect((await signIn(owner.email, PASSWORD, "203.0.113.42")).status).toBe(200);
  });

  it("locks the account after 5 wrong passwords from anywhere, refuses even the right one while locked, and says how long", async () => {
    const owner = await createShop();
    for (let i = 0; i < LOCKOUT_RULE.freeFailures; i++) expect((await signIn(owner.email, `wrong-${i}-password`)).status).toBe(401);
    expect((await signIn(owner.email, "one-wrong-too-many")).status).toBe(401); // this one locks
    const locked = await signIn(owner.email, PASSWORD);
    expect(locked.status).toBe(429);
    const body = await locked.json();
    expect(body.code).toBe("ACCOUNT_LOCKED");
    expect(body.message).toMatch(/Wait \d+ seconds/);
    const wait = Number(locked.headers.get("retry-after"));
    expect(wait).toBeGreaterThan(0);
    expect(wait).toBeLessThanOrEqual(LOCKOUT_RULE.baseLockSeconds);
  });

  it("doubles the lock with each further failure (back-off) up to 15 minutes", async () => {
    const owner = await createShop();
    const email = owner.email.toLowerCase();
    const lockSeconds: number[] = [];
    for (let i = 0; i < LOCKOUT_RULE.freeFailures + 3; i++) {
      // Let each lock lapse so the attempt reaches the password check (as a patient guesser would).
      await db().update(signInFailures).set({ lockedUntil: sql`now() - interval '1 second'` }).where(eq(signInFailures.email, email));
      await signIn(email, `wrong-${i}-password`);
      const [row] = await db().select().from(signInFailures).where(eq(signInFailures.email, email));
      lockSeconds.push(row.lockedUntil ? Math.round((row.lockedUntil.getTime() - Date.now()) / 1000) : 0);
    }
    expect(lockSeconds.slice(0, LOCKOUT_RULE.freeFailures)).toEqual([0, 0, 0, 0, 0]);
    const [a, b, c] = lockSeconds.slice(LOCKOUT_RULE.freeFailures);
    // Seconds left, read just after each request: a busy machine shaves a few off each.
    expect(a).toBeGreaterThanOrEqual(LOCKOUT_RULE.baseLockSeconds - 5);
    expect(Math.abs(b - 2 * LOCKOUT_RULE.baseLockSeconds)).toBeLessThanOrEqual(6);
    expect(Math.abs(c - 4 * LOCKOUT_RULE.baseLockSeconds)).toBeLessThanOrEqual(8);
  });

  it("clears the count on a right password once the lock has passed", async () => {
    const owner = await createShop();
    const email = owner.email.toLowerCase();
    for (let i = 0; i < 3; i++) await signIn(email, `wrong-${i}-password`);
    expect((await signIn(email, PASSWORD)).status).toBe(200);
    expect(await db().select().from(signInFailures).where(eq(signInFailures.email, email))).toEqual([]);
  });

  it("answers an address without an account exactly as one with an account (no enumeration)", async () => {
    const nobody = `nobody-${Date.now()}@example.test`;
    const statuses: number[] = [];
    for (let i = 0; i < LOCKOUT_RULE.freeFailures + 2; i++) statuses.push((await signIn(nobody, `guess-${i}-password`)).status);
    expect(statuses).toEqual([401, 401, 401, 401, 401, 401, 429]);
  });
});
