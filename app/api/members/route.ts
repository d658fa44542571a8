import { db } from "@/db/client";
import { listMembersByOrganization } from "@/db/queries/members";
import { route } from "@/lib/api/handler";

/** GET /api/members — the members of the caller's shop with names and roles. */
export const GET = route({ policy: "member.list" }, async ({ actor }) => {
  const members = await listMembersByOrganization(db(), { organizationId: actor.organizationId });
  return { members };
});
