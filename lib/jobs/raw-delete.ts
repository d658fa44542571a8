/**
 * Deleting again a raw file whose upload failed or timed out. A frozen store answers nothing, then
 * writes the object when it wakes; so an upload that gave up on its store call (or whose
 * transaction failed and whose delete did not go through) queues jobs that delete the object a
 * few seconds and again about a minute later, on whichever server or worker takes them. A job
 * whose delete fails (the store still away) is retried by pg-boss with back-off. An object that a
 * committed upload names by then is left alone. The orphan sweeper (./raw-sweep.ts) catches
 * whatever these miss, the database being away as well, say.
 */
import type { Database } from "@/db/client";
import { listReferencedObjectKeysByOrganization } from "@/db/queries/vacuum-tests";
import { log } from "@/lib/log";
import { deleteObject } from "@/lib/storage";
import { db as defaultDb } from "@/db/client";
import { sendJob } from "./boss";
import { QUEUES } from "./queues";

export interface RawDeleteJobData {
  organizationId: string;
  objectKey: string;
}

/** Seconds after the failure at which a delete job runs: soon, and once more after a late write. */
export const RAW_DELETE_AFTER_SECONDS = [3, 60];

const KEY_PATTERN = /^orgs\/([^/]+)\//;

/** Queue the deletes of an object an upload stored (or tried to) and did not commit. Never throws: the sweeper is the fallback. */
export async function deleteRawLater(objectKey: string, what: string, conn: Database = defaultDb()): Promise<void> {
  const organizationId = KEY_PATTERN.exec(objectKey)?.[1];
  if (!organizationId) return;
  try {
    for (const startAfter of RAW_DELETE_AFTER_SECONDS) await sendJob(conn, QUEUES.rawDelete.name, { organizationId, objectKey } satisfies RawDeleteJobData, { startAfter });
  } catch (err) {
    log.warn(`${what} left for the orphan sweeper: its delete could not be queued`, { objectKey, err: String(err) });
  }
}

/** The job: delete the object unless a committed upload names it. A failed delete throws, for pg-boss to retry. */
export async function runRawDeleteJob(db: Database, data: RawDeleteJobData): Promise<void> {
  const referenced = await listReferencedObjectKeysByOrganization(db, { organizationId: data.organizationId, keys: [data.objectKey] });
  if (referenced.has(data.objectKey)) return;
  await deleteObject(data.objectKey);
}
