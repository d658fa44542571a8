/**
 * Mail that can wait for a quiet moment: the leads' "a test needs review" e-mail after an upload.
 *
 * The technician in the truck is waiting for the verdict; the lead reading mail is not waiting to
 * the second. So the upload answers first, and these rows (already committed in the outbox, see
 * ./outbox.ts) are sent once no upload has been in progress for QUIET_MS — and at the latest
 * MAX_WAIT_MS after the first of them was queued, so under steady load mail still goes out.
 *
 * Nothing is lost if the process stops first: the rows stay pending in the outbox for
 * "Send all unsent". Scripts call flushQuietMail() before they close the database.
 */
import type { Database } from "@/db/client";
import { log } from "@/lib/log";
import { deliverMail } from "./outbox";

/** No upload in progress for this long counts as quiet. */
const QUIET_MS = 150;
/** The longest a queued row waits for quiet (our choice: a lead can wait half a minute). */
const MAX_WAIT_MS = 30_000;

interface State {
  quietMs: number;
  maxWaitMs: number;
  db: Database | null;
  ids: string[];
  firstQueuedAt: number;
  uploadsInProgress: number;
  timer: ReturnType<typeof setTimeout> | null;
  sending: Promise<unknown>;
}

const g = globalThis as unknown as { rlQuietMail?: State };
const state: State = (g.rlQuietMail ??= { quietMs: QUIET_MS, maxWaitMs: MAX_WAIT_MS, db: null, ids: [], firstQueuedAt: 0, uploadsInProgress: 0, timer: null, sending: Promise.resolve() });

function arm(): void {
  if (state.timer) clearTimeout(state.timer);
  state.timer = null;
  if (!state.ids.length) return;
  const left = Math.max(0, state.maxWaitMs - (Date.now() - state.firstQueuedAt));
  state.timer = setTimeout(send, state.uploadsInProgress === 0 ? Math.min(state.quietMs, left) : left);
}

function send(): void {
  if (state.timer) clearTimeout(state.timer);
  state.timer = null;
  const { db, ids } = state;
  state.ids = [];
  state.firstQueuedAt = 0;
  if (!db || !ids.length) return;
  state.sending = state.sending
    .then(() => deliverMail(db, ids, { fresh: true }))
    .catch((err) => log.error("review mail not sent yet; left in the outbox", { err: String(err) }));
}

/** Queue the ids of committed outbox rows to be sent at the next quiet moment. */
export function deliverWhenQuiet(db: Database, ids: string[]): void {
  if (!ids.length) return;
  state.db = db;
  if (!state.ids.length) state.firstQueuedAt = Date.now();
  state.ids.push(...ids);
  arm();
}

/** Mark an upload in progress; call the returned function when it has answered. */
export function uploadInProgress(): () => void {
  state.uploadsInProgress++;
  if (state.uploadsInProgress === 1) arm();
  let done = false;
  return () => {
    if (done) return;
    done = true;
    state.uploadsInProgress--;
    if (state.uploadsInProgress === 0) arm();
  };
}

/** Send whatever is waiting now and wait for it (scripts, before they close the database). */
export async function flushQuietMail(): Promise<void> {
  send();
  await state.sending;
}

/** Test seam: other timings (null restores the defaults). */
export function setQuietMailTimingForTests(t: { quietMs: number; maxWaitMs: number } | null): void {
  state.quietMs = t?.quietMs ?? QUIET_MS;
  state.maxWaitMs = t?.maxWaitMs ?? MAX_WAIT_MS;
}
