import { and, desc, eq, gte, lt, lte, or, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { analyses, idempotencyKeys, sites, systems, uploads, user, vacuumTests, jobs } from "@/db/schema";
import { visibleTestsWhere, type Viewer } from "./visibility";

export type TestRow = typeof vacuumTests.$inferSelect;
export type NewTestRow = typeof vacuumTests.$inferInsert;

/** Insert a test; the id is chosen by the caller (it names the raw file's key). */
export async function insertTest(db: Db, params: NewTestRow & { id: string; organizationId: string }) {
  const [row] = await db.insert(vacuumTests).values(params).returning();
  return row;
}

const detailColumns = {
  test: vacuumTests,
  createdByName: user.name,
  siteName: sites.name,
  systemName: systems.name,
  jobReference: jobs.reference,
  jobVisitedOn: jobs.visitedOn,
  jobReason: jobs.reason,
};

/** One test the viewer may see, with its names; null when unknown, other org or not visible. */
export async function getTestById(db: Db, params: { viewer: Viewer; testId: string }) {
  const [row] = await db
    .select(detailColumns)
    .from(vacuumTests)
    .innerJoin(user, eq(user.id, vacuumTests.createdById))
    .leftJoin(sites, and(eq(sites.id, vacuumTests.siteId), eq(sites.organizationId, vacuumTests.organizationId)))
    .leftJoin(systems, and(eq(systems.id, vacuumTests.systemId), eq(systems.organizationId, vacuumTests.organizationId)))
    .leftJoin(jobs, and(eq(jobs.id, vacuumTests.jobId), eq(jobs.organizationId, vacuumTests.organizationId)))
    .where(and(eq(vacuumTests.id, params.testId), visibleTestsWhere(params.viewer)))
    .limit(1);
  return row ?? null;
}
export type TestDetailRow = NonNullable<Awaited<ReturnType<typeof getTestById>>>;

/** Lock one test row of the organization for an update in this transaction (re-analysis). */
export async function lockTestById(db: Db, params: { organizationId: string; testId: string }) {
  const [row] = await db
    .select({ id: vacuumTests.id })
    .from(vacuumTests)
    .where(and(eq(vacuumTests.organizationId, params.organizationId), eq(vacuumTests.id, params.testId)))
    .for("update");
  return row ?? null;
}

export async function updateTestCurrentAnalysis(db: Db, params: { organizationId: string; testId: string; analysisId: string; verdict: string }) {
  await db
    .update(vacuumTests)
    .set({ currentAnalysisId: params.analysisId, verdict: params.verdict, updatedAt: new Date() })
    .where(and(eq(vacuumTests.organizationId, params.organizationId), eq(vacuumTests.id, params.testId)));
}

export interface TestListFilters {
  verdict?: string;
  technicianId?: string;
  siteId?: string;
  from?: Date;
  to?: Date;
  isPractice?: boolean;
  /** Continue after this (testedAt as PostgreSQL text, id). */
  after?: { testedAt: string; id: string };
  limit: number;
}

/**
 * Tests the viewer may see, newest first (testedAt, then id), with the current analysis'
 * headline numbers and finding codes. Returns up to limit + 1 rows so the caller knows if more follow.
 */
export async function listTestsByOrganization(db: Db, params: { viewer: Viewer; filters: TestListFilters }) {
  const f = params.filters;
  const conds = [visibleTestsWhere(params.viewer)];
  if (f.verdict) conds.push(eq(vacuumTests.verdict, f.verdict));
  if (f.technicianId) conds.push(eq(vacuumTests.createdById, f.technicianId));
  if (f.siteId) conds.push(eq(vacuumTests.siteId, f.siteId));
  if (f.from) conds.push(gte(vacuumTests.testedAt, f.from));
  if (f.to) conds.push(lte(vacuumTests.testedAt, f.to));
  if (f.isPractice !== undefined) conds.push(eq(vacuumTests.isPractice, f.isPractice));
  if (f.after) {
    const at = sql`${f.after.testedAt}::timestamptz`;
    conds.push(or(lt(vacuumTests.testedAt, at), and(eq(vacuumTests.testedAt, at), lt(vacuumTests.id, f.after.id)))!);
  }
  return db
    .select({
      id: vacuumTests.id,
      title: vacuumTests.title,
      verdict: vacuumTests.verdict,
      status: vacuumTests.status,
      testedAt: vacuumTests.testedAt,
      testedAtKey: sql<string>`${vacuumTests.testedAt}::text`,
      isPractice: vacuumTests.isPractice,
      technicianId: vacuumTests.createdById,
      technicianName: user.name,
      siteId: sites.id,
      siteName: sites.name,
      systemName: systems.name,
      confidence: analyses.confidence,
      startMicrons: sql<number | null>`(${analyses.result}->'decay'->>'startMicrons')::float8`,
      endMicrons: sql<number | null>`(${analyses.result}->'decay'->>'endMicrons')::float8`,
      leakRateMicronsPerMinute: sql<number | null>`(${analyses.result}->'decay'->>'leakRateMicronsPerMinute')::float8`,
      findingCodes: sql<string[]>`coalesce(array(select f.code from findings f where f.analysis_id = ${analyses.id} order by f.code), '{}')`,
    })
    .from(vacuumTests)
    .innerJoin(user, eq(user.id, vacuumTests.createdById))
    .leftJoin(sites, and(eq(sites.id, vacuumTests.siteId), eq(sites.organizationId, vacuumTests.organizationId)))
    .leftJoin(systems, and(eq(systems.id, vacuumTests.systemId), eq(systems.organizationId, vacuumTests.organizationId)))
    .leftJoin(analyses, eq(analyses.id, vacuumTests.currentAnalysisId))
    .where(and(...conds))
    .orderBy(desc(vacuumTests.testedAt), desc(vacuumTests.id))
    .limit(f.limit + 1);
}

/** How many tests an organization has (the seed skips an organization that has some). */
export async function countTestsByOrganization(db: Db, params: { organizationId: string }): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(vacuumTests)
    .where(eq(vacuumTests.organizationId, params.organizationId));
  return row?.n ?? 0;
}

