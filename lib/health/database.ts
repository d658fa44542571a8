/**
 * Whether PostgreSQL answers, within a bound (a frozen server never answers a query by itself).
 * Used by GET /api/health and by the proxy before a page is rendered, so a database outage is a
 * 503 with a plain explanation on pages too, never Next.js's 500 (RFC 9110 §15.6.4: 503 for a
 * temporary overload or outage, with Retry-After).
 */
import { sql } from "drizzle-orm";
import { db } from "@/db/client";

export const CHECK_TIMEOUT_MS = 2000;

export async function databaseReachable(timeoutMs = CHECK_TIMEOUT_MS): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  try {
    const timeout = new Promise<never>((_, reject) => (timer = setTimeout(() => reject(new Error("timeout")), timeoutMs)));
    await Promise.race([db().execute(sql`select 1`), timeout]);
    return true;
  } catch {
    return false;
  } finally {
    clearTimeout(timer);
  }
}

/** A success is trusted for this long before pages ask again (about one ping a second at most). */
const TRUST_MS = 1000;
const state = globalThis as unknown as { rlDbSeenAt?: number };

/** Before a page: the last success if recent, else a fresh ping. Failures are never cached. */
export async function databaseAnswersForPages(now = Date.now()): Promise<boolean> {
  if (state.rlDbSeenAt !== undefined && now - state.rlDbSeenAt < TRUST_MS) return true;
  const ok = await databaseReachable();
  if (ok) state.rlDbSeenAt = Date.now();
  return ok;
}

/** The page shown instead of one that needs the database, while it is away. */
export function outagePage(nonce: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Riseline is catching its breath</title><style nonce="${nonce}">body{font-family:system-ui,sans-serif;max-width:32rem;margin:4rem auto;padding:0 1rem;color:#1f2933}h1{font-size:1.4rem}</style></head><body><h1>Riseline can't reach its records right now</h1><p>The database is not answering. Nothing you saved is lost. This page will work again once it is back; try again in a minute.</p><p>Tests captured on your phone wait there and go when the service answers again.</p></body></html>`;
}
