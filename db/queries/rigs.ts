import { and, asc, desc, eq, type SQL } from "drizzle-orm";
import type { Db } from "@/db/client";
import { member, rigEvents, rigItems, rigReminderNotices, rigs, testRigs, user, vacuumTests } from "@/db/schema";
import { canManageAllRigs, canManageOwnRigs } from "@/db/roles";
import { visibleTestsWhere, type Viewer } from "./visibility";

export type RigRow = typeof rigs.$inferSelect;
export type RigItemRow = typeof rigItems.$inferSelect;
export type RigEventRow = typeof rigEvents.$inferSelect;
export type NewRigItem = Omit<typeof rigItems.$inferInsert, "id" | "organizationId" | "rigId" | "createdAt">;
export type NewRigEvent = Omit<typeof rigEvents.$inferInsert, "id" | "organizationId" | "rigId" | "createdAt">;

/**
 * The row filter for rigs a viewer may see: always their organization; owners and leads every rig
 * of it, everyone else the rigs they keep (lib/rigs/access.ts).
 */
export function visibleRigsWhere(viewer: Viewer): SQL {
  const org = eq(rigs.organizationId, viewer.organizationId);
  return canManageAllRigs(viewer.role) ? org : and(org, eq(rigs.keeperId, viewer.userId))!;
}

/** The filter for rigs a viewer may change: owners and leads every rig; technicians the ones they keep; others none. */
function manageableRigsWhere(viewer: Viewer): SQL | null {
  if (!canManageOwnRigs(viewer.role)) return null;
  return visibleRigsWhere(viewer);
}

const rigColumns = {
  id: rigs.id,
  name: rigs.name,
  truck: rigs.truck,
  keeperId: rigs.keeperId,
  keeperName: user.name,
  notes: rigs.notes,
  createdAt: rigs.createdAt,
};

/** Rigs the viewer may see, by name. */
export async function listRigsByViewer(db: Db, params: { viewer: Viewer }) {
  return db
    .select(rigColumns)
    .from(rigs)
    .leftJoin(user, eq(user.id, rigs.keeperId))
    .where(visibleRigsWhere(params.viewer))
    .orderBy(asc(rigs.name));
}

/** One rig the viewer may see; null when unknown, of another organization or not theirs. */
export async function getRigById(db: Db, params: { viewer: Viewer; rigId: string }) {
  const [row] = await db
    .select(rigColumns)
    .from(rigs)
    .leftJoin(user, eq(user.id, rigs.keeperId))
    .where(and(eq(rigs.id, params.rigId), visibleRigsWhere(params.viewer)))
    .limit(1);
  return row ?? null;
}

/** Whether the viewer may change this rig: "manage", "read" (sees it only) or null (404). */
export async function getRigAccessById(db: Db, params: { viewer: Viewer; rigId: string }): Promise<"manage" | "read" | null> {
  const rig = await getRigById(db, params);
  if (!rig) return null;
  return manageableRigsWhere(params.viewer) ? "manage" : "read";
}

/** Whether a user is a member of the organization (to keep a rig there). */
export async function isMemberOfOrganization(db: Db, params: { organizationId: string; userId: string }) {
  const [row] = await db
    .select({ id: member.id })
    .from(member)
    .where(and(eq(member.organizationId, params.organizationId), eq(member.userId, params.userId)))
    .limit(1);
  return Boolean(row);
}

export async function createRig(
  db: Db,
  params: { organizationId: string; createdById: string; name: string; truck?: string | null; keeperId: string | null; notes?: string | null },
) {
  const [row] = await db.insert(rigs).values(params).returning();
  return row;
}

/** Update a rig the viewer may manage; null when not found or not theirs to change. */
export async function updateRigById(
  db: Db,
  params: { viewer: Viewer; rigId: string; values: Partial<Pick<RigRow, "name" | "truck" | "keeperId" | "notes">> },
) {
  const where = manageableRigsWhere(params.viewer);
  if (!where) return null;
  const [row] = await db.update(rigs).set(params.values).where(and(eq(rigs.id, params.rigId), where)).returning();
  return row ?? null;
}

export async function deleteRigById(db: Db, params: { viewer: Viewer; rigId: string }) {
  const where = manageableRigsWhere(params.viewer);
  if (!where) return false;
  const rows = await db.delete(rigs).where(and(eq(rigs.id, params.rigId), where)).returning({ id: rigs.id });
  return rows.length > 0;
}

/** Items of one rig (the caller has checked the rig is visible). */
export async function listRigItemsByRig(db: Db, params: { organizationId: string; rigId: string }) {
  return db
    .select()
    .from(rigItems)
    .where(and(eq(rigItems.organizationId, params.organizationId), eq(rigItems.rigId, params.rigId)))
    .orderBy(asc(rigItems.kind), asc(rigItems.createdAt));
}

export async function getRigItemById(db: Db, params: { organizationId: string; rigId: string; itemId: string }) {
  const [row] = await db
    .select()
    .from(rigItems)
    .where(and(eq(rigItems.organizationId, params.organizationId), eq(rigItems.rigId, params.rigId), eq(rigItems.id, params.itemId)))
    .limit(1);
  return row ?? null;
}

export async function createRigItem(db: Db, params: { organizationId: string; rigId: string; values: NewRigItem }) {
  const [row] = await db.insert(rigItems).values({ ...params.values, organizationId: params.organizationId, rigId: params.rigId }).returning();
  return row;
}

