import { db } from "@/db/client";
import { listReviewQueueByOrganization } from "@/db/queries/review";
import { route } from "@/lib/api/handler";
import { reviewQueueQuerySchema } from "@/lib/review/schemas";
import { sparklineOf } from "@/lib/review/sparkline";

/** The lead's queue: tests waiting for review, the longest waiting first. A read only: the review sweep job moves tests in. */
export const GET = route({ policy: "reviewQueue.read", query: reviewQueueQuerySchema }, async ({ actor, query }) => {
  const rows = await listReviewQueueByOrganization(db(), {
    viewer: { organizationId: actor.organizationId, userId: actor.userId, role: actor.role },
    filters: { technicianId: query.technicianId, verdict: query.verdict, helpOnly: query.help === "1" },
    limit: query.limit,
  });
  return {
    items: rows.map(({ series, ...r }) => ({
      ...r,
      testedAt: r.testedAt.toISOString(),
      waitingSince: r.waitingSince ? new Date(r.waitingSince).toISOString() : null,
      sparkline: sparklineOf(series, { isolationAtSeconds: r.isolationAt, limitMicrons: r.limitMicrons }),
    })),
  };
});
