/**
 * When a failed e-mail is tried again (our rule; common practice for mail, no published source).
 *
 * Doubling from 5 s (5, 10, 20 s) up to a ceiling of 30 s, each delay shortened by up to 20 % at
 * random so messages that failed together do not all retry in the same instant. The ceiling is the
 * point: while the mail server is down every message is tried at least every 30 s, so each one
 * goes within about half a minute of the server coming back, however long it was away. pg-boss's
 * own exponential retry has no ceiling (its delay keeps doubling), which is why the delivery job
 * schedules its next attempt itself.
 *
 * Automatic tries stop (the message is "dead", shown as "Gave up" on the Mail page) when the
 * receiving side refused the message outright twice (an SMTP 5xx reply: unknown mailbox, policy),
 * or when the row's retry window (a day) has passed.
 */
const FIRST_DELAY_SECONDS = 5;
export const MAX_DELAY_SECONDS = 30;
const JITTER = 0.2;

/** Seconds to wait after the `attempts`-th failed try (1-based). */
export function retryDelaySeconds(attempts: number, random: () => number = Math.random): number {
  const base = Math.min(MAX_DELAY_SECONDS, FIRST_DELAY_SECONDS * 2 ** Math.max(0, attempts - 1));
  return Math.max(1, Math.round(base * (1 - JITTER * random())));
}

/** An SMTP reply that will not change on a retry (5xx), as nodemailer reports it. */
export function isPermanentSmtpFailure(err: unknown): boolean {
  const code = (err as { responseCode?: unknown })?.responseCode;
  return typeof code === "number" && code >= 500 && code < 600;
}

export type NextStep = { kind: "retry"; afterSeconds: number; at: Date } | { kind: "give_up"; why: string };

/** What to do after a failed try: retry later, or give up. */
export function nextStepAfterFailure(p: { attempts: number; retryUntil: Date; permanent: boolean; now: Date; random?: () => number }): NextStep {
  if (p.permanent && p.attempts >= 2) return { kind: "give_up", why: "the receiving server refused it twice" };
  const afterSeconds = retryDelaySeconds(p.attempts, p.random);
  const at = new Date(p.now.getTime() + afterSeconds * 1000);
  if (at > p.retryUntil) return { kind: "give_up", why: "a day of tries went by" };
  return { kind: "retry", afterSeconds, at };
}
