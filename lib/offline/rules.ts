/**
 * The outbox's rules, pure (no IndexedDB, no network): what a send's answer means, when the next
 * try is due, whose capture may be sent, and what changed between the phone's provisional verdict
 * and the server's confirmed one. lib/offline/outbox.ts stores, lib/offline/drain.ts sends.
 *
 * Idempotency: a capture's Idempotency-Key is made once, when it is captured, and every try of that
 * capture sends the same key with the same request (IETF draft-ietf-httpapi-idempotency-key-header);
 * the server keeps keys per person with a fingerprint, so a retry after a lost answer never stores a
 * second test.
 */

export type CaptureStatus = "saved" | "sending" | "sent" | "confirmed" | "failed" | "waiting_sign_in";

/** What one try's answer tells the outbox to do next. */
export type SendOutcome =
  | { kind: "sent" }
  | { kind: "retry"; reason: string; retryAfterMs: number | null }
  | { kind: "sign_in"; reason: string }
  | { kind: "failed"; reason: string };

/** First wait after a failed try, and the longest (common practice, no published source). */
export const BACKOFF_FIRST_MS = 2_000;
export const BACKOFF_MAX_MS = 5 * 60_000;

/**
 * Wait before try number `attempts + 1`: exponential back-off, doubling from 2 s and capped at
 * 5 minutes, with "equal jitter" (half fixed, half random) so phones that regain signal together
 * do not all retry in the same second. `random` is injectable for tests (0 ≤ r < 1).
 */
export function backoffMs(attempts: number, random: () => number = Math.random): number {
  const n = Math.max(0, Math.floor(attempts) - 1);
  const ceiling = Math.min(BACKOFF_MAX_MS, BACKOFF_FIRST_MS * 2 ** Math.min(n, 20));
  return Math.round(ceiling / 2 + (ceiling / 2) * random());
}

/** Retry-After in seconds or as an HTTP date (RFC 9110 §10.2.3), as milliseconds from `now`; null when absent or unreadable. */
export function retryAfterMs(header: string | null, now: number): number | null {
  if (!header) return null;
  const s = header.trim();
  if (/^\d+$/.test(s)) return Number(s) * 1000;
  const at = Date.parse(s);
  return Number.isFinite(at) ? Math.max(0, at - now) : null;
}

const RETRY_STATUSES = new Set([0, 408, 425, 429, 500, 502, 503, 504]);

/**
 * The meaning of an HTTP answer to a capture's POST. `status` 0 is no answer at all (offline, reset).
 * A 409 is the same key still being worked on by an earlier try: wait and ask again with the same key.
 * 401 waits for sign-in; any other 4xx is the capture's own problem and is not retried by itself.
 */
export function outcomeOf(status: number, message: string | null, retryAfter: number | null = null): SendOutcome {
  if (status >= 200 && status < 300) return { kind: "sent" };
  if (status === 401) return { kind: "sign_in", reason: "Your session ended. Sign in and the tests on this phone are sent." };
  if (status === 409) return { kind: "retry", reason: message ?? "Riseline is still storing an earlier try.", retryAfterMs: retryAfter };
  if (RETRY_STATUSES.has(status))
    return { kind: "retry", reason: status === 0 ? "No signal." : (message ?? `Riseline could not store it just now (${status}).`), retryAfterMs: retryAfter };
  return { kind: "failed", reason: message ?? `Riseline refused it (${status}).` };
}

/** When the next try may start, after an outcome; null when no automatic try follows. */
export function nextTryAt(outcome: SendOutcome, attempts: number, now: number, random: () => number = Math.random): number | null {
  if (outcome.kind !== "retry") return null;
  const wait = Math.max(backoffMs(attempts, random), outcome.retryAfterMs ?? 0);
  return now + Math.min(wait, BACKOFF_MAX_MS);
}

export interface OutboxEntryState {
  userId: string;
  status: CaptureStatus;
  nextTryAt: number;
}

/** Due for an automatic try: still unsent, its time has come, and it belongs to whoever is signed in. */
export function isDue(c: OutboxEntryState, signedInUserId: string | null, now: number): boolean {
  if (!mayBeSentBy(c, signedInUserId)) return false;
  return (c.status === "saved" || c.status === "waiting_sign_in" || c.status === "sending") && c.nextTryAt <= now;
}

/** A capture is only ever sent under the account that captured it. */
export function mayBeSentBy(c: { userId: string }, signedInUserId: string | null): boolean {
  return signedInUserId !== null && c.userId === signedInUserId;
}

/** Unsent: would be lost if the outbox were cleared now. */
export function isUnsent(c: { status: CaptureStatus }): boolean {
  return c.status !== "sent" && c.status !== "confirmed";
}

/** The parts of a verdict the phone and the server are compared on. */
export interface VerdictSummary {
  verdict: string;
  earlyCall: "pass" | "fail" | null;
  meetsProfile: boolean | null;
  leakRateMicronsPerMinute: number | null;
  engineVersion: string;
}

/** What differs between the phone's provisional verdict and the server's confirmed one, in words; empty when they agree. */
export function whatChanged(phone: VerdictSummary, server: VerdictSummary): string[] {
  const out: string[] = [];
  if (phone.engineVersion !== server.engineVersion)
    out.push(`Engine versions differ: this phone ran ${phone.engineVersion}, Riseline ran ${server.engineVersion}.`);
  if (phone.verdict !== server.verdict) out.push(`Verdict changed from “${phone.verdict}” to “${server.verdict}”.`);
  if (phone.earlyCall !== server.earlyCall) out.push(`Early call changed from ${phone.earlyCall ?? "none"} to ${server.earlyCall ?? "none"}.`);
  if (phone.meetsProfile !== server.meetsProfile)
    out.push(server.meetsProfile ? "The shop’s profile is met after all." : "The shop’s profile is not met (the phone used the profile it last saw).");
  const a = phone.leakRateMicronsPerMinute;
  const b = server.leakRateMicronsPerMinute;
  if (a !== null && b !== null && Math.abs(a - b) > Math.max(0.05, 0.01 * Math.abs(b)))
    out.push(`Leak rate ${a.toFixed(2)} → ${b.toFixed(2)} microns/min.`);
  return out;
}
