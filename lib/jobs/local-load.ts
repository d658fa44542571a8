/**
 * How busy this process is serving uploads right now, so background work that can wait (mail,
 * sweeps, bulk re-analysis) gives way to a technician waiting for a verdict.
 *
 * This is not state the servers share: the work itself stays in the queue in PostgreSQL, and an
 * idle server or `npm run worker` takes it meanwhile. Only whether this process fetches such work
 * now is decided from it (lib/jobs/runner.ts): once no upload has been in progress for QUIET_MS,
 * or when it has held off for the longest wait, so under steady load the work still goes.
 * Kept on globalThis: Next.js bundles instrumentation (where the jobs run) apart from the routes
 * (where uploads run), and both must see the same count.
 */
/** No upload in progress for this long counts as quiet. */
const QUIET_MS = 150;

interface Load {
  uploadsInProgress: number;
  lastUploadEndedAt: number;
  quietMs: number;
}

const g = globalThis as unknown as { rlLocalLoad?: Load };
const load: Load = (g.rlLocalLoad ??= { uploadsInProgress: 0, lastUploadEndedAt: 0, quietMs: QUIET_MS });

/** Mark an upload in progress; call the returned function once it has answered. */
export function uploadInProgress(): () => void {
  load.uploadsInProgress++;
  let done = false;
  return () => {
    if (done) return;
    done = true;
    load.uploadsInProgress--;
    load.lastUploadEndedAt = Date.now();
  };
}

/** No upload in progress here, and none for a moment. */
export function isQuiet(): boolean {
  return load.uploadsInProgress === 0 && Date.now() - load.lastUploadEndedAt >= load.quietMs;
}

/** Test seam: another quiet period (null restores the default). */
export function setQuietMsForTests(ms: number | null): void {
  load.quietMs = ms ?? QUIET_MS;
}
