/**
 * The delivery job: send each outbox row of a change, one transaction per row.
 *
 *  - The row is locked while it is sent (FOR UPDATE SKIP LOCKED), so two jobs, two servers or a
 *    person's "send again" never send it at the same time; the try is counted in the same update.
 *  - Sent: the row says so. Failed: the error and the next try are written and the retry job is
 *    queued in that same transaction (./backoff.ts says when, or that Riseline gives up: "dead").
 *  - A row already sent, given up, or locked by another sender is skipped; so is a kind of mail its
 *    recipient turned off (status "off"). Non-essential mail carries its unsubscribe headers.
 *  - The database failing after the mail server accepted a message (an outage, a restart) does
 *    not send it twice: this process knows it went, and records "sent" as soon as the database
 *    answers again, well before any retry of the job could claim the row.
 *  - Each message carries a Message-ID made from its row id, the same on every try: if the server
 *    itself dies after the mail server accepted a message but before the row was marked sent, the
 *    next try hands over the same message again (at least once, never lost), and mail stores
 *    treat a repeated Message-ID as the same message.
 *  - Only a failure to reach the database throws: pg-boss then retries the whole job, and when its
 *    retries run out the job goes to the dead-letter queue (markDeadLettered below).
 */
import type PgBoss from "pg-boss";
import type { Database, Db, Tx } from "@/db/client";
import { getMailRecipientState } from "@/db/queries/mail-settings";
import { claimOutboxMailById, markOutboxMailDead, markOutboxMailOff, markOutboxMailFailed, markOutboxMailSent, type OutboxRow } from "@/db/queries/outbox";
import { env } from "@/lib/env";
import { log } from "@/lib/log";
import { isPermanentSmtpFailure, nextStepAfterFailure } from "./backoff";
import { enqueueMailDelivery, type MailJobData } from "./outbox";
import { mailSender, type MailWithAttachments } from "./transport";
import { fromWithSenderName, unsubscribeHeaders } from "./unsubscribe";

/** The longest one SMTP hand-over may take before it counts as failed (inside the job's 30 s expiry). */
const SEND_LIMIT_MS = 20_000;

export type RowOutcome = "sent" | "retry" | "dead" | "skipped";

/** The Message-ID of an outbox row: stable across tries, unique per row. */
export function messageIdOf(outboxId: string): string {
  const domain = /@([^>\s]+)>?\s*$/.exec(env().MAIL_FROM)?.[1] ?? "riseline.invalid";
  return `<outbox-${outboxId}@${domain}>`;
}

type Envelope = Pick<MailWithAttachments, "from" | "headers"> & { footer?: boolean };

/**
 * The foot of a non-essential mail: where to turn it off. The signed link itself is only in the
 * headers (a mail's body carries no token); the body points to the person's own settings page.
 */
function withFooter(row: OutboxRow, footer: boolean): { text: string; html: string } {
  if (!footer) return { text: row.text, html: row.html };
  const url = new URL("/settings/my-mail", env().BETTER_AUTH_URL).toString();
  const line = "To stop this kind of mail, use your mail client's unsubscribe button or turn it off in your mail settings:";
  return {
    text: `${row.text}\n\n${line} ${url}`,
    html: `${row.html}<p style="font-size:12px;color:#50616b">${line} <a href="${url}">${url}</a></p>`,
  };
}

/**
 * The shop's sender name, and for a kind a person may turn off: whether they did (null: do not
 * send) and the unsubscribe headers (RFC 2369 §3.2, RFC 8058 §3.1). Read at send time, so a
 * preference set after the mail was queued still counts.
 */
async function envelopeOf(db: Db, row: OutboxRow): Promise<Envelope | null> {
  const state = await getMailRecipientState(db, { organizationId: row.organizationId, email: row.to, kind: row.kind });
  if (state.off) return null;
  const from = fromWithSenderName(state.senderName);
  if (!row.kind || !state.userId) return { from };
  const claim = { userId: state.userId, organizationId: row.organizationId, kind: row.kind };
  return { from, headers: unsubscribeHeaders(claim), footer: true };
}

