/** Merging a duplicate customer, site or system into the one kept (db/queries/record-merge.ts), with its errors in words. */
import type { Database } from "@/db/client";
import { mergeRecordsById, type MergeOutcome } from "@/db/queries/record-merge";
import type { RecordKind } from "@/db/queries/similar-names";
import { AppError } from "@/lib/errors";

export async function mergeDuplicateRecord(db: Database, params: { organizationId: string; kind: RecordKind; fromId: string; intoId: string }): Promise<MergeOutcome> {
  if (params.fromId === params.intoId) throw new AppError("invalid_input", "intoId: a record cannot be merged into itself.", { field: "intoId" });
  const outcome = await mergeRecordsById(db, params);
  if ("missing" in outcome) throw new AppError("not_found", `${outcome.missing}: no such ${params.kind} in your organization.`, { field: outcome.missing });
  return outcome;
}
