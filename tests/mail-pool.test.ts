/**
 * Outgoing mail shares pooled SMTP connections (lib/mail.ts, our choice): a burst goes over at most
 * two connections instead of one per message, and an idle connection is closed so a process can
 * exit. Real SMTP catcher (scripts/fakes.mjs records the connection of every message).
 */
import { randomUUID } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { closeMail, composeMail, sendMail } from "@/lib/mail";
import { readMailbox } from "./helpers/mailbox";

afterAll(() => closeMail());

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe("pooled SMTP connections (lib/mail.ts)", () => {
  it("sends a burst of five over at most two connections, and a new one after the idle close", async () => {
    const to = `pool-${randomUUID().slice(0, 8)}@example.test`;
    const mail = (n: number) => composeMail({ to, subject: `Pool check ${n}`, paragraphs: [`Message ${n} of the burst.`] });
    await Promise.all([1, 2, 3, 4, 5].map((n) => sendMail(mail(n))));
    const burst = readMailbox().filter((m) => m.to.includes(to));
    expect(burst.map((m) => m.subject).sort()).toEqual([1, 2, 3, 4, 5].map((n) => `Pool check ${n}`));
    const burstSessions = new Set(burst.map((m) => m.sessionId));
    expect(burstSessions.size).toBeGreaterThanOrEqual(1);
    expect(burstSessions.size).toBeLessThanOrEqual(2);

    await sleep(2200); // longer than the 1.5 s idle close
    await sendMail(mail(6));
    const later = readMailbox().find((m) => m.to.includes(to) && m.subject === "Pool check 6");
    expect(later?.sessionId).toBeTruthy();
    expect(burstSessions.has(later!.sessionId)).toBe(false);
  });
});
