/**
 * The review sweep, a scheduled job (every minute): every shop's submitted tests that the review
 * rule (lib/review/auto.ts) says belong in the lead's queue are moved there, with the leads'
 * e-mail. The upload already does this in its own transaction; the sweep catches a test stored by
 * any other path. It used to run inside GET /api/review, which made a read write.
 */
import type { Database } from "@/db/client";
import { listOrganizationsWithTestsDueForReview } from "@/db/queries/review";
import { sweepNewTestsIntoReview } from "./auto";

/** Returns how many tests moved into review. */
export async function sweepAllShopsIntoReview(db: Database): Promise<number> {
  let moved = 0;
  for (const organizationId of await listOrganizationsWithTestsDueForReview(db)) {
    moved += await sweepNewTestsIntoReview(db, { organizationId, limit: 200 });
  }
  return moved;
}
