import { db } from "@/db/client";
import { listTestEventsByTest } from "@/db/queries/review";
import { route, uuidParam } from "@/lib/api/handler";
import { requireVisibleTest } from "@/lib/vacuum-tests/read";

/** The audit trail: every state change and comment, oldest first, with who and when. */
export const GET = route({ policy: "vacuumTest.read", params: uuidParam }, async ({ actor, params }) => {
  await requireVisibleTest(db(), actor, params.id);
  const rows = await listTestEventsByTest(db(), { organizationId: actor.organizationId, testId: params.id });
  return { events: rows.map((e) => ({ ...e, actorName: e.actorName ?? (e.actorId ? "A former member" : "Riseline"), createdAt: e.createdAt.toISOString() })) };
});
