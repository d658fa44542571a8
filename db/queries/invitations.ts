import { and, eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { invitation, organization, user } from "@/db/schema";

export interface InvitationForAccept {
  id: string;
  email: string;
  role: string | null;
  status: string;
  expiresAt: Date;
  organizationId: string;
  organizationName: string;
  inviterName: string;
}

/**
 * One invitation with its shop and inviter, for the page the e-mailed link opens. Not scoped by
 * organization on purpose: the random id in the link is what the invited person holds.
 */
export async function getInvitationForAcceptById(db: Db, params: { id: string }): Promise<InvitationForAccept | null> {
  const [row] = await db
    .select({
      id: invitation.id,
      email: invitation.email,
      role: invitation.role,
      status: invitation.status,
      expiresAt: invitation.expiresAt,
      organizationId: invitation.organizationId,
      organizationName: organization.name,
      inviterName: user.name,
    })
    .from(invitation)
    .innerJoin(organization, eq(organization.id, invitation.organizationId))
    .innerJoin(user, eq(user.id, invitation.inviterId))
    .where(eq(invitation.id, params.id))
    .limit(1);
  return row ?? null;
}

/** A pending invitation of one organization, or null (also when it belongs to another one). */
export async function getPendingInvitationByOrganization(db: Db, params: { organizationId: string; id: string }) {
  const [row] = await db
    .select({ id: invitation.id, email: invitation.email, role: invitation.role })
    .from(invitation)
    .where(and(eq(invitation.id, params.id), eq(invitation.organizationId, params.organizationId), eq(invitation.status, "pending")))
    .limit(1);
  return row ?? null;
}

/**
 * Marks a user's address verified — only ever after they proved they read it (the invitation
 * link's key, lib/invitation-key.ts). Matches the address too, so a changed address is not.
 */
export async function markEmailVerifiedByUser(db: Db, params: { userId: string; email: string }): Promise<boolean> {
  const rows = await db
    .update(user)
    .set({ emailVerified: true, updatedAt: new Date() })
    .where(and(eq(user.id, params.userId), sql`lower(${user.email}) = ${params.email.trim().toLowerCase()}`))
    .returning({ id: user.id });
  return rows.length === 1;
}
