import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { loadPlannerHistory } from "@/lib/planner/history";
import { plannerHistoryQuery } from "@/lib/planner/schemas";
import { viewerOf } from "@/lib/rigs/service";

/** A system's recorded pull-downs beside the plan for each (the tests the caller may see). */
export const GET = route({ policy: "planner.read", query: plannerHistoryQuery }, async ({ actor, query }) => {
  return loadPlannerHistory(db(), { viewer: viewerOf(actor), systemId: query.systemId });
});
