import { db } from "@/db/client";
import { listMailOptOuts, replaceMailOptOuts } from "@/db/queries/mail-settings";
import { MAIL_KINDS } from "@/db/schema";
import { route } from "@/lib/api/handler";
import { myMailSchema } from "@/lib/settings/mail-schemas";

export const dynamic = "force-dynamic";

/** GET /api/settings/my-mail — { kinds, off }: the kinds of mail the person may turn off, and those off. */
export const GET = route({ policy: "mailPreferences.own" }, async ({ actor }) => ({
  kinds: MAIL_KINDS,
  off: await listMailOptOuts(db(), { organizationId: actor.organizationId, userId: actor.userId }),
}));

/** PUT /api/settings/my-mail — { off }: the kinds the person does not want (password resets and invitations are always sent). */
export const PUT = route({ policy: "mailPreferences.own", body: myMailSchema }, async ({ actor, body }) => {
  const off = [...new Set(body.off)];
  await db().transaction((tx) => replaceMailOptOuts(tx, { organizationId: actor.organizationId, userId: actor.userId, off }));
  return { kinds: MAIL_KINDS, off };
});
