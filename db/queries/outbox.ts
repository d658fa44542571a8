import { and, asc, desc, eq, inArray, lt, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { mailOutbox, type MailKind, type MailStatus } from "@/db/schema";

export type OutboxRow = typeof mailOutbox.$inferSelect;

export interface NewOutboxMail {
  organizationId: string;
  testId?: string | null;
  to: string;
  subject: string;
  text: string;
  html: string;
  attachment?: "report_pdf" | null;
  /** A kind a person may turn off; absent for essential mail. */
  kind?: MailKind | null;
}

/** Queue messages (call inside the transaction of the change they announce). */
export async function insertOutboxMail(db: Db, params: { mails: NewOutboxMail[] }): Promise<string[]> {
  if (!params.mails.length) return [];
  const rows = await db.insert(mailOutbox).values(params.mails).returning({ id: mailOutbox.id });
  return rows.map((r) => r.id);
}

/**
 * Organizations with unsent rows whose next try is overdue by `before` (a system sweep's first
 * step; each organization's rows are then read by listOverdueOutboxMailIds).
 */
export async function listOrganizationsWithOverdueMail(db: Db, params: { before: Date }): Promise<string[]> {
  const rows = await db
    .selectDistinct({ organizationId: mailOutbox.organizationId })
    .from(mailOutbox)
    .where(and(inArray(mailOutbox.status, ["pending", "failed"]), lt(sql`coalesce(${mailOutbox.nextAttemptAt}, ${mailOutbox.createdAt})`, params.before)));
  return rows.map((r) => r.organizationId);
}

/** The organization's unsent rows whose next try was due before `before`, oldest first. */
export async function listOverdueOutboxMailIds(db: Db, params: { organizationId: string; before: Date; limit: number }): Promise<string[]> {
  const rows = await db
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(
      and(
        eq(mailOutbox.organizationId, params.organizationId),
        inArray(mailOutbox.status, ["pending", "failed"]),
        lt(sql`coalesce(${mailOutbox.nextAttemptAt}, ${mailOutbox.createdAt})`, params.before),
      ),
    )
    .orderBy(asc(mailOutbox.createdAt))
    .limit(params.limit);
  return rows.map((r) => r.id);
}

/**
 * Lock one unsent row for a delivery attempt (inside a transaction) and count the attempt.
 * SKIP LOCKED: a row another worker is sending is left alone, so it is never sent twice at once.
 */
export async function claimOutboxMailById(db: Db, params: { organizationId: string; id: string }): Promise<OutboxRow | null> {
  // One statement: lock the row if it is unsent and not being sent by another worker, count the attempt.
  const locked = db
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(and(eq(mailOutbox.organizationId, params.organizationId), eq(mailOutbox.id, params.id), inArray(mailOutbox.status, ["pending", "failed"])))
    .for("update", { skipLocked: true });
  const [claimed] = await db
    .update(mailOutbox)
    .set({ attempts: sql`${mailOutbox.attempts} + 1` })
    .where(and(eq(mailOutbox.organizationId, params.organizationId), inArray(mailOutbox.id, locked)))
    .returning();
  return claimed ?? null;
}

export async function markOutboxMailSent(db: Db, params: { organizationId: string; id: string }) {
  await db
    .update(mailOutbox)
    .set({ status: "sent", sentAt: new Date(), lastError: null, nextAttemptAt: null })
    .where(and(eq(mailOutbox.organizationId, params.organizationId), eq(mailOutbox.id, params.id)));
}

/** A failed try: the error, and when the next one is due. */
export async function markOutboxMailFailed(db: Db, params: { organizationId: string; id: string; error: string; nextAttemptAt: Date }) {
  await db
    .update(mailOutbox)
    .set({ status: "failed", lastError: params.error.slice(0, 500), nextAttemptAt: params.nextAttemptAt })
    .where(and(eq(mailOutbox.organizationId, params.organizationId), eq(mailOutbox.id, params.id)));
}

/** Not sent: the recipient turned this kind of mail off. */
export async function markOutboxMailOff(db: Db, params: { organizationId: string; id: string }) {
  await db
    .update(mailOutbox)
    .set({ status: "off", lastError: null, nextAttemptAt: null })
    .where(and(eq(mailOutbox.organizationId, params.organizationId), eq(mailOutbox.id, params.id)));
}

/** No more automatic tries (the dead-letter state); a person may still send it again. */
export async function markOutboxMailDead(db: Db, params: { organizationId: string; ids: string[]; error: string }) {
  if (!params.ids.length) return;
  await db
    .update(mailOutbox)
    .set({ status: "dead", lastError: params.error.slice(0, 500), nextAttemptAt: null })
    .where(and(eq(mailOutbox.organizationId, params.organizationId), inArray(mailOutbox.id, params.ids), inArray(mailOutbox.status, ["pending", "failed"])));
}

/**
 * A person's "send again": the organization's unsent rows (one, or all of them) become pending
 * with a fresh day of automatic tries. Returns the ids, for the delivery job queued in the same transaction.
 */
export async function requeueUnsentOutboxMail(db: Db, params: { organizationId: string; id?: string; limit: number }): Promise<string[]> {
  const conds = [eq(mailOutbox.organizationId, params.organizationId), inArray(mailOutbox.status, ["pending", "failed", "dead"])];
  if (params.id) conds.push(eq(mailOutbox.id, params.id));
  const picked = db.select({ id: mailOutbox.id }).from(mailOutbox).where(and(...conds)).orderBy(asc(mailOutbox.createdAt)).limit(params.limit);
  const rows = await db
    .update(mailOutbox)
    .set({ status: "pending", nextAttemptAt: new Date(), retryUntil: sql`now() + interval '24 hours'` })
    .where(and(eq(mailOutbox.organizationId, params.organizationId), inArray(mailOutbox.id, picked)))
    .returning({ id: mailOutbox.id });
  return rows.map((r) => r.id);
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
      nextAttemptAt: mailOutbox.nextAttemptAt,
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
