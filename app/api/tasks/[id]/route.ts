import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { requireVisibleTask, taskDto } from "@/lib/jobs/tasks";

export const dynamic = "force-dynamic";

/** GET /api/tasks/:id — how a queued large-log analysis or a bulk re-analysis is getting on (the page polls it). */
export const GET = route({ policy: "task.read", params: uuidParam }, async ({ actor, params }) => {
  return { task: taskDto(await requireVisibleTask(db(), actor, params.id)) };
});
