import { and, eq, asc } from "drizzle-orm";
import type { Db } from "@/db/client";
import { member, user, invitation, organization } from "@/db/schema";
import { isRole, type Role } from "@/db/roles";

export interface Membership {
  organizationId: string;
  organizationName: string;
  role: Role;
}

/** The caller's membership in one organization, or null when not a member. */
export async function getMembershipByUser(
  db: Db,
  params: { organizationId: string; userId: string },
): Promise<Membership | null> {
  const [row] = await db
    .select({ organizationId: member.organizationId, role: member.role, organizationName: organization.name })
    .from(member)
    .innerJoin(organization, eq(organization.id, member.organizationId))
    .where(and(eq(member.organizationId, params.organizationId), eq(member.userId, params.userId)))
    .limit(1);
  if (!row || !isRole(row.role)) return null;
  return { organizationId: row.organizationId, organizationName: row.organizationName, role: row.role };
}

/** Every membership of a user, oldest first. */
export async function listMembershipsByUser(db: Db, params: { userId: string }): Promise<Membership[]> {
  const rows = await db
    .select({ organizationId: member.organizationId, role: member.role, organizationName: organization.name })
    .from(member)
    .innerJoin(organization, eq(organization.id, member.organizationId))
    .where(eq(member.userId, params.userId))
    .orderBy(asc(member.createdAt));
  return rows.filter((r) => isRole(r.role)).map((r) => ({ ...r, role: r.role as Role }));
}

/** Members of one organization with their names and roles. */
export async function listMembersByOrganization(db: Db, params: { organizationId: string }) {
  return db
    .select({ userId: member.userId, role: member.role, name: user.name, email: user.email, joinedAt: member.createdAt })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .where(eq(member.organizationId, params.organizationId))
    .orderBy(asc(user.name));
}

/** Pending invitations of one organization. */
export async function listInvitationsByOrganization(db: Db, params: { organizationId: string }) {
  return db
    .select({ id: invitation.id, email: invitation.email, role: invitation.role, status: invitation.status, expiresAt: invitation.expiresAt })
    .from(invitation)
    .where(and(eq(invitation.organizationId, params.organizationId), eq(invitation.status, "pending")))
    .orderBy(asc(invitation.email));
}
