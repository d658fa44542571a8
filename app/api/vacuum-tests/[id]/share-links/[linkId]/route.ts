import { z } from "zod";
import { db } from "@/db/client";
import { revokeShareLinkById } from "@/db/queries/share-links";
import { insertTestEvent } from "@/db/queries/review";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { requireVisibleTest } from "@/lib/vacuum-tests/read";

const params = z.object({ id: z.string().uuid("not a valid id"), linkId: z.string().uuid("not a valid id") });

/** Revoke a link: it stops working at once. */
export const DELETE = route({ policy: "vacuumTest.share", params }, async ({ actor, params }) => {
  await requireVisibleTest(db(), actor, params.id);
  const out = await db().transaction(async (tx) => {
    const row = await revokeShareLinkById(tx, { organizationId: actor.organizationId, testId: params.id, linkId: params.linkId, at: new Date() });
    if (!row) throw new AppError("not_found", "No such share link.");
    await insertTestEvent(tx, { organizationId: actor.organizationId, testId: params.id, actorId: actor.userId, kind: "share_link_revoked" });
    return row;
  });
  return { id: out.id, revokedAt: out.revokedAt?.toISOString() ?? null };
});