/** The test an idempotency key already produced in this organization, if any. */
export async function getIdempotencyKeyByKey(db: Db, params: { organizationId: string; key: string }) {
  const [row] = await db
    .select({ testId: idempotencyKeys.testId, userId: idempotencyKeys.userId, analysisId: idempotencyKeys.analysisId })
    .from(idempotencyKeys)
    .where(and(eq(idempotencyKeys.organizationId, params.organizationId), eq(idempotencyKeys.key, params.key)))
    .limit(1);
  return row ?? null;
}

/**
 * Claim an idempotency key for a test inside the upload's transaction. Returns false when the
 * key is taken: a concurrent insert of the same primary key waits for the other transaction
 * and then conflicts, so two identical requests can never both commit.
 */
export async function insertIdempotencyKey(
  db: Db,
  params: { organizationId: string; key: string; userId: string; testId: string; analysisId?: string | null },
): Promise<boolean> {
  const rows = await db.insert(idempotencyKeys).values(params).onConflictDoNothing().returning({ key: idempotencyKeys.key });
  return rows.length === 1;
}

export async function insertUpload(db: Db, params: typeof uploads.$inferInsert) {
  const [row] = await db.insert(uploads).values(params).returning();
  return row;
}

/** The test's current raw file: the newest upload (a re-test adds one; earlier files stay stored). */
export async function getUploadByTest(db: Db, params: { organizationId: string; testId: string }) {
  const [row] = await db
    .select()
    .from(uploads)
    .where(and(eq(uploads.organizationId, params.organizationId), eq(uploads.testId, params.testId)))
    .orderBy(desc(uploads.createdAt), desc(uploads.id))
    .limit(1);
  return row ?? null;
}

/** Record which analysis a claimed key made (a re-test: claimed first, the analysis inserted after). */
export async function updateIdempotencyKeyAnalysis(db: Db, params: { organizationId: string; key: string; analysisId: string }): Promise<void> {
  await db
    .update(idempotencyKeys)
    .set({ analysisId: params.analysisId })
    .where(and(eq(idempotencyKeys.organizationId, params.organizationId), eq(idempotencyKeys.key, params.key)));
}
