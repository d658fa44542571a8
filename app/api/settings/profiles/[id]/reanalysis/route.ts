import { z } from "zod";
import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { taskDto } from "@/lib/jobs/tasks";
import { startProfileReanalysis } from "@/lib/vacuum-tests/bulk-reanalysis";

const body = z.object({ previousName: z.string().trim().min(1).max(120).optional() });

/**
 * POST /api/settings/profiles/:id/reanalysis — re-check every test judged by this profile (by its
 * name, or `previousName` after a rename) with its numbers of now, as background jobs.
 * 202 { task } to follow at /api/tasks/:id; 200 { task: null } when no test used the profile.
 */
export const POST = route({ policy: "profile.manage", params: uuidParam, body }, async ({ actor, params, body }) => {
  const task = await startProfileReanalysis(db(), actor, { profileId: params.id, previousName: body.previousName });
  return task ? Response.json({ task: taskDto(task) }, { status: 202 }) : { task: null };
});
