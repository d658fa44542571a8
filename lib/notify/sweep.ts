/**
 * The outbox's safety net, run every minute: an unsent row whose next try is more than
 * OVERDUE_MINUTES late has no job that is going to send it (a row queued before deliveries were
 * jobs, or a job lost with its server before pg-boss could put it back), so it gets a job again.
 * A second job for a row that does have one is harmless: the row lock and its status decide.
 */
import type { Database } from "@/db/client";
import { listOrganizationsWithOverdueMail, listOverdueOutboxMailIds } from "@/db/queries/outbox";
import { enqueueMailDelivery } from "./outbox";

export const OVERDUE_MINUTES = 10;
const ROWS_PER_JOB = 50;

/** Queue jobs for every overdue row; returns how many rows were queued again. */
export async function sweepOverdueMail(db: Database, now = new Date()): Promise<number> {
  const before = new Date(now.getTime() - OVERDUE_MINUTES * 60_000);
  let queued = 0;
  for (const organizationId of await listOrganizationsWithOverdueMail(db, { before })) {
    const ids = await listOverdueOutboxMailIds(db, { organizationId, before, limit: 500 });
    for (let i = 0; i < ids.length; i += ROWS_PER_JOB) {
      await enqueueMailDelivery(db, { organizationId, ids: ids.slice(i, i + ROWS_PER_JOB) });
    }
    queued += ids.length;
  }
  return queued;
}
