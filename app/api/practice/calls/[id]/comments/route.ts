import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { practiceCommentSchema } from "@/lib/practice/schemas";
import { addPracticeComment } from "@/lib/practice/view";

export const dynamic = "force-dynamic";

/** POST /api/practice/calls/:id/comments — { body }: a trainer's (or the apprentice's) comment on a call. */
export const POST = route({ policy: "practice.comment", params: uuidParam, body: practiceCommentSchema }, async ({ actor, params, body }) =>
  Response.json({ comment: await addPracticeComment(db(), actor, params.id, body.body) }, { status: 201 }),
);
