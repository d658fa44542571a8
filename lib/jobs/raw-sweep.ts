/**
 * The orphan raw-file sweeper, a scheduled job (every 10 minutes). An upload stores the raw log
 * first and then commits the test; if the transaction fails the file is deleted at once
 * (lib/vacuum-tests/stored-commit.ts), but a server that dies between the two leaves a file no test
 * references. This finds such files under `orgs/<organization>/` once they are older than the
 * safe age (RAW_SWEEP_SAFE_AGE_SECONDS, default 30 minutes: far longer than any upload takes to
 * commit, so a file whose test is still being written is never touched) and deletes them.
 * A file stays while a committed upload row, or a queued large-log analysis, names it.
 */
import type { Database } from "@/db/client";
import { listReferencedObjectKeysByOrganization } from "@/db/queries/vacuum-tests";
import { listObjectKeysOfOpenTasksByOrganization } from "@/db/queries/tasks";
import { log } from "@/lib/log";
import { deleteObject, listStoredObjects } from "@/lib/storage";

const KEY_PATTERN = /^orgs\/([^/]+)\//;

export interface SweepReport {
  examined: number;
  deleted: string[];
}

/** Delete every raw file older than `safeAgeSeconds` that nothing references (under `prefix`, default every organization's). */
export async function sweepOrphanRawFiles(db: Database, params: { safeAgeSeconds: number; now?: Date; prefix?: string }): Promise<SweepReport> {
  const cutoff = (params.now ?? new Date()).getTime() - params.safeAgeSeconds * 1000;
  const report: SweepReport = { examined: 0, deleted: [] };
  for await (const page of listStoredObjects(params.prefix ?? "orgs/")) {
    const byOrganization = new Map<string, string[]>();
    for (const o of page) {
      const org = KEY_PATTERN.exec(o.key)?.[1];
      if (!org || o.lastModified.getTime() > cutoff) continue;
      report.examined++;
      byOrganization.set(org, [...(byOrganization.get(org) ?? []), o.key]);
    }
    for (const [organizationId, keys] of byOrganization) {
      const [committed, queued] = await Promise.all([
        listReferencedObjectKeysByOrganization(db, { organizationId, keys }),
        listObjectKeysOfOpenTasksByOrganization(db, { organizationId, keys }),
      ]);
      for (const key of keys) {
        if (committed.has(key) || queued.has(key)) continue;
        await deleteObject(key);
        report.deleted.push(key);
      }
    }
  }
  if (report.deleted.length) log.info("orphan raw files deleted", { count: report.deleted.length, keys: report.deleted.slice(0, 20) });
  return report;
}
