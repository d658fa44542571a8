/**
 * The mail outbox. A change and the mail announcing it are written in one transaction, together
 * with the job that delivers it (queueMail, or enqueueMailDelivery when the rows were written by
 * another statement): once the change commits, its mail is in PostgreSQL with a job to send it,
 * whichever server (or worker) is alive to run it, and however long the mail server is away.
 * A failing mail never undoes a change, and no request waits for SMTP.
 *
 * Delivery is ./delivery.ts (the job), the retry rule ./backoff.ts.
 */
import type { Db } from "@/db/client";
import { insertOutboxMail, requeueUnsentOutboxMail, type NewOutboxMail } from "@/db/queries/outbox";
import { sendJob } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";

/** What a delivery job carries: the rows of one change (all of one organization). */
export interface MailJobData {
  organizationId: string;
  outboxIds: string[];
}

/**
 * Queue the delivery of rows already written in this transaction (one job for them all). The job
 * commits with the rows; `afterSeconds` delays it (a retry).
 */
export async function enqueueMailDelivery(tx: Db, params: { organizationId: string; ids: string[]; afterSeconds?: number }): Promise<void> {
  if (!params.ids.length) return;
  const data: MailJobData = { organizationId: params.organizationId, outboxIds: params.ids };
  await sendJob(tx, QUEUES.mail.name, data, params.afterSeconds ? { startAfter: params.afterSeconds } : {});
}

/** Write messages and their delivery job in the caller's transaction; returns the row ids. */
export async function queueMail(tx: Db, mails: NewOutboxMail[]): Promise<string[]> {
  const ids = await insertOutboxMail(tx, { mails });
  const byOrganization = new Map<string, string[]>();
  mails.forEach((m, i) => byOrganization.set(m.organizationId, [...(byOrganization.get(m.organizationId) ?? []), ids[i]]));
  for (const [organizationId, orgIds] of byOrganization) await enqueueMailDelivery(tx, { organizationId, ids: orgIds });
  return ids;
}

/** A person's "send again": the rows become pending with a fresh day of tries, and a job is queued now. */
export async function requeueUnsentMail(tx: Db, params: { organizationId: string; id?: string }): Promise<string[]> {
  const ids = await requeueUnsentOutboxMail(tx, { organizationId: params.organizationId, id: params.id, limit: 200 });
  await enqueueMailDelivery(tx, { organizationId: params.organizationId, ids });
  return ids;
}