async function sendRow(db: Database, row: OutboxRow, envelope: Envelope): Promise<void> {
  // Loaded only when a row needs it, so notifications never pull in the PDF code.
  const attachments = row.attachment === "report_pdf" ? await (await import("@/lib/reports/attach")).reportAttachments(db, row) : undefined;
  let timer: NodeJS.Timeout | undefined;
  const limit = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`the mail server did not accept the message within ${SEND_LIMIT_MS / 1000} s`)), SEND_LIMIT_MS);
  });
  try {
    await Promise.race([
      mailSender()({ to: row.to, subject: row.subject, ...withFooter(row, envelope.footer ?? false), messageId: messageIdOf(row.id), from: envelope.from, headers: envelope.headers, ...(attachments ? { attachments } : {}) }),
      limit,
    ]);
  } finally {
    clearTimeout(timer);
  }
}

/** How long a message the mail server took is recorded as sent, however long the database is away. */
const RECORD_SENT_FOR_MS = 15 * 60_000;

/** The message went but its transaction did not commit: mark it sent as soon as the database is back. */
async function recordSentWhenBack(db: Database, organizationId: string, id: string): Promise<void> {
  const until = Date.now() + RECORD_SENT_FOR_MS;
  for (let wait = 250; ; wait = Math.min(1000, wait * 2)) {
    try {
      await markOutboxMailSent(db, { organizationId, id });
      log.warn("mail sent during a database outage; recorded once the database was back", { outboxId: id });
      return;
    } catch (err) {
      if (Date.now() > until) throw err;
      await new Promise((r) => setTimeout(r, wait));
    }
  }
}

/** One try at one row (see the file's comment). */
export async function deliverOutboxRow(db: Database, params: { organizationId: string; id: string }): Promise<RowOutcome> {
  let accepted = false;
  try {
    return await tryRow(db, params, () => {
      accepted = true;
    });
  } catch (err) {
    if (!accepted) throw err;
    await recordSentWhenBack(db, params.organizationId, params.id);
    return "sent";
  }
}

async function tryRow(db: Database, params: { organizationId: string; id: string }, onAccepted: () => void): Promise<RowOutcome> {
  return db.transaction(async (tx) => {
    const row = await claimOutboxMailById(tx, params);
    if (!row) return "skipped";
    const envelope = await envelopeOf(tx, row);
    if (!envelope) {
      await markOutboxMailOff(tx, { organizationId: row.organizationId, id: row.id });
      return "skipped";
    }
    try {
      await sendRow(db, row, envelope);
    } catch (err) {
      return recordFailure(tx, row, err);
    }
    onAccepted();
    await markOutboxMailSent(tx, { organizationId: row.organizationId, id: row.id });
    return "sent";
  });
}

/** A failed try: retry later (the job for it commits with the record), or give up. */
async function recordFailure(tx: Tx, row: OutboxRow, err: unknown): Promise<RowOutcome> {
  const error = err instanceof Error ? err.message : String(err);
  const step = nextStepAfterFailure({ attempts: row.attempts, retryUntil: row.retryUntil, permanent: isPermanentSmtpFailure(err), now: new Date() });
  if (step.kind === "give_up") {
    log.warn("mail not sent; giving up", { outboxId: row.id, attempts: row.attempts, why: step.why, error });
    await markOutboxMailDead(tx, { organizationId: row.organizationId, ids: [row.id], error });
    return "dead";
  }
  log.warn("mail not sent; trying again later", { outboxId: row.id, attempts: row.attempts, afterSeconds: step.afterSeconds, error });
  await markOutboxMailFailed(tx, { organizationId: row.organizationId, id: row.id, error, nextAttemptAt: step.at });
  await enqueueMailDelivery(tx, { organizationId: row.organizationId, ids: [row.id], afterSeconds: step.afterSeconds });
  return "retry";
}

/** The job: every row of it, in order. Throws (for pg-boss to retry) only when the database fails. */
export async function runMailJob(db: Database, data: MailJobData): Promise<Record<RowOutcome, number>> {
  const counts: Record<RowOutcome, number> = { sent: 0, retry: 0, dead: 0, skipped: 0 };
  for (const id of data.outboxIds) counts[await deliverOutboxRow(db, { organizationId: data.organizationId, id })]++;
  return counts;
}

/** A delivery job whose pg-boss retries ran out: its unsent rows are given up, with the reason. */
export async function markDeadLettered(db: Database, job: PgBoss.JobWithMetadata<MailJobData>): Promise<void> {
  const why = (job.output as { message?: string } | null)?.message ?? "the delivery job kept failing";
  // Only well-formed ids: a malformed job must not make its own dead letter fail as well.
  const ids = job.data.outboxIds.filter((id) => /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id));
  await markOutboxMailDead(db, { organizationId: job.data.organizationId, ids, error: `Riseline could not deliver it: ${why}` });
}
