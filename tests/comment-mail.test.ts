/**
 * Comments reach the person who should answer them, through the outbox (our product rule, no
 * published source): a lead's comment goes to the test's technician; the technician's comment on
 * a test waiting for review goes to the leads; other comments mail no one. Real SMTP catcher.
 */
import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { POST as commentPost } from "@/app/api/vacuum-tests/[id]/comments/route";
import { POST as reviewPost } from "@/app/api/vacuum-tests/[id]/review/route";
import { db } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import { crewForFile, jsonInit } from "./helpers/crew";
import { jobRunnerForFile } from "./helpers/jobs";
import { waitForMail } from "./helpers/mailbox";
import { appRequest, routeParams, type TestMember } from "./helpers/members";
import { seedTest } from "./helpers/seed-test";

const crew = crewForFile();
jobRunnerForFile();

async function comment(id: string, as: TestMember, body: string, atSeconds: number | null = null) {
  const res = await commentPost(appRequest(`/api/vacuum-tests/${id}/comments`, jsonInit(as, { body, atSeconds })), routeParams({ id }));
  expect(res.status).toBe(201);
}

const outboxTo = async (id: string) => (await db().select({ to: mailOutbox.to, subject: mailOutbox.subject }).from(mailOutbox).where(eq(mailOutbox.testId, id))).filter((m) => m.subject.startsWith("Comment on:"));

describe("comment e-mail", () => {
  it("mails the technician when a lead comments, with the words and the minute on the curve", async () => {
    const id = await seedTest(crew.technician, { title: "Clinic split system" });
    await comment(id, crew.lead, "Check the core tool seal.", 1500);
    const mail = await waitForMail(crew.technician.email, /Comment on: Clinic split system/);
    expect(mail.text).toContain("Check the core tool seal.");
    expect(mail.text).toContain("at 25.0 min on the curve"); // 1500 s = 25.0 min
    expect((await outboxTo(id)).map((m) => m.to)).toEqual([crew.technician.email]);
  });

  it("mails the leads when the technician comments on a test waiting for review, and no one before it waits", async () => {
    const id = await seedTest(crew.technician, { title: "Warehouse rooftop unit" });
    await comment(id, crew.technician, "Gauge was on the suction side only.");
    expect(await outboxTo(id)).toEqual([]);
    const asked = await reviewPost(appRequest(`/api/vacuum-tests/${id}/review`, jsonInit(crew.technician, { action: "request_review" })), routeParams({ id }));
    expect(asked.status).toBe(200);
    await comment(id, crew.technician, "Ambient was 95 °F.");
    const mail = await waitForMail(crew.lead.email, /Comment on: Warehouse rooftop unit/);
    expect(mail.text).toContain("Ambient was 95 °F.");
    expect((await outboxTo(id)).map((m) => m.to)).toEqual([crew.lead.email]);
  });

  it("mails no one for a trainer's comment (not a reviewer, not the technician)", async () => {
    const id = await seedTest(crew.technician, { title: "Trainer note" });
    await comment(id, crew.trainer, "Good example of a plateau.");
    expect(await outboxTo(id)).toEqual([]);
  });
});
