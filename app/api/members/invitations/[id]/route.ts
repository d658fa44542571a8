import { z } from "zod";
import { db } from "@/db/client";
import { getPendingInvitationByOrganization } from "@/db/queries/invitations";
import { getAuth } from "@/lib/auth";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { viaAuth } from "../../auth-errors";

const params = z.object({ id: z.string().min(1).max(200) });

/** DELETE /api/members/invitations/:id — cancels an open invitation of the caller's shop. */
export const DELETE = route({ policy: "member.manage", params }, async ({ req, actor, params: p }) => {
  // Another shop's invitation (or a made-up id) is simply not there for this caller.
  const found = await getPendingInvitationByOrganization(db(), { organizationId: actor.organizationId, id: p.id });
  if (!found) throw new AppError("not_found", "No open invitation with that id in this shop.");
  await viaAuth(() => getAuth().api.cancelInvitation({ headers: req.headers, body: { invitationId: found.id } }));
  return { cancelled: found.id };
});
