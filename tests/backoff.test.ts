/** When a failed e-mail is tried again (lib/notify/backoff.ts; our rule, common practice for mail, no published source). */
import { describe, expect, it } from "vitest";
import { isPermanentSmtpFailure, MAX_DELAY_SECONDS, nextStepAfterFailure, retryDelaySeconds } from "@/lib/notify/backoff";

describe("mail retry back-off (our rule, no published source)", () => {
  it("doubles from 5 s to a ceiling of 30 s, shortened by at most 20 % at random", () => {
    expect([1, 2, 3, 4, 5, 50].map((n) => retryDelaySeconds(n, () => 0))).toEqual([5, 10, 20, 30, 30, 30]);
    expect([1, 2, 3, 4].map((n) => retryDelaySeconds(n, () => 0.999))).toEqual([4, 8, 16, 24]);
    for (let n = 1; n < 200; n++) expect(retryDelaySeconds(n)).toBeLessThanOrEqual(MAX_DELAY_SECONDS);
  });

  it("while the mail server is away for a day every message is tried at least every 30 s, then given up", () => {
    const queued = new Date("2026-03-01T08:00:00Z");
    const retryUntil = new Date(queued.getTime() + 24 * 3600_000);
    let now = queued;
    let attempts = 0;
    let longestGapSeconds = 0;
    for (;;) {
      attempts++;
      const step = nextStepAfterFailure({ attempts, retryUntil, permanent: false, now });
      if (step.kind === "give_up") {
        expect(step.why).toBe("a day of tries went by");
        break;
      }
      longestGapSeconds = Math.max(longestGapSeconds, step.afterSeconds);
      now = step.at;
    }
    expect(longestGapSeconds).toBeLessThanOrEqual(30);
    expect(now.getTime()).toBeGreaterThan(retryUntil.getTime() - 31_000);
    expect(attempts).toBeGreaterThan(2800); // a day at 24–30 s a try
  });

  it("gives up on the second refusal of the message itself (SMTP 5xx), never on the first, and never on a refused connection", () => {
    const p = { retryUntil: new Date(Date.now() + 3600_000), now: new Date() };
    const refused = Object.assign(new Error("550 5.1.1 user unknown"), { responseCode: 550 });
    const busy = Object.assign(new Error("451 try again later"), { responseCode: 451 });
    const down = Object.assign(new Error("connect ECONNREFUSED"), { code: "ECONNREFUSED" });
    expect([refused, busy, down].map(isPermanentSmtpFailure)).toEqual([true, false, false]);
    expect(nextStepAfterFailure({ ...p, attempts: 1, permanent: true }).kind).toBe("retry");
    expect(nextStepAfterFailure({ ...p, attempts: 2, permanent: true })).toEqual({ kind: "give_up", why: "the receiving server refused it twice" });
    expect(nextStepAfterFailure({ ...p, attempts: 2, permanent: false }).kind).toBe("retry");
  });
});
