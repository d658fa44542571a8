import { db } from "@/db/client";
import { insertTestComment, listTestCommentsByTest } from "@/db/queries/comments";
import { insertTestEvent } from "@/db/queries/review";
import { route, uuidParam } from "@/lib/api/handler";
import { requireVisibleTest } from "@/lib/vacuum-tests/read";
import { commentSchema } from "@/lib/review/schemas";
import { queueCommentMail } from "@/lib/review/comment-mail";

export const GET = route({ policy: "vacuumTest.comment", params: uuidParam }, async ({ actor, params }) => {
  await requireVisibleTest(db(), actor, params.id);
  const rows = await listTestCommentsByTest(db(), { organizationId: actor.organizationId, testId: params.id });
  return { comments: rows.map((c) => ({ ...c, createdAt: c.createdAt.toISOString() })) };
});

/**
 * A comment, optionally at a time on the curve; recorded in the audit trail too, and e-mailed
 * (technician ⇄ leads, lib/review/comment-mail.ts) through the outbox (its delivery job commits with the comment).
 */
export const POST = route({ policy: "vacuumTest.comment", params: uuidParam, body: commentSchema }, async ({ actor, params, body }) => {
  const detail = await requireVisibleTest(db(), actor, params.id);
  const { comment } = await db().transaction(async (tx) => {
    const c = await insertTestComment(tx, {
      organizationId: actor.organizationId, testId: params.id, authorId: actor.userId, body: body.body, atSeconds: body.atSeconds ?? null,
    });
    const at = c.atSeconds != null ? ` (at ${(c.atSeconds / 60).toFixed(1)} min)` : "";
    await insertTestEvent(tx, { organizationId: actor.organizationId, testId: params.id, actorId: actor.userId, kind: "commented", note: `${body.body.slice(0, 200)}${at}` });
    return { comment: c, mailIds: await queueCommentMail(tx, actor, { detail, body: body.body, atSeconds: c.atSeconds }) };
  });
  return Response.json(
    { comment: { id: comment.id, body: comment.body, atSeconds: comment.atSeconds, createdAt: comment.createdAt.toISOString(), authorId: actor.userId, authorName: actor.name } },
    { status: 201 },
  );
});
