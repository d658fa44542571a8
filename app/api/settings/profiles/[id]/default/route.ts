import { db } from "@/db/client";
import { setDefaultProfileById } from "@/db/queries/profiles-admin";
import { route, uuidParam } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";

/** Make this the organization's one default profile (new uploads use it unless one is picked). */
export const POST = route({ policy: "profile.manage", params: uuidParam }, async ({ actor, params }) => {
  const row = await db().transaction((tx) => setDefaultProfileById(tx, { organizationId: actor.organizationId, profileId: params.id }));
  if (!row) throw new AppError("not_found", "No such profile.");
  return { profile: row };
});
