/**
 * Sending the outbox: each due capture of the signed-in person is POSTed to /api/vacuum-tests with the
 * Idempotency-Key it got when captured. Runs in the page (on open, on `online`, on a timer) and in
 * the service worker (on Background Sync); a Web Lock keeps two of them from sending at once.
 */
import type { AnalysisResult } from "@/analysis/decay/types";
import { listAllCaptures, updateCapture, type Capture } from "./outbox";
import { isDue, isUnsent, mayBeSentBy, nextTryAt, outcomeOf, retryAfterMs, whatChanged } from "./rules";
import { summaryOf } from "./summary";

/** A try that has no answer by then counts as no answer (and frees the outbox for the next try). */
const TRY_TIMEOUT_MS = 60_000;
const SESSION_TIMEOUT_MS = 15_000;
/** Ask again this soon when another sender held the outbox or the server did not answer. */
const AGAIN_SOON_MS = 3_000;

/** Who the server says is signed in: their id, null when nobody is, undefined when there is no answer. */
export async function sessionUserId(): Promise<string | null | undefined> {
  try {
    const res = await fetch("/api/auth/get-session", { credentials: "same-origin", headers: { accept: "application/json" }, cache: "no-store", signal: AbortSignal.timeout(SESSION_TIMEOUT_MS) });
    if (!res.ok) return res.status === 401 ? null : undefined;
    const body = (await res.json()) as { user?: { id?: string } } | null;
    return body?.user?.id ?? null;
  } catch {
    return undefined;
  }
}

/** The request of one try; every try of a capture is the same request with the same key. */
export function requestOf(c: Capture): RequestInit {
  const headers: Record<string, string> = { accept: "application/json", "idempotency-key": c.idempotencyKey };
  if (c.source === "file") {
    const form = new FormData();
    form.set("file", c.file as Blob, c.fileName ?? "log.csv");
    for (const [k, v] of Object.entries(c.fields)) form.set(k, String(v));
    return { method: "POST", body: form, headers, credentials: "same-origin" };
  }
  headers["content-type"] = "application/json";
  return { method: "POST", body: JSON.stringify({ readings: c.readings, timeMode: c.timeMode, ...c.fields }), headers, credentials: "same-origin" };
}

type Created = { test: { id: string; title: string }; analysis: AnalysisResult | null } | { task: unknown };

/** One try of one capture; the capture is updated with the outcome. */
async function sendOne(userId: string, c: Capture, now: () => number): Promise<void> {
  await updateCapture(userId, c.id, (x) => ({ ...x, status: "sending", attempts: x.attempts + 1 }));
  let status = 0;
  let message: string | null = null;
  let retryAfter: number | null = null;
  let body: Created | null = null;
  try {
    const res = await fetch("/api/vacuum-tests", { ...requestOf(c), signal: AbortSignal.timeout(TRY_TIMEOUT_MS) });
    status = res.status;
    retryAfter = retryAfterMs(res.headers.get("retry-after"), now());
    const text = await res.text();
    try {
      const json = JSON.parse(text) as Created & { error?: { message?: string } };
      if (res.ok) body = json;
      else message = json.error?.message ?? null;
    } catch {
      message = null;
    }
  } catch {
    status = 0;
  }
  const outcome = outcomeOf(status, message, retryAfter);
  await updateCapture(userId, c.id, (x) => {
    if (outcome.kind === "sent") {
      const base = { ...x, status: "sent" as const, sentAt: now(), lastError: undefined, nextTryAt: Number.MAX_SAFE_INTEGER };
      if (body && "test" in body && body.analysis) {
        const summary = summaryOf(body.analysis);
        const changes = x.provisional ? whatChanged(summaryOf(x.provisional.result), summary) : [];
        return { ...base, status: "confirmed", confirmed: { testId: body.test.id, title: body.test.title, summary, changes } };
      }
      return base;
    }
    if (outcome.kind === "sign_in") return { ...x, status: "waiting_sign_in", lastError: outcome.reason, nextTryAt: now() };
    if (outcome.kind === "failed") return { ...x, status: "failed", lastError: outcome.reason, nextTryAt: Number.MAX_SAFE_INTEGER };
    return { ...x, status: "saved", lastError: outcome.reason, nextTryAt: nextTryAt(outcome, x.attempts, now()) ?? now() };
  });
}

export interface DrainReport {
  sent: number;
  /** Earliest next automatic try, if any capture waits for one. */
  nextAt: number | null;
  signedIn: string | null | undefined;
}

async function withLock<T>(run: () => Promise<T>): Promise<T | null> {
  const locks = (globalThis as { navigator?: { locks?: LockManager } }).navigator?.locks;
  if (!locks) return run();
  return locks.request("riseline-outbox-send", { ifAvailable: true }, async (lock: Lock | null) => (lock ? run() : null));
}

/**
 * Sends every due capture of whoever is signed in, one after another. When another sender (the
 * service worker, another tab) holds the outbox, or the server gave no answer, the report asks for
 * another drain soon, so a missed `online` event never leaves captures waiting.
 */
export async function drainOutbox(now: () => number = Date.now): Promise<DrainReport> {
  const report = await withLock(async () => {
    const all = await listAllCaptures();
    if (!all.some(isUnsent)) return { sent: 0, nextAt: null, signedIn: undefined };
    const who = await sessionUserId();
    if (who === undefined) return { sent: 0, nextAt: now() + AGAIN_SOON_MS, signedIn: who };
    let sent = 0;
    for (const c of all) {
      if (!isUnsent(c)) continue;
      if (!mayBeSentBy(c, who)) {
        // Someone else's capture is never sent under this account; a signed-out phone waits.
        if (who === null && c.status !== "failed") await updateCapture(c.userId, c.id, (x) => ({ ...x, status: "waiting_sign_in", lastError: "Waiting for you to sign in." }));
        continue;
      }
      // A try left "sending" by a closed tab is simply tried again with its key.
      if (who === null || !isDue(c, who, now())) continue;
      await sendOne(who, c, now);
      sent++;
    }
    const left = (await listAllCaptures()).filter((c) => c.userId === who && (c.status === "saved" || c.status === "waiting_sign_in"));
    const nextAt = left.length ? Math.min(...left.map((c) => c.nextTryAt)) : null;
    return { sent, nextAt, signedIn: who };
  });
  return report ?? { sent: 0, nextAt: now() + AGAIN_SOON_MS, signedIn: undefined };
}
