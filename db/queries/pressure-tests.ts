import { and, desc, eq, getTableColumns, type SQL } from "drizzle-orm";
import type { Db } from "@/db/client";
import { jobs, pressureTests, user } from "@/db/schema";
import { canReadAllTests } from "@/db/roles";
import type { Viewer } from "./visibility";

export type PressureTestRow = typeof pressureTests.$inferSelect;
export type NewPressureTest = Omit<typeof pressureTests.$inferInsert, "id" | "createdAt">;

/** Nitrogen tests a viewer may see: the same rule as vacuum tests (roles that read all tests see all; others their own). */
export function visiblePressureTestsWhere(viewer: Viewer): SQL {
  const org = eq(pressureTests.organizationId, viewer.organizationId);
  return canReadAllTests(viewer.role) ? org : and(org, eq(pressureTests.createdById, viewer.userId))!;
}

/** The record as answered: every column but the key bookkeeping. */
const { idempotencyKey: _key, requestFingerprint: _fingerprint, ...SHOWN } = getTableColumns(pressureTests);
void _key;
void _fingerprint;

/**
 * Insert a nitrogen test. With an Idempotency-Key, a concurrent twin with the same key (same
 * person, same shop) loses on the unique index: null, and the caller answers with the winner.
 */
export async function createPressureTest(db: Db, params: NewPressureTest & { organizationId: string }) {
  const [row] = await db.insert(pressureTests).values(params).onConflictDoNothing().returning(SHOWN);
  return row ?? null;
}

/** The test a person already made with an Idempotency-Key, with the fingerprint of that request; null when the key is new. */
export async function getPressureTestByKey(db: Db, params: { organizationId: string; userId: string; key: string }) {
  const [row] = await db
    .select({ test: SHOWN, requestFingerprint: pressureTests.requestFingerprint })
    .from(pressureTests)
    .where(and(eq(pressureTests.organizationId, params.organizationId), eq(pressureTests.createdById, params.userId), eq(pressureTests.idempotencyKey, params.key)))
    .limit(1);
  return row ?? null;
}

/** Nitrogen tests the viewer may see, newest first, optionally for one job. */
export async function listPressureTestsByViewer(db: Db, params: { viewer: Viewer; jobId?: string; limit?: number }) {
  const where = params.jobId ? and(visiblePressureTestsWhere(params.viewer), eq(pressureTests.jobId, params.jobId)) : visiblePressureTestsWhere(params.viewer);
  return db
    .select({
      id: pressureTests.id,
      title: pressureTests.title,
      jobId: pressureTests.jobId,
      unit: pressureTests.unit,
      startPressure: pressureTests.startPressure,
      endPressure: pressureTests.endPressure,
      verdict: pressureTests.verdict,
      highestPressure: pressureTests.highestPressure,
      durationSeconds: pressureTests.durationSeconds,
      startedAt: pressureTests.startedAt,
      overPressureAcknowledgedAt: pressureTests.overPressureAcknowledgedAt,
      testedAt: pressureTests.testedAt,
      createdById: pressureTests.createdById,
      createdByName: user.name,
    })
    .from(pressureTests)
    .innerJoin(user, eq(user.id, pressureTests.createdById))
    .where(where)
    .orderBy(desc(pressureTests.testedAt))
    .limit(params.limit ?? 50);
}

/** One nitrogen test the viewer may see; null when unknown, other org or not visible. */
export async function getPressureTestById(db: Db, params: { viewer: Viewer; pressureTestId: string }) {
  const [row] = await db
    .select({ test: SHOWN, createdByName: user.name })
    .from(pressureTests)
    .innerJoin(user, eq(user.id, pressureTests.createdById))
    .where(and(eq(pressureTests.id, params.pressureTestId), visiblePressureTestsWhere(params.viewer)))
    .limit(1);
  return row ?? null;
}

/** Whether a job belongs to the organization (to attach a test to it). */
export async function isJobOfOrganization(db: Db, params: { organizationId: string; jobId: string }) {
  const [row] = await db.select({ id: jobs.id }).from(jobs).where(and(eq(jobs.organizationId, params.organizationId), eq(jobs.id, params.jobId))).limit(1);
  return Boolean(row);
}
