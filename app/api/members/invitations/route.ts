import { z } from "zod";
import { db } from "@/db/client";
import { listInvitationsByOrganization } from "@/db/queries/members";
import { getAuth } from "@/lib/auth";
import { route } from "@/lib/api/handler";
import { INVITABLE_ROLES, type Role } from "@/lib/permissions";
import { viaAuth } from "../auth-errors";

/** GET /api/members/invitations — open invitations of the caller's shop (owners only). */
export const GET = route({ policy: "member.manage" }, async ({ actor }) => {
  const invitations = await listInvitationsByOrganization(db(), { organizationId: actor.organizationId });
  return { invitations };
});

const inviteBody = z.object({
  email: z.string().trim().toLowerCase().email("not an e-mail address"),
  role: z.enum(INVITABLE_ROLES as [Role, ...Role[]], { message: `one of ${INVITABLE_ROLES.join(", ")}` }),
});

/** POST /api/members/invitations {email, role} — invites someone by e-mail; better-auth sends the mail. */
export const POST = route({ policy: "member.manage", body: inviteBody }, async ({ req, actor, body }) => {
  const role = body.role as Exclude<Role, "owner">;
  const invitation = await viaAuth(() =>
    getAuth().api.createInvitation({
      headers: req.headers,
      body: { email: body.email, role, organizationId: actor.organizationId },
    }),
  );
  return Response.json(
    { invitation: { id: invitation.id, email: invitation.email, role: invitation.role, status: invitation.status, expiresAt: invitation.expiresAt } },
    { status: 201 },
  );
});
