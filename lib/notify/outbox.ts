/**
 * The mail outbox. A change and the mail announcing it are written in one transaction
 * (queueMail inside it); delivery happens after commit (deliverMail). If the SMTP server is
 * down the change stands and the row stays for resendUnsentMail: a mail is never lost and a
 * failing mail never undoes a change.
 */
import type { Database, Db } from "@/db/client";
import {
  claimOutboxMailById, insertOutboxMail, listUnsentOutboxMailIds, markOutboxMailFailed, markOutboxMailSent, type NewOutboxMail, type OutboxRow,
} from "@/db/queries/outbox";
import { log } from "@/lib/log";
import { mailSender } from "./transport";

/** Automatic resends stop after this many attempts; a person's resend always tries. */
export const MAX_MAIL_ATTEMPTS = 5;

/** Longest a request waits for delivery before it answers anyway (the rows stay for resend). */
const DELIVERY_WAIT_MS = 4000;

/** Queue messages in the caller's transaction; returns their ids for deliverMail after commit. */
export async function queueMail(tx: Db, mails: NewOutboxMail[]): Promise<string[]> {
  return insertOutboxMail(tx, { mails });
}

export interface DeliveryReport {
  sent: string[];
  failed: { id: string; error: string }[];
}

async function sendRow(db: Database, row: OutboxRow): Promise<void> {
  // Loaded only when a row needs it, so notifications never pull in the PDF code.
  const attachments = row.attachment === "report_pdf" ? await (await import("@/lib/reports/attach")).reportAttachments(db, row) : undefined;
  await mailSender()({ to: row.to, subject: row.subject, text: row.text, html: row.html, ...(attachments ? { attachments } : {}) });
}

/**
 * One attempt at one row, in its own transaction: the row stays locked while it is sent, so two
 * workers never send it at once; the attempt, and sent or failed, commit together.
 * At-least-once: a crash after SMTP accepted but before commit sends it again on resend.
 */
async function deliverOne(db: Database, id: string, report: DeliveryReport): Promise<void> {
  await db.transaction(async (tx) => {
    const row = await claimOutboxMailById(tx, { id });
    if (!row) return;
    try {
      await sendRow(db, row);
      await markOutboxMailSent(tx, { id });
      report.sent.push(id);
    } catch (err) {
      const failure = err instanceof Error ? err.message : String(err);
      log.warn("mail not sent; left in the outbox for resend", { outboxId: id, attempt: row.attempts, error: failure });
      await markOutboxMailFailed(tx, { id, error: failure });
      report.failed.push({ id, error: failure });
    }
  });
}

async function deliverIds(db: Database, ids: string[], report: DeliveryReport): Promise<void> {
  for (const id of ids) {
    try {
      await deliverOne(db, id, report);
    } catch (err) {
      log.error("outbox delivery failed", { outboxId: id, err: String(err) });
    }
  }
}

/**
 * Send queued rows now (after the transaction that queued them committed). Never throws.
 * `byPerson`: a member pressed resend, so the automatic attempt limit does not apply.
 * `fresh`: the caller's own transaction just queued these ids, so they are unsent with no attempt
 * yet and need no listing first (each claim still checks the row's status).
 */
export async function deliverMail(db: Database, ids: string[], opts: { byPerson?: boolean; fresh?: boolean } = {}): Promise<DeliveryReport> {
  const report: DeliveryReport = { sent: [], failed: [] };
  if (!ids.length) return report;
  const maxAttempts = opts.byPerson ? 2 ** 31 - 1 : MAX_MAIL_ATTEMPTS;
  try {
    await deliverIds(db, opts.fresh ? ids : await listUnsentOutboxMailIds(db, { ids, maxAttempts, limit: ids.length }), report);
  } catch (err) {
    log.error("outbox delivery failed", { err: String(err) });
  }
  return report;
}

/** deliverMail, but a request answers within DELIVERY_WAIT_MS even if SMTP hangs. */
export async function deliverMailSoon(db: Database, ids: string[]): Promise<void> {
  if (!ids.length) return;
  await Promise.race([deliverMail(db, ids), new Promise((r) => setTimeout(r, DELIVERY_WAIT_MS))]);
}

/** Retry pending and failed rows (one organization's, or every organization's from a script). */
export async function resendUnsentMail(db: Database, params: { organizationId?: string; limit?: number } = {}): Promise<DeliveryReport> {
  const report: DeliveryReport = { sent: [], failed: [] };
  const ids = await listUnsentOutboxMailIds(db, {
    organizationId: params.organizationId,
    maxAttempts: MAX_MAIL_ATTEMPTS,
    limit: params.limit ?? 50,
  });
  await deliverIds(db, ids, report);
  return report;
}
