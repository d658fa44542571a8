/** The shop's mail settings and each member's opt-outs, always scoped by organization. */
import { and, eq, inArray, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { mailOptOuts, member, organizationSettings, user, type MailKind } from "@/db/schema";

export interface ShopMailSettings {
  senderName: string | null;
  /** User ids chosen to receive review mail; empty: every lead (owners when there is no lead). */
  reviewMailTo: string[];
}

export async function getShopMailSettings(db: Db, params: { organizationId: string }): Promise<ShopMailSettings> {
  const [row] = await db
    .select({ senderName: organizationSettings.mailSenderName, reviewMailTo: organizationSettings.reviewMailTo })
    .from(organizationSettings)
    .where(eq(organizationSettings.organizationId, params.organizationId))
    .limit(1);
  return { senderName: row?.senderName ?? null, reviewMailTo: row?.reviewMailTo ?? [] };
}

/** Ids of the organization's members among `userIds` (a chosen recipient must belong to the shop). */
export async function listMemberIdsAmong(db: Db, params: { organizationId: string; userIds: string[] }): Promise<string[]> {
  if (!params.userIds.length) return [];
  const rows = await db
    .select({ userId: member.userId })
    .from(member)
    .where(and(eq(member.organizationId, params.organizationId), inArray(member.userId, params.userIds)));
  return rows.map((r) => r.userId);
}

export async function upsertShopMailSettings(db: Db, params: { organizationId: string } & ShopMailSettings): Promise<void> {
  const set = { mailSenderName: params.senderName, reviewMailTo: params.reviewMailTo.length ? params.reviewMailTo : null };
  await db
    .insert(organizationSettings)
    .values({ organizationId: params.organizationId, ...set })
    .onConflictDoUpdate({ target: organizationSettings.organizationId, set: { ...set, updatedAt: sql`now()` } });
}

export async function listMailOptOuts(db: Db, params: { organizationId: string; userId: string }): Promise<MailKind[]> {
  const rows = await db
    .select({ kind: mailOptOuts.kind })
    .from(mailOptOuts)
    .where(and(eq(mailOptOuts.organizationId, params.organizationId), eq(mailOptOuts.userId, params.userId)));
  return rows.map((r) => r.kind);
}

/** Replace a member's opt-outs with `off` (their own settings page). */
export async function replaceMailOptOuts(db: Db, params: { organizationId: string; userId: string; off: MailKind[] }): Promise<void> {
  await db.delete(mailOptOuts).where(and(eq(mailOptOuts.organizationId, params.organizationId), eq(mailOptOuts.userId, params.userId)));
  if (params.off.length) await db.insert(mailOptOuts).values(params.off.map((kind) => ({ organizationId: params.organizationId, userId: params.userId, kind, via: "settings" as const })));
}

/** Turn one kind off (an unsubscribe link); true when the person is still a member of the shop. */
export async function addMailOptOut(db: Db, params: { organizationId: string; userId: string; kind: MailKind }): Promise<boolean> {
  const [m] = await db.select({ id: member.id }).from(member).where(and(eq(member.organizationId, params.organizationId), eq(member.userId, params.userId))).limit(1);
  if (!m) return false;
  await db.insert(mailOptOuts).values({ ...params, via: "unsubscribe" }).onConflictDoNothing();
  return true;
}

/**
 * At send time: the member an address belongs to in this shop, whether they turned `kind` off,
 * and the shop's sender name.
 */
export async function getMailRecipientState(db: Db, params: { organizationId: string; email: string; kind: MailKind | null }) {
  const [m] = await db
    .select({ userId: user.id })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .where(and(eq(member.organizationId, params.organizationId), eq(sql`lower(${user.email})`, params.email.toLowerCase())))
    .limit(1);
  const { senderName } = await getShopMailSettings(db, params);
  if (!m || !params.kind) return { userId: m?.userId ?? null, off: false, senderName };
  const [o] = await db
    .select({ kind: mailOptOuts.kind })
    .from(mailOptOuts)
    .where(and(eq(mailOptOuts.organizationId, params.organizationId), eq(mailOptOuts.userId, m.userId), eq(mailOptOuts.kind, params.kind)))
    .limit(1);
  return { userId: m.userId, off: !!o, senderName };
}
