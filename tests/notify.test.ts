import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { eq, inArray } from "drizzle-orm";
import nodemailer from "nodemailer";
import { db } from "@/db/client";
import { mailOutbox, vacuumTests } from "@/db/schema";
import { POST as reviewPost } from "@/app/api/tests/[id]/review/route";
import { POST as resendPost } from "@/app/api/outbox/resend/route";
import { GET as outboxGet } from "@/app/api/outbox/route";
import { setMailSenderForTests, type MailSender } from "@/lib/notify/transport";
import { deliverMail, queueMail, resendUnsentMail } from "@/lib/notify/outbox";
import { appRequest, createCrew, routeParams, type TestMember } from "./helpers/members";
import { waitForMail } from "./helpers/mailbox";
import { seedTest } from "./helpers/seed-test";
import type { Role } from "@/lib/permissions";

const json = (as: TestMember, body: unknown) => ({ method: "POST", as, body: JSON.stringify(body), headers: { "content-type": "application/json" } });

/** A real SMTP client pointed at a port nothing listens on: the connection is refused. */
function deadPortSender(): MailSender {
  const t = nodemailer.createTransport({ host: "127.0.0.1", port: 9, secure: false, ignoreTLS: true, connectionTimeout: 1000 });
  return async (m) => {
    await t.sendMail({ from: "Riseline <no-reply@riseline.test>", ...m });
  };
}

let crew: Record<Role, TestMember>;
beforeAll(async () => {
  crew = await createCrew();
});
afterEach(() => setMailSenderForTests(null));
afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

describe("e-mail through the outbox (product rule: the change never depends on the mail)", () => {
  it("SMTP down: the sign-off stands, the row is failed with the error, and a resend delivers it to the catcher", async () => {
    const id = await seedTest(crew.technician, { title: "Basement furnace coil" });
    await reviewPost(appRequest(`/api/tests/${id}/review`, json(crew.technician, { action: "request_review" })), routeParams({ id }));
    setMailSenderForTests(deadPortSender());
    const res = await reviewPost(appRequest(`/api/tests/${id}/review`, json(crew.lead, { action: "sign_off" })), routeParams({ id }));
    expect(res.status).toBe(200);
    const [t] = await db().select({ status: vacuumTests.status }).from(vacuumTests).where(eq(vacuumTests.id, id));
    expect(t.status).toBe("signed_off");
    const rows = await db().select().from(mailOutbox).where(eq(mailOutbox.testId, id));
    const signOff = rows.find((r) => r.subject.startsWith("Signed off"))!;
    expect(signOff).toMatchObject({ status: "failed", attempts: 1, to: crew.technician.email });
    expect(signOff.lastError).toMatch(/ECONNREFUSED|connect/i);

    const listed = await (await outboxGet(appRequest("/api/outbox?status=failed", { as: crew.lead }))).json();
    expect(listed.mail.map((m: { id: string }) => m.id)).toContain(signOff.id);
    expect(JSON.stringify(listed)).not.toContain("text_body");

    setMailSenderForTests(null);
    const resend = await resendPost(appRequest("/api/outbox/resend", json(crew.lead, { id: signOff.id })));
    expect(resend.status).toBe(200);
    expect((await resend.json()).sent).toEqual([signOff.id]);
    const mail = await waitForMail(crew.technician.email, /Signed off: Basement furnace coil/);
    expect(mail.text).toContain(crew.lead.name);
    const [after] = await db().select().from(mailOutbox).where(eq(mailOutbox.id, signOff.id));
    expect(after.status).toBe("sent");
    expect(after.attempts).toBe(2);
    expect(after.sentAt).not.toBeNull();
  });

  it("a sent row is never sent again by the background resend; a technician cannot resend (403)", async () => {
    const report = await resendUnsentMail(db(), { organizationId: crew.owner.organizationId });
    expect(report.failed).toEqual([]);
    const second = await resendUnsentMail(db(), { organizationId: crew.owner.organizationId });
    expect(second.sent).toEqual([]);
    expect((await resendPost(appRequest("/api/outbox/resend", json(crew.technician, {})))).status).toBe(403);
  });

  it("mail carries text and HTML, a link into the app and no secrets (no token or password text)", async () => {
    const id = await seedTest(crew.technician, { title: "Garage mini-split" });
    await reviewPost(appRequest(`/api/tests/${id}/review`, json(crew.technician, { action: "ask_help", note: "It will not hold below 900." })), routeParams({ id }));
    const mail = await waitForMail(crew.lead.email, /Help asked: Garage mini-split/);
    expect(mail.text).toContain("It will not hold below 900.");
    expect(mail.html).toContain("<a href=");
    expect(mail.text).toMatch(/https?:\/\/127\.0\.0\.1:\d+\/tests\//);
    expect(mail.text + mail.html).not.toMatch(/password|token|secret/i);
  });

  it("two deliveries of the same rows at once send each message exactly once (row lock, skip locked)", async () => {
    const sent: string[] = [];
    setMailSenderForTests(async (m) => {
      sent.push(m.to);
      await new Promise((r) => setTimeout(r, 50)); // hold the row lock while "sending"
    });
    const ids = await db().transaction((tx) =>
      queueMail(
        tx,
        [1, 2, 3].map((n) => ({ organizationId: crew.owner.organizationId, testId: null, to: `twice-${n}@example.test`, subject: `Once ${n}`, text: "x", html: "<p>x</p>" })),
      ),
    );
    const [a, b] = await Promise.all([deliverMail(db(), ids), deliverMail(db(), ids)]);
    expect([...a.sent, ...b.sent].sort()).toEqual([...ids].sort());
    expect(sent.sort()).toEqual(["twice-1@example.test", "twice-2@example.test", "twice-3@example.test"]);
    const rows = await db().select({ attempts: mailOutbox.attempts, status: mailOutbox.status }).from(mailOutbox).where(inArray(mailOutbox.id, ids));
    expect(rows.map((r) => [r.status, r.attempts])).toEqual([["sent", 1], ["sent", 1], ["sent", 1]]);
  });
});
