import { and, desc, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { shareLinks, user } from "@/db/schema";

export async function insertShareLink(
  db: Db,
  params: { organizationId: string; testId: string; tokenHash: string; expiresAt: Date; createdById: string },
) {
  const [row] = await db.insert(shareLinks).values(params).returning({
    id: shareLinks.id,
    testId: shareLinks.testId,
    expiresAt: shareLinks.expiresAt,
    revokedAt: shareLinks.revokedAt,
    createdAt: shareLinks.createdAt,
  });
  return row;
}

/**
 * The link a token's hash names. The one lookup not scoped by organization: the visitor has
 * none. The caller then reads only that link's test, in that link's organization.
 */
export async function getShareLinkByTokenHash(db: Db, params: { tokenHash: string }) {
  const [row] = await db.select().from(shareLinks).where(eq(shareLinks.tokenHash, params.tokenHash)).limit(1);
  return row ?? null;
}

export async function listShareLinksByTest(db: Db, params: { organizationId: string; testId: string }) {
  return db
    .select({
      id: shareLinks.id,
      expiresAt: shareLinks.expiresAt,
      revokedAt: shareLinks.revokedAt,
      createdAt: shareLinks.createdAt,
      createdByName: user.name,
    })
    .from(shareLinks)
    .innerJoin(user, eq(user.id, shareLinks.createdById))
    .where(and(eq(shareLinks.organizationId, params.organizationId), eq(shareLinks.testId, params.testId)))
    .orderBy(desc(shareLinks.createdAt));
}

/** Revoke one link of a test (idempotent: an already revoked link keeps its first time). */
export async function revokeShareLinkById(db: Db, params: { organizationId: string; testId: string; linkId: string; at: Date }) {
  const [row] = await db
    .select({ id: shareLinks.id, revokedAt: shareLinks.revokedAt })
    .from(shareLinks)
    .where(and(eq(shareLinks.organizationId, params.organizationId), eq(shareLinks.testId, params.testId), eq(shareLinks.id, params.linkId)))
    .limit(1);
  if (!row) return null;
  if (row.revokedAt) return row;
  const [updated] = await db
    .update(shareLinks)
    .set({ revokedAt: params.at })
    .where(and(eq(shareLinks.organizationId, params.organizationId), eq(shareLinks.id, params.linkId)))
    .returning({ id: shareLinks.id, revokedAt: shareLinks.revokedAt });
  return updated;
}
