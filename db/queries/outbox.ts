import { and, asc, desc, eq, inArray, lt, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { mailOutbox, type MailStatus } from "@/db/schema";

export type OutboxRow = typeof mailOutbox.$inferSelect;

export interface NewOutboxMail {
  organizationId: string;
  testId?: string | null;
  to: string;
  subject: string;
  text: string;
  html: string;
  attachment?: "report_pdf" | null;
}

/** Queue messages (call inside the transaction of the change they announce). */
export async function insertOutboxMail(db: Db, params: { mails: NewOutboxMail[] }): Promise<string[]> {
  if (!params.mails.length) return [];
  const rows = await db.insert(mailOutbox).values(params.mails).returning({ id: mailOutbox.id });
  return rows.map((r) => r.id);
}

/** Ids of unsent rows still under the attempt limit, oldest first (scoped when an organization is given). */
export async function listUnsentOutboxMailIds(
  db: Db,
  params: { ids?: string[]; organizationId?: string; maxAttempts: number; limit: number },
): Promise<string[]> {
  const conds = [inArray(mailOutbox.status, ["pending", "failed"]), lt(mailOutbox.attempts, params.maxAttempts)];
  if (params.ids) {
    if (!params.ids.length) return [];
    conds.push(inArray(mailOutbox.id, params.ids));
  }
  if (params.organizationId) conds.push(eq(mailOutbox.organizationId, params.organizationId));
  const rows = await db.select({ id: mailOutbox.id }).from(mailOutbox).where(and(...conds)).orderBy(asc(mailOutbox.createdAt)).limit(params.limit);
  return rows.map((r) => r.id);
}

/**
 * Lock one unsent row for a delivery attempt (inside a transaction) and count the attempt.
 * SKIP LOCKED: a row another worker is sending is left alone, so it is never sent twice at once.
 */
export async function claimOutboxMailById(db: Db, params: { id: string }): Promise<OutboxRow | null> {
  // One statement: lock the row if it is unsent and not being sent by another worker, count the attempt.
  const locked = db
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(and(eq(mailOutbox.id, params.id), inArray(mailOutbox.status, ["pending", "failed"])))
    .for("update", { skipLocked: true });
  const [claimed] = await db
    .update(mailOutbox)
    .set({ attempts: sql`${mailOutbox.attempts} + 1` })
    .where(inArray(mailOutbox.id, locked))
    .returning();
  return claimed ?? null;
}

export async function markOutboxMailSent(db: Db, params: { id: string }) {
  await db.update(mailOutbox).set({ status: "sent", sentAt: new Date(), lastError: null }).where(eq(mailOutbox.id, params.id));
}

export async function markOutboxMailFailed(db: Db, params: { id: string; error: string }) {
  await db.update(mailOutbox).set({ status: "failed", lastError: params.error.slice(0, 500) }).where(eq(mailOutbox.id, params.id));
}

/** The organization's outbox, newest first, without bodies. */
export async function listOutboxMailByOrganization(db: Db, params: { organizationId: string; status?: MailStatus; testId?: string; limit: number }) {
  const conds = [eq(mailOutbox.organizationId, params.organizationId)];
  if (params.status) conds.push(eq(mailOutbox.status, params.status));
  if (params.testId) conds.push(eq(mailOutbox.testId, params.testId));
  return db
    .select({
      id: mailOutbox.id,
      testId: mailOutbox.testId,
      to: mailOutbox.to,
      subject: mailOutbox.subject,
      status: mailOutbox.status,
      attempts: mailOutbox.attempts,
      lastError: mailOutbox.lastError,
      createdAt: mailOutbox.createdAt,
      sentAt: mailOutbox.sentAt,
    })
    .from(mailOutbox)
    .where(and(...conds))
    .orderBy(desc(mailOutbox.createdAt))
    .limit(params.limit);
}

export async function getOutboxMailById(db: Db, params: { organizationId: string; id: string }) {
  const [row] = await db
    .select()
    .from(mailOutbox)
    .where(and(eq(mailOutbox.organizationId, params.organizationId), eq(mailOutbox.id, params.id)))
    .limit(1);
  return row ?? null;
}

/** Whether the organization has this unsent message. */
export async function hasUnsentOutboxMailById(db: Db, params: { organizationId: string; id: string }): Promise<boolean> {
  const rows = await db
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(and(eq(mailOutbox.organizationId, params.organizationId), eq(mailOutbox.id, params.id), inArray(mailOutbox.status, ["pending", "failed"])))
    .limit(1);
  return rows.length === 1;
}
