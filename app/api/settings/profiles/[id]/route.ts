import { db } from "@/db/client";
import { deleteProfileById, setDefaultProfileById, updateProfileById } from "@/db/queries/profiles-admin";
import { route, uuidParam } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { profileInputSchema } from "@/lib/review/profile-schemas";

/**
 * Edit a profile. Tests already analysed keep the profile stored with their analysis, so an
 * edit changes new analyses only; old results never change silently.
 */
export const PUT = route({ policy: "profile.manage", params: uuidParam, body: profileInputSchema }, async ({ actor, params, body }) => {
  const { makeDefault, ...profile } = body;
  const row = await db().transaction(async (tx) => {
    const updated = await updateProfileById(tx, { organizationId: actor.organizationId, profileId: params.id, ...profile });
    if (!updated) throw new AppError("not_found", "No such profile.");
    return makeDefault ? setDefaultProfileById(tx, { organizationId: actor.organizationId, profileId: params.id }) : updated;
  });
  return { profile: row };
});

export const DELETE = route({ policy: "profile.manage", params: uuidParam }, async ({ actor, params }) => {
  const out = await deleteProfileById(db(), { organizationId: actor.organizationId, profileId: params.id });
  if (out === "not_found") throw new AppError("not_found", "No such profile.");
  if (out === "is_default") throw new AppError("conflict", "This is the default profile; make another one the default first.");
  return { deleted: true };
});
