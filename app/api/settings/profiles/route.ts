import { db } from "@/db/client";
import { listProfilesByOrganization } from "@/db/queries/profiles";
import { createProfileForOrganization } from "@/db/queries/profiles-admin";
import { route } from "@/lib/api/handler";
import { profileInputSchema } from "@/lib/review/profile-schemas";

export const dynamic = "force-dynamic";

/** The organization's profiles for the settings page (default first). */
export const GET = route({ policy: "profile.manage" }, async ({ actor }) => ({
  items: await listProfilesByOrganization(db(), { organizationId: actor.organizationId }),
}));

/** Create a profile; the first one, or one with makeDefault, becomes the default. */
export const POST = route({ policy: "profile.manage", body: profileInputSchema }, async ({ actor, body }) => {
  const profile = await db().transaction((tx) => createProfileForOrganization(tx, { organizationId: actor.organizationId, ...body }));
  return Response.json({ profile }, { status: 201 });
});
