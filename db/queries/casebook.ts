/**
 * The training casebook: collections, entries (a test with a trainer's title and notes) and
 * pins on an entry's curve. Every query is scoped by organization inside the query. The rows
 * carry the test's customer and site details; lib/casebook/dto.ts strips them by role.
 */
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import {
  analyses, casebookCollections, casebookEntries, casebookPins, customers, jobs, sites, systems, user, vacuumTests,
} from "@/db/schema";

export type CollectionRow = typeof casebookCollections.$inferSelect;

/** Collections of the organization, newest first, with their entry counts. */
export async function listCollectionsByOrganization(db: Db, params: { organizationId: string }) {
  return db
    .select({
      id: casebookCollections.id,
      title: casebookCollections.title,
      description: casebookCollections.description,
      isSimulated: casebookCollections.isSimulated,
      createdAt: casebookCollections.createdAt,
      createdByName: user.name,
      entryCount: sql<number>`(select count(*)::int from ${casebookEntries} e where e.collection_id = ${casebookCollections.id} and e.organization_id = ${casebookCollections.organizationId})`,
    })
    .from(casebookCollections)
    .innerJoin(user, eq(user.id, casebookCollections.createdById))
    .where(eq(casebookCollections.organizationId, params.organizationId))
    .orderBy(sql`${casebookCollections.createdAt} desc`, asc(casebookCollections.id));
}

export async function getCollectionById(db: Db, params: { organizationId: string; collectionId: string }) {
  const [row] = await db
    .select()
    .from(casebookCollections)
    .where(and(eq(casebookCollections.organizationId, params.organizationId), eq(casebookCollections.id, params.collectionId)))
    .limit(1);
  return row ?? null;
}

export async function getCollectionBySeedKey(db: Db, params: { organizationId: string; seedKey: string }) {
  const [row] = await db
    .select()
    .from(casebookCollections)
    .where(and(eq(casebookCollections.organizationId, params.organizationId), eq(casebookCollections.seedKey, params.seedKey)))
    .limit(1);
  return row ?? null;
}

export async function insertCollection(
  db: Db,
  params: { organizationId: string; createdById: string; title: string; description?: string | null; isSimulated?: boolean; seedKey?: string | null },
) {
  const [row] = await db.insert(casebookCollections).values(params).returning();
  return row;
}

/** Returns the updated row, or null when the collection is not in the organization. */
export async function updateCollectionById(db: Db, params: { organizationId: string; collectionId: string; title?: string; description?: string | null }) {
  const set: Partial<CollectionRow> = { updatedAt: new Date() };
  if (params.title !== undefined) set.title = params.title;
  if (params.description !== undefined) set.description = params.description;
  const [row] = await db
    .update(casebookCollections)
    .set(set)
    .where(and(eq(casebookCollections.organizationId, params.organizationId), eq(casebookCollections.id, params.collectionId)))
    .returning();
  return row ?? null;
}

export async function deleteCollectionById(db: Db, params: { organizationId: string; collectionId: string }): Promise<boolean> {
  const rows = await db
    .delete(casebookCollections)
    .where(and(eq(casebookCollections.organizationId, params.organizationId), eq(casebookCollections.id, params.collectionId)))
    .returning({ id: casebookCollections.id });
  return rows.length === 1;
}

/**
 * The entries of a collection in order, each with its test's current analysis (result and
 * chart series) and the test's customer, site, system and job details (for the DTO to strip).
 */
