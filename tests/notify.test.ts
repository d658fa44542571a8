/**
 * E-mail through the outbox and its delivery job (our product rules: the change never depends on
 * the mail; a failed mail is tried again by itself). Real PostgreSQL, real pg-boss, the real SMTP
 * catcher, and real SMTP failures: a port nothing listens on, and a server that refuses the address.
 */
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { eq, inArray } from "drizzle-orm";
import nodemailer from "nodemailer";
import { SMTPServer } from "smtp-server";
import type { AddressInfo } from "node:net";
import { db } from "@/db/client";
import { mailOutbox, vacuumTests } from "@/db/schema";
import { POST as reviewPost } from "@/app/api/vacuum-tests/[id]/review/route";
import { POST as resendPost } from "@/app/api/outbox/resend/route";
import { GET as outboxGet } from "@/app/api/outbox/route";
import { setMailSenderForTests, type MailSender } from "@/lib/notify/transport";
import { queueMail } from "@/lib/notify/outbox";
import { deliverOutboxRow, messageIdOf } from "@/lib/notify/delivery";
import { jobSender } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";
import { crewForFile, jsonInit } from "./helpers/crew";
import { jobRunnerForFile, jobStates } from "./helpers/jobs";
import { appRequest, routeParams } from "./helpers/members";
import { readMailbox, waitForMail } from "./helpers/mailbox";
import { seedTest } from "./helpers/seed-test";

/** A real SMTP client pointed at a port nothing listens on: the connection is refused. */
function deadPortSender(): MailSender {
  const t = nodemailer.createTransport({ host: "127.0.0.1", port: 9, secure: false, ignoreTLS: true, connectionTimeout: 1000 });
  return async (m) => {
    await t.sendMail({ from: "Riseline <no-reply@riseline.test>", ...m });
  };
}

/** A real SMTP server that refuses every recipient with 550 (an unknown mailbox). */
let refusing: SMTPServer;
let refusingPort = 0;
function refusingSender(): MailSender {
  const t = nodemailer.createTransport({ host: "127.0.0.1", port: refusingPort, secure: false, ignoreTLS: true });
  return async (m) => {
    await t.sendMail({ from: "Riseline <no-reply@riseline.test>", ...m });
  };
}

const crew = crewForFile();
jobRunnerForFile();
beforeAll(async () => {
  refusing = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onRcptTo: (_a, _s, cb) => cb(Object.assign(new Error("5.1.1 user unknown"), { responseCode: 550 })),
  });
  await new Promise<void>((r) => refusing.listen(0, "127.0.0.1", () => r()));
  refusingPort = (refusing.server.address() as AddressInfo).port;
});
afterEach(() => setMailSenderForTests(null));
afterAll(() => new Promise<void>((r) => refusing.close(() => r())));

const rowsOf = (testId: string) => db().select().from(mailOutbox).where(eq(mailOutbox.testId, testId));
const rowById = async (id: string) => (await db().select().from(mailOutbox).where(eq(mailOutbox.id, id)))[0];
const queueOne = (to: string, subject: string) =>
  db().transaction((tx) => queueMail(tx, [{ organizationId: crew.owner.organizationId, testId: null, to, subject, text: "x", html: "<p>x</p>" }]));

