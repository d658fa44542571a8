/**
 * The one mechanism behind every upload of a raw log (a new test, a re-test): store the file,
 * then write the rows in one transaction; if the transaction fails the file is deleted again, so
 * neither side keeps an orphan.
 *
 *  - Storage failing or timing out → 503 storage_unavailable, nothing written. A store that timed
 *    out may still write the object once it wakes, so deletes are queued as jobs (lib/jobs/raw-delete.ts:
 *    soon and again about a minute later, retried while the store is away; the orphan sweep catches
 *    what they miss).
 *  - The request gone (the client disconnected or gave up) before the commit → the transaction is
 *    rolled back and the file deleted: an upload nobody is waiting for is never committed later.
 *  - The transaction failing → the object is deleted, then: a lost Idempotency-Key race (the
 *    callback threw KeyTaken) answers with `onKeyTaken()`; an AppError passes through; anything
 *    else is mapped by what it is (lib/api/failures.ts): 503 only when the database is really
 *    unreachable, 422 for a value it cannot hold.
 */
import type { Database, Tx } from "@/db/client";
import { failureOf } from "@/lib/api/failures";
import { AppError } from "@/lib/errors";
import { describeError, log } from "@/lib/log";
import { deleteRawLater } from "@/lib/jobs/raw-delete";
import { deleteObject, putRawLog } from "@/lib/storage";

/** Thrown inside the transaction when another request already holds the Idempotency-Key. */
export class KeyTaken extends Error {}

/** Thrown when the request went away before its upload was committed; nothing is kept. */
export class RequestGone extends Error {
  constructor() {
    super("The request was abandoned before its upload was committed.");
    this.name = "RequestGone";
  }
}

export interface RawObject {
  key: string;
  bytes: Uint8Array;
  /** The uploader's file name, kept for the download's Content-Disposition. */
  filename: string;
  sha256: string;
}

function assertStillWanted(signal: AbortSignal | undefined): void {
  if (signal?.aborted) throw new RequestGone();
}

export async function storeThenCommit<T>(
  db: Database,
  object: RawObject,
  what: string,
  commit: (tx: Tx) => Promise<T>,
  onKeyTaken: () => Promise<T>,
  signal?: AbortSignal,
): Promise<T> {
  assertStillWanted(signal);
  try {
    await putRawLog(object.key, object.bytes, object.filename, object.sha256, signal);
  } catch (err) {
    await deleteRawLater(object.key, what); // the store may still write it
    if (signal?.aborted) throw new RequestGone();
    throw err;
  }
  try {
    return await db.transaction(async (tx) => {
      const out = await commit(tx);
      assertStillWanted(signal); // the last moment to roll back: COMMIT follows
      return out;
    });
  } catch (err) {
    await deleteObject(object.key).catch(() => deleteRawLater(object.key, what));
    if (err instanceof KeyTaken) return onKeyTaken();
    if (err instanceof AppError || err instanceof RequestGone) throw err;
    const failure = failureOf(err);
    log.error(`${what} transaction failed; the stored file was removed`, { objectKey: object.key, code: failure.code, err: describeError(err) });
    throw failure;
  }
}
