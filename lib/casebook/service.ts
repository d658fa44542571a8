/** The casebook's steps for the API and pages: read collections, curate them (trainers). */
import type { Db } from "@/db/client";
import {
  deleteCollectionById, deleteEntryById, deletePinById, getCollectionById, getEntryById, getNextEntryOrderByCollection,
  insertCollection, insertEntry, insertPin, listCollectionsByOrganization, listEntriesByCollection, listPinsByEntries,
  updateCollectionById, updateEntryById,
} from "@/db/queries/casebook";
import type { Viewer } from "@/db/queries/visibility";
import { AppError } from "@/lib/errors";
import { hiddenPracticeTestIds } from "@/lib/practice/gate";
import { requireVisibleTest } from "@/lib/vacuum-tests/read";
import { toEntryDto, type CasebookEntryDto, type CasebookPinDto } from "./dto";

export interface CollectionSummary {
  id: string;
  title: string;
  description: string | null;
  isSimulated: boolean;
  entryCount: number;
  createdByName: string;
  createdAt: string;
}

export interface CollectionDetail {
  collection: Omit<CollectionSummary, "entryCount" | "createdByName">;
  entries: CasebookEntryDto[];
}

export async function listCollections(db: Db, viewer: Viewer): Promise<CollectionSummary[]> {
  const rows = await listCollectionsByOrganization(db, { organizationId: viewer.organizationId });
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

async function requireCollection(db: Db, viewer: Viewer, collectionId: string) {
  const c = await getCollectionById(db, { organizationId: viewer.organizationId, collectionId });
  if (!c) throw new AppError("not_found", "No such collection.");
  return c;
}

export async function loadCollection(db: Db, viewer: Viewer, collectionId: string): Promise<CollectionDetail> {
  const c = await requireCollection(db, viewer, collectionId);
  const rows = await listEntriesByCollection(db, { organizationId: viewer.organizationId, collectionId });
  const pins = await listPinsByEntries(db, { organizationId: viewer.organizationId, entryIds: rows.map((r) => r.entry.id) });
  const hidden = await hiddenPracticeTestIds(db, { organizationId: viewer.organizationId, userId: viewer.userId, role: viewer.role, testIds: rows.map((r) => r.entry.testId) });
  const pinsByEntry = new Map<string, CasebookPinDto[]>();
  for (const p of pins) {
    const list = pinsByEntry.get(p.entryId) ?? [];
    list.push({ id: p.id, atSeconds: p.atSeconds, text: p.text });
    pinsByEntry.set(p.entryId, list);
  }
  return {
    collection: { id: c.id, title: c.title, description: c.description, isSimulated: c.isSimulated, createdAt: c.createdAt.toISOString() },
    entries: rows.map((r) => toEntryDto(r, pinsByEntry.get(r.entry.id) ?? [], viewer, hidden.has(r.entry.testId))),
  };
}

export async function createCollection(db: Db, viewer: Viewer, input: { title: string; description?: string | null }) {
  const row = await insertCollection(db, { organizationId: viewer.organizationId, createdById: viewer.userId, title: input.title, description: input.description ?? null });
  return { id: row.id, title: row.title, description: row.description, isSimulated: row.isSimulated, createdAt: row.createdAt.toISOString() };
}

export async function updateCollection(db: Db, viewer: Viewer, collectionId: string, input: { title?: string; description?: string | null }) {
  const row = await updateCollectionById(db, { organizationId: viewer.organizationId, collectionId, ...input });
  if (!row) throw new AppError("not_found", "No such collection.");
  return { id: row.id, title: row.title, description: row.description, isSimulated: row.isSimulated, createdAt: row.createdAt.toISOString() };
}

export async function removeCollection(db: Db, viewer: Viewer, collectionId: string) {
  if (!(await deleteCollectionById(db, { organizationId: viewer.organizationId, collectionId }))) throw new AppError("not_found", "No such collection.");
  return { deleted: true };
}

/** Add a test the trainer can see to a collection (404 for a test of another organization). */
export async function addEntry(db: Db, viewer: Viewer, collectionId: string, input: { testId: string; title: string; notes?: string | null }) {
  await requireCollection(db, viewer, collectionId);
  await requireVisibleTest(db, viewer, input.testId);
  const order = await getNextEntryOrderByCollection(db, { organizationId: viewer.organizationId, collectionId });
  const row = await insertEntry(db, { organizationId: viewer.organizationId, collectionId, testId: input.testId, title: input.title, notes: input.notes ?? null, order });
  return { id: row.id, collectionId, testId: row.testId, title: row.title, notes: row.notes, order: row.order };
}

export async function updateEntry(db: Db, viewer: Viewer, collectionId: string, entryId: string, input: { title?: string; notes?: string | null; order?: number }) {
  const row = await updateEntryById(db, { organizationId: viewer.organizationId, collectionId, entryId, ...input });
  if (!row) throw new AppError("not_found", "No such entry.");
  return { id: row.id, collectionId, testId: row.testId, title: row.title, notes: row.notes, order: row.order };
}

export async function removeEntry(db: Db, viewer: Viewer, collectionId: string, entryId: string) {
  if (!(await deleteEntryById(db, { organizationId: viewer.organizationId, collectionId, entryId }))) throw new AppError("not_found", "No such entry.");
  return { deleted: true };
}

export async function addPin(db: Db, viewer: Viewer, collectionId: string, entryId: string, input: { atSeconds: number; text: string }): Promise<CasebookPinDto> {
  const entry = await getEntryById(db, { organizationId: viewer.organizationId, collectionId, entryId });
  if (!entry) throw new AppError("not_found", "No such entry.");
  const row = await insertPin(db, { organizationId: viewer.organizationId, entryId, atSeconds: input.atSeconds, text: input.text });
  return { id: row.id, atSeconds: row.atSeconds, text: row.text };
}

export async function removePin(db: Db, viewer: Viewer, collectionId: string, entryId: string, pinId: string) {
  const entry = await getEntryById(db, { organizationId: viewer.organizationId, collectionId, entryId });
  if (!entry || !(await deletePinById(db, { organizationId: viewer.organizationId, entryId, pinId }))) throw new AppError("not_found", "No such pin.");
  return { deleted: true };
}