describe("e-mail through the outbox and its delivery job (product rule: the change never depends on the mail)", () => {
  it("SMTP down: the sign-off stands, the try is recorded with its next one, and the job tries again by itself until the catcher has it", async () => {
    const id = await seedTest(crew.technician, { title: "Basement furnace coil" });
    await reviewPost(appRequest(`/api/vacuum-tests/${id}/review`, jsonInit(crew.technician, { action: "request_review" })), routeParams({ id }));
    setMailSenderForTests(deadPortSender());
    const res = await reviewPost(appRequest(`/api/vacuum-tests/${id}/review`, jsonInit(crew.lead, { action: "sign_off" })), routeParams({ id }));
    expect(res.status).toBe(200);
    const [t] = await db().select({ status: vacuumTests.status }).from(vacuumTests).where(eq(vacuumTests.id, id));
    expect(t.status).toBe("signed_off");
    const signOff = async () => (await rowsOf(id)).find((r) => r.subject.startsWith("Signed off"))!;
    await expect.poll(async () => (await signOff()).status, { timeout: 15_000 }).toBe("failed");
    const failed = await signOff();
    expect(failed.attempts).toBe(1);
    expect(failed.lastError).toMatch(/ECONNREFUSED|connect/i);
    // The next try is 4–5 s away (5 s less up to 20 % at random), and a job waits for it.
    const waitMs = failed.nextAttemptAt!.getTime() - Date.now();
    expect(waitMs).toBeGreaterThan(1000);
    expect(waitMs).toBeLessThanOrEqual(5000);

    const listed = await (await outboxGet(appRequest("/api/outbox?status=failed", { as: crew.lead }))).json();
    const item = listed.mail.find((m: { id: string }) => m.id === failed.id);
    expect(item.nextAttemptAt).toBe(failed.nextAttemptAt!.toISOString());
    expect(JSON.stringify(listed)).not.toContain("text_body");

    setMailSenderForTests(null); // the mail server is back; nobody presses anything
    const mail = await waitForMail(crew.technician.email, /Signed off: Basement furnace coil/, 20_000);
    expect(mail.text).toContain(crew.lead.name);
    await expect.poll(async () => (await signOff()).status, { timeout: 10_000 }).toBe("sent");
    const sent = await signOff();
    expect(sent.attempts).toBe(2);
    expect(sent.nextAttemptAt).toBeNull();
    expect(readMailbox().filter((m) => m.messageId === messageIdOf(sent.id))).toHaveLength(1);
  });

  it("an address the receiving server refuses (SMTP 550) is given up after two tries: dead, for the Mail page", async () => {
    setMailSenderForTests(refusingSender());
    const [id] = await queueOne("nobody-here@example.test", "Refused twice");
    await expect.poll(async () => (await rowById(id)).status, { timeout: 30_000, interval: 250 }).toBe("dead");
    const row = await rowById(id);
    expect(row.attempts).toBe(2);
    expect(row.lastError).toMatch(/550|user unknown/);
    expect(row.nextAttemptAt).toBeNull();
  });

  it("a person's send again brings a dead row back and the job delivers it; a technician cannot (403), another shop's id is 404", async () => {
    const [id] = await db().transaction(async (tx) => {
      const ids = await queueMail(tx, [{ organizationId: crew.owner.organizationId, testId: null, to: "back-again@example.test", subject: "Back again", text: "x", html: "<p>x</p>" }]);
      await tx.update(mailOutbox).set({ status: "dead", attempts: 7, lastError: "a day of tries" }).where(eq(mailOutbox.id, ids[0]));
      return ids;
    });
    await new Promise((r) => setTimeout(r, 1500)); // its first job found it dead and left it
    expect((await rowById(id)).status).toBe("dead");
    expect((await resendPost(appRequest("/api/outbox/resend", jsonInit(crew.technician, { id })))).status).toBe(403);
    const res = await resendPost(appRequest("/api/outbox/resend", jsonInit(crew.lead, { id })));
    expect(res.status).toBe(202);
    expect((await res.json()).queued).toEqual([id]);
    await waitForMail("back-again@example.test", /Back again/);
    await expect.poll(async () => (await rowById(id)).status, { timeout: 10_000 }).toBe("sent");
    expect((await rowById(id)).retryUntil.getTime()).toBeGreaterThan(Date.now() + 23 * 3600_000);
    const other = await resendPost(appRequest("/api/outbox/resend", jsonInit(crew.lead, { id: "00000000-0000-4000-8000-000000000000" })));
    expect(other.status).toBe(404);
  });

  it("mail carries text and HTML, a link into the app, a Message-ID made from its row, and no secrets", async () => {
    const id = await seedTest(crew.technician, { title: "Garage mini-split" });
    await reviewPost(appRequest(`/api/vacuum-tests/${id}/review`, jsonInit(crew.technician, { action: "ask_help", note: "It will not hold below 900." })), routeParams({ id }));
    const mail = await waitForMail(crew.lead.email, /Help asked: Garage mini-split/);
    expect(mail.text).toContain("It will not hold below 900.");
    expect(mail.html).toContain("<a href=");
    expect(mail.text).toMatch(/https?:\/\/127\.0\.0\.1:\d+\/vacuum-tests\//);
    expect(mail.text + mail.html).not.toMatch(/password|token|secret/i);
    const row = (await rowsOf(id)).find((r) => r.to === crew.lead.email)!;
    expect(mail.messageId).toBe(messageIdOf(row.id));
  });

  it("two deliveries of the same rows at once send each message exactly once (row lock, skip locked)", async () => {
    const sent: string[] = [];
    setMailSenderForTests(async (m) => {
      sent.push(m.to);
      await new Promise((r) => setTimeout(r, 50)); // hold the row lock while "sending"
    });
    // Rows written without a job, so only the two deliveries below touch them.
    const ids = (await db().insert(mailOutbox).values([1, 2, 3].map((n) => ({ organizationId: crew.owner.organizationId, to: `twice-${n}@example.test`, subject: `Once ${n}`, text: "x", html: "<p>x</p>" }))).returning()).map((r) => r.id);
    const org = crew.owner.organizationId;
    const outcomes = await Promise.all(ids.flatMap((id) => [deliverOutboxRow(db(), { organizationId: org, id }), deliverOutboxRow(db(), { organizationId: org, id })]));
    expect(outcomes.filter((o) => o === "sent")).toHaveLength(3);
    expect(outcomes.filter((o) => o === "skipped")).toHaveLength(3);
    expect(sent.sort()).toEqual(["twice-1@example.test", "twice-2@example.test", "twice-3@example.test"]);
    const rows = await db().select({ attempts: mailOutbox.attempts, status: mailOutbox.status }).from(mailOutbox).where(inArray(mailOutbox.id, ids));
    expect(rows.map((r) => [r.status, r.attempts])).toEqual([["sent", 1], ["sent", 1], ["sent", 1]]);
  });

  it("the rows and their delivery job commit together: a rolled-back change leaves neither", async () => {
    const before = await jobStates(QUEUES.mail.name);
    const count = (s: Record<string, number>) => Object.values(s).reduce((a, b) => a + b, 0);
    await expect(
      db().transaction(async (tx) => {
        await queueMail(tx, [{ organizationId: crew.owner.organizationId, testId: null, to: "never@example.test", subject: "Rolled back", text: "x", html: "<p>x</p>" }]);
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    expect(await db().select().from(mailOutbox).where(eq(mailOutbox.subject, "Rolled back"))).toEqual([]);
    expect(count(await jobStates(QUEUES.mail.name))).toBe(count(before));
  });

  it("a delivery job that keeps failing lands in the dead-letter queue, and its rows are marked given up", async () => {
    const [id] = await db().insert(mailOutbox).values({ organizationId: crew.owner.organizationId, to: "dl@example.test", subject: "Dead letter", text: "x", html: "<p>x</p>" }).returning();
    // A malformed id makes the handler's query fail every time; no retries left after the first.
    await jobSender().send(QUEUES.mail.name, { organizationId: crew.owner.organizationId, outboxIds: ["not-a-uuid", id.id] }, { retryLimit: 0 });
    await expect.poll(async () => (await rowById(id.id)).status, { timeout: 30_000, interval: 250 }).toBe("dead");
    expect((await rowById(id.id)).lastError).toMatch(/^Riseline could not deliver it: /);
  });
});
