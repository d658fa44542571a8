import { db } from "@/db/client";
import { upsertOrganizationUnitSystem } from "@/db/queries/settings";
import { route } from "@/lib/api/handler";
import { shopUnitsSchema, unitSettingsOf } from "@/lib/units/settings";

export const dynamic = "force-dynamic";

/** GET /api/settings/units — { shop, person, effective }: the shop's units and the reader's own choice. */
export const GET = route({ policy: "shop.read" }, async ({ actor }) => unitSettingsOf(db(), actor));

/** PUT /api/settings/units — { unitSystem }: the owner sets the shop's working units. */
export const PUT = route({ policy: "shop.manage", body: shopUnitsSchema }, async ({ actor, body }) => {
  await upsertOrganizationUnitSystem(db(), { organizationId: actor.organizationId, unitSystem: body.unitSystem });
  return unitSettingsOf(db(), actor);
});
