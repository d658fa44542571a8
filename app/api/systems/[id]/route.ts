import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { systemHistoryOf } from "@/lib/reports/history";

/** GET /api/systems/:id — { system, site, tests } with every visible test on it, newest first. */
export const GET = route({ policy: "record.read", params: uuidParam }, async ({ actor, params }) => {
  const h = await systemHistoryOf(db(), { viewer: { organizationId: actor.organizationId, userId: actor.userId, role: actor.role }, systemId: params.id });
  if (!h) throw new AppError("not_found", "No such system.");
  return h;
});
