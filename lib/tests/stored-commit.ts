/**
 * The one mechanism behind every upload of a raw log (a new test, a re-test): store the file,
 * then write the rows in one transaction; if the transaction fails the file is deleted again, so
 * neither side keeps an orphan.
 *
 *  - Storage failing → 503 storage_unavailable, nothing written.
 *  - The transaction failing → the object is deleted, then: a lost Idempotency-Key race (the
 *    callback threw KeyTaken) answers with `onKeyTaken()`; an AppError passes through; anything
 *    else is a 503 database_unavailable.
 */
import type { Database, Tx } from "@/db/client";
import { AppError } from "@/lib/errors";
import { log } from "@/lib/log";
import { deleteObject, putObject } from "@/lib/storage";

/** Thrown inside the transaction when another request already holds the Idempotency-Key. */
export class KeyTaken extends Error {}

export interface RawObject {
  key: string;
  bytes: Uint8Array;
  contentType: string;
  sha256: string;
}

export async function storeThenCommit<T>(
  db: Database,
  object: RawObject,
  what: string,
  commit: (tx: Tx) => Promise<T>,
  onKeyTaken: () => Promise<T>,
): Promise<T> {
  try {
    await putObject(object.key, object.bytes, object.contentType || "text/csv", object.sha256);
  } catch (err) {
    log.error(`${what} not stored`, { objectKey: object.key, err: String(err) });
    throw new AppError("storage_unavailable");
  }
  try {
    return await db.transaction(commit);
  } catch (err) {
    await deleteObject(object.key).catch((e) => log.error(`orphan ${what} left in storage`, { objectKey: object.key, err: String(e) }));
    if (err instanceof KeyTaken) return onKeyTaken();
    if (err instanceof AppError) throw err;
    log.error(`${what} transaction failed; the stored file was removed`, { objectKey: object.key, err: String((err as { cause?: unknown })?.cause ?? err) });
    throw new AppError("database_unavailable");
  }
}
