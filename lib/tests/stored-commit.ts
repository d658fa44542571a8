/**
 * The one mechanism behind every upload of a raw log (a new test, a re-test): store the file,
 * then write the rows in one transaction; if the transaction fails the file is deleted again, so
 * neither side keeps an orphan.
 *
 *  - Storage failing or timing out → 503 storage_unavailable, nothing written. A store that timed
 *    out may still write the object once it wakes, so the object is deleted again later (a few
 *    tries over about three minutes; a process that stops meanwhile leaves it to the orphan sweep).
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

/** Seconds after a failed store before each try to delete what it may still write. */
const DELETE_AGAIN_AFTER_SECONDS = [2, 5, 10, 20, 40, 80];

/**
 * Deletes an object whose upload failed or timed out, now and again later: a frozen store answers
 * nothing, then writes the object when it wakes. After the first delete that succeeds, one more
 * 30 s later catches a write the store was still holding. Timers never keep a process alive.
 */
export function deleteAgainLater(key: string, what: string): void {
  void deleteUntilGone(key, what);
}

/** The loop behind deleteAgainLater: waits, deletes, and once a delete succeeded, deletes once more 30 s later. */
async function deleteUntilGone(key: string, what: string): Promise<void> {
  const pause = (seconds: number) => new Promise<void>((resolve) => setTimeout(resolve, seconds * 1000).unref());
  for (const seconds of DELETE_AGAIN_AFTER_SECONDS) {
    await pause(seconds);
    const deleted = await deleteObject(key).then(
      () => true,
      () => false,
    );
    if (deleted) {
      await pause(30);
      await deleteObject(key).catch(() => undefined);
      return;
    }
  }
  log.error(`${what} may be left in storage after a failed upload`, { objectKey: key });
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
    deleteAgainLater(object.key, what); // the store may still write it
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
    await deleteObject(object.key).catch(() => deleteAgainLater(object.key, what));
    if (err instanceof KeyTaken) return onKeyTaken();
    if (err instanceof AppError || err instanceof RequestGone) throw err;
    const failure = failureOf(err);
    log.error(`${what} transaction failed; the stored file was removed`, { objectKey: object.key, code: failure.code, err: describeError(err) });
    throw failure;
  }
}