export async function updateRigItemById(db: Db, params: { organizationId: string; rigId: string; itemId: string; values: Partial<NewRigItem> }) {
  const [row] = await db
    .update(rigItems)
    .set(params.values)
    .where(and(eq(rigItems.organizationId, params.organizationId), eq(rigItems.rigId, params.rigId), eq(rigItems.id, params.itemId)))
    .returning();
  return row ?? null;
}

export async function deleteRigItemById(db: Db, params: { organizationId: string; rigId: string; itemId: string }) {
  const rows = await db
    .delete(rigItems)
    .where(and(eq(rigItems.organizationId, params.organizationId), eq(rigItems.rigId, params.rigId), eq(rigItems.id, params.itemId)))
    .returning({ id: rigItems.id });
  return rows.length > 0;
}

/** Events of one rig, newest first. */
export async function listRigEventsByRig(db: Db, params: { organizationId: string; rigId: string; limit?: number }) {
  return db
    .select()
    .from(rigEvents)
    .where(and(eq(rigEvents.organizationId, params.organizationId), eq(rigEvents.rigId, params.rigId)))
    .orderBy(desc(rigEvents.occurredOn), desc(rigEvents.createdAt))
    .limit(params.limit ?? 200);
}

export async function createRigEvent(db: Db, params: { organizationId: string; rigId: string; values: NewRigEvent }) {
  const [row] = await db.insert(rigEvents).values({ ...params.values, organizationId: params.organizationId, rigId: params.rigId }).returning();
  return row;
}

/** Record which rig a test was made with (replaces an earlier choice). The caller checks both are visible. */
export async function upsertTestRig(db: Db, params: { organizationId: string; testId: string; rigId: string }) {
  await db
    .insert(testRigs)
    .values(params)
    .onConflictDoUpdate({ target: testRigs.testId, set: { rigId: params.rigId, createdAt: new Date() } });
}

/**
 * The rig a test the viewer may see was made with, or null (test not visible, or no rig recorded).
 * Seeing the test is enough to see the rig it used: that is how "target not reached" points to it.
 */
export async function getRigByTest(db: Db, params: { viewer: Viewer; testId: string }) {
  const [row] = await db
    .select(rigColumns)
    .from(testRigs)
    .innerJoin(vacuumTests, and(eq(vacuumTests.id, testRigs.testId), eq(vacuumTests.organizationId, testRigs.organizationId)))
    .innerJoin(rigs, and(eq(rigs.id, testRigs.rigId), eq(rigs.organizationId, testRigs.organizationId)))
    .leftJoin(user, eq(user.id, rigs.keeperId))
    .where(and(eq(testRigs.organizationId, params.viewer.organizationId), eq(testRigs.testId, params.testId), visibleTestsWhere(params.viewer)))
    .limit(1);
  return row ?? null;
}

/** Whether the viewer may see a vacuum test (to link a rig to it). */
export async function isTestVisible(db: Db, params: { viewer: Viewer; testId: string }) {
  const [row] = await db.select({ id: vacuumTests.id }).from(vacuumTests).where(and(eq(vacuumTests.id, params.testId), visibleTestsWhere(params.viewer))).limit(1);
  return Boolean(row);
}

/** Organizations that keep rigs with items (the reminder job's first step; a system job across shops). */
export async function listOrganizationsWithRigItems(db: Db): Promise<string[]> {
  const rows = await db.selectDistinct({ organizationId: rigItems.organizationId }).from(rigItems);
  return rows.map((r) => r.organizationId);
}

/** Every rig of an organization with its keeper's e-mail (the reminder job reads them all). */
export async function listRigsWithKeeperByOrganization(db: Db, params: { organizationId: string }) {
  return db
    .select({ id: rigs.id, name: rigs.name, keeperId: rigs.keeperId, keeperEmail: user.email })
    .from(rigs)
    .leftJoin(member, and(eq(member.userId, rigs.keeperId), eq(member.organizationId, rigs.organizationId)))
    .leftJoin(user, eq(user.id, member.userId))
    .where(eq(rigs.organizationId, params.organizationId))
    .orderBy(asc(rigs.name));
}

/** The reminders already e-mailed for a rig, as "itemId code". */
export async function listRigReminderNoticesByRig(db: Db, params: { organizationId: string; rigId: string }): Promise<Set<string>> {
  const rows = await db
    .select({ itemId: rigReminderNotices.itemId, code: rigReminderNotices.code })
    .from(rigReminderNotices)
    .where(and(eq(rigReminderNotices.organizationId, params.organizationId), eq(rigReminderNotices.rigId, params.rigId)));
  return new Set(rows.map((r) => `${r.itemId} ${r.code}`));
}

/** Record reminders just e-mailed and forget those that no longer stand (so they mail again if they return). */
export async function updateRigReminderNoticesByRig(
  db: Db,
  params: { organizationId: string; rigId: string; added: { itemId: string; code: string }[]; cleared: { itemId: string; code: string }[] },
): Promise<void> {
  if (params.added.length)
    await db.insert(rigReminderNotices).values(params.added.map((a) => ({ organizationId: params.organizationId, rigId: params.rigId, ...a }))).onConflictDoNothing();
  for (const c of params.cleared)
    await db
      .delete(rigReminderNotices)
      .where(and(eq(rigReminderNotices.organizationId, params.organizationId), eq(rigReminderNotices.itemId, c.itemId), eq(rigReminderNotices.code, c.code)));
}
