import { z } from "zod";
import { db } from "@/db/client";
import { getInvitationForAcceptById, markEmailVerifiedByUser } from "@/db/queries/invitations";
import { getAuth } from "@/lib/auth";
import { signedInRoute } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { isInvitationKey } from "@/lib/invitation-key";
import { viaAuth } from "../../../members/auth-errors";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().min(1).max(200) });
const body = z.object({ key: z.string().min(1, "open the link from the invitation e-mail").max(200) });

/**
 * POST /api/invitations/:id/accept { key } — the signed-in person joins the shop that invited
 * their address. The key from the mailed link proves they read that mailbox, so their address is
 * marked verified first; better-auth then accepts (it refuses an unverified address). 403 for a
 * wrong key or another address, 404 for an invitation that is not open.
 */
export const POST = signedInRoute({ params, body }, async ({ req, user, params: p, body: b }) => {
  const invitation = await getInvitationForAcceptById(db(), { id: p.id });
  if (!invitation || invitation.status !== "pending" || invitation.expiresAt <= new Date())
    throw new AppError("not_found", "This invitation is not open any more; ask the shop owner for a new one.");
  if (invitation.email.toLowerCase() !== user.email.toLowerCase())
    throw new AppError("forbidden", `This invitation is for ${invitation.email}; you are signed in as ${user.email}.`);
  if (!isInvitationKey(invitation.id, invitation.email, b.key))
    throw new AppError("forbidden", "This link is not the one in the invitation e-mail; open the link from the e-mail itself.", { field: "key" });
  if (!user.emailVerified) await markEmailVerifiedByUser(db(), { userId: user.id, email: invitation.email });
  await viaAuth(() => getAuth().api.acceptInvitation({ headers: req.headers, body: { invitationId: invitation.id } }));
  return { organizationId: invitation.organizationId, organizationName: invitation.organizationName };
});
