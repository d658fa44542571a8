import { db } from "@/db/client";
import { upsertMemberUnitSystem } from "@/db/queries/settings";
import { route } from "@/lib/api/handler";
import { personUnitsSchema, unitSettingsOf } from "@/lib/units/settings";

export const dynamic = "force-dynamic";

/** PUT /api/settings/units/mine — { unitSystem | null }: the person's own units, over the shop's (null = the shop's). */
export const PUT = route({ policy: "preference.write", body: personUnitsSchema }, async ({ actor, body }) => {
  await upsertMemberUnitSystem(db(), { organizationId: actor.organizationId, userId: actor.userId, unitSystem: body.unitSystem });
  return unitSettingsOf(db(), actor);
});
