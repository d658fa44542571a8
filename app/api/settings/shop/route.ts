import { db } from "@/db/client";
import { getOrganizationTimeZoneById, upsertOrganizationTimeZone } from "@/db/queries/settings";
import { route } from "@/lib/api/handler";
import { shopSettingsSchema } from "@/lib/settings/schemas";

export const dynamic = "force-dynamic";

/** GET /api/settings/shop — { timeZone }: the shop's time zone, for every member. */
export const GET = route({ policy: "shop.read" }, async ({ actor }) => ({
  timeZone: await getOrganizationTimeZoneById(db(), { organizationId: actor.organizationId }),
}));

/** PUT /api/settings/shop — { timeZone }: the owner sets the zone reports and e-mails write times in. */
export const PUT = route({ policy: "shop.manage", body: shopSettingsSchema }, async ({ actor, body }) => {
  await upsertOrganizationTimeZone(db(), { organizationId: actor.organizationId, timeZone: body.timeZone });
  return { timeZone: body.timeZone };
});