export async function listEntriesByCollection(db: Db, params: { organizationId: string; collectionId: string }) {
  return db
    .select({
      entry: casebookEntries,
      testTitle: vacuumTests.title,
      testNotes: vacuumTests.notes,
      testRigNote: vacuumTests.rigNote,
      testCreatedById: vacuumTests.createdById,
      testIsPractice: vacuumTests.isPractice,
      testedAt: vacuumTests.testedAt,
      refrigerant: vacuumTests.refrigerant,
      lineSetFeet: vacuumTests.lineSetFeet,
      technicianName: user.name,
      siteName: sites.name,
      siteAddress: sites.address,
      customerName: customers.name,
      systemName: systems.name,
      jobReference: jobs.reference,
      result: analyses.result,
      series: analyses.series,
    })
    .from(casebookEntries)
    .innerJoin(vacuumTests, and(eq(vacuumTests.id, casebookEntries.testId), eq(vacuumTests.organizationId, casebookEntries.organizationId)))
    .innerJoin(user, eq(user.id, vacuumTests.createdById))
    .leftJoin(analyses, and(eq(analyses.id, vacuumTests.currentAnalysisId), eq(analyses.organizationId, vacuumTests.organizationId)))
    .leftJoin(sites, and(eq(sites.id, vacuumTests.siteId), eq(sites.organizationId, vacuumTests.organizationId)))
    .leftJoin(customers, and(eq(customers.id, sites.customerId), eq(customers.organizationId, vacuumTests.organizationId)))
    .leftJoin(systems, and(eq(systems.id, vacuumTests.systemId), eq(systems.organizationId, vacuumTests.organizationId)))
    .leftJoin(jobs, and(eq(jobs.id, vacuumTests.jobId), eq(jobs.organizationId, vacuumTests.organizationId)))
    .where(and(eq(casebookEntries.organizationId, params.organizationId), eq(casebookEntries.collectionId, params.collectionId)))
    .orderBy(asc(casebookEntries.order), asc(casebookEntries.createdAt));
}
export type EntryDetailRow = Awaited<ReturnType<typeof listEntriesByCollection>>[number];

export async function getEntryById(db: Db, params: { organizationId: string; collectionId: string; entryId: string }) {
  const [row] = await db
    .select()
    .from(casebookEntries)
    .where(and(eq(casebookEntries.organizationId, params.organizationId), eq(casebookEntries.collectionId, params.collectionId), eq(casebookEntries.id, params.entryId)))
    .limit(1);
  return row ?? null;
}

/** The next order number in a collection (entries are appended). */
export async function getNextEntryOrderByCollection(db: Db, params: { organizationId: string; collectionId: string }): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`coalesce(max(${casebookEntries.order}) + 1, 0)::int` })
    .from(casebookEntries)
    .where(and(eq(casebookEntries.organizationId, params.organizationId), eq(casebookEntries.collectionId, params.collectionId)));
  return row?.n ?? 0;
}

export async function insertEntry(
  db: Db,
  params: { organizationId: string; collectionId: string; testId: string; title: string; notes?: string | null; order: number },
) {
  const [row] = await db.insert(casebookEntries).values(params).returning();
  return row;
}

export async function updateEntryById(
  db: Db,
  params: { organizationId: string; collectionId: string; entryId: string; title?: string; notes?: string | null; order?: number },
) {
  const set: Partial<typeof casebookEntries.$inferInsert> = {};
  if (params.title !== undefined) set.title = params.title;
  if (params.notes !== undefined) set.notes = params.notes;
  if (params.order !== undefined) set.order = params.order;
  if (Object.keys(set).length === 0) return getEntryById(db, params);
  const [row] = await db
    .update(casebookEntries)
    .set(set)
    .where(and(eq(casebookEntries.organizationId, params.organizationId), eq(casebookEntries.collectionId, params.collectionId), eq(casebookEntries.id, params.entryId)))
    .returning();
  return row ?? null;
}

export async function deleteEntryById(db: Db, params: { organizationId: string; collectionId: string; entryId: string }): Promise<boolean> {
  const rows = await db
    .delete(casebookEntries)
    .where(and(eq(casebookEntries.organizationId, params.organizationId), eq(casebookEntries.collectionId, params.collectionId), eq(casebookEntries.id, params.entryId)))
    .returning({ id: casebookEntries.id });
  return rows.length === 1;
}

/** Pins of the given entries, earliest on the curve first. */
export async function listPinsByEntries(db: Db, params: { organizationId: string; entryIds: string[] }) {
  if (params.entryIds.length === 0) return [];
  return db
    .select()
    .from(casebookPins)
    .where(and(eq(casebookPins.organizationId, params.organizationId), inArray(casebookPins.entryId, params.entryIds)))
    .orderBy(asc(casebookPins.atSeconds), asc(casebookPins.createdAt));
}

export async function insertPin(db: Db, params: { organizationId: string; entryId: string; atSeconds: number; text: string }) {
  const [row] = await db.insert(casebookPins).values(params).returning();
  return row;
}

export async function deletePinById(db: Db, params: { organizationId: string; entryId: string; pinId: string }): Promise<boolean> {
  const rows = await db
    .delete(casebookPins)
    .where(and(eq(casebookPins.organizationId, params.organizationId), eq(casebookPins.entryId, params.entryId), eq(casebookPins.id, params.pinId)))
    .returning({ id: casebookPins.id });
  return rows.length === 1;
}
