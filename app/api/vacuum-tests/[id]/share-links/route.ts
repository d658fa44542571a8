import { db } from "@/db/client";
import { listShareLinksByTest } from "@/db/queries/share-links";
import { route, uuidParam } from "@/lib/api/handler";
import { requireVisibleTest } from "@/lib/vacuum-tests/read";
import { shareLinkCreateSchema } from "@/lib/review/schemas";
import { createShareLink } from "@/lib/reports/share";

/** The test's share links (never their tokens: only a hash is kept). */
export const GET = route({ policy: "vacuumTest.share", params: uuidParam }, async ({ actor, params }) => {
  await requireVisibleTest(db(), actor, params.id);
  const rows = await listShareLinksByTest(db(), { organizationId: actor.organizationId, testId: params.id });
  const now = Date.now();
  return {
    links: rows.map((l) => ({
      ...l,
      state: l.revokedAt ? "revoked" : l.expiresAt.getTime() <= now ? "expired" : "active",
      expiresAt: l.expiresAt.toISOString(),
      revokedAt: l.revokedAt?.toISOString() ?? null,
      createdAt: l.createdAt.toISOString(),
    })),
  };
});

/** A new read-only link to the report; the URL (with its token) is shown this once. */
export const POST = route({ policy: "vacuumTest.share", params: uuidParam, body: shareLinkCreateSchema }, async ({ actor, params, body }) => {
  await requireVisibleTest(db(), actor, params.id);
  const link = await db().transaction((tx) =>
    createShareLink(tx, { organizationId: actor.organizationId, testId: params.id, actorId: actor.userId, expiresInDays: body.expiresInDays }),
  );
  return Response.json({ id: link.id, url: link.url, expiresAt: link.expiresAt.toISOString() }, { status: 201 });
});
