import { and, desc, eq, gte, inArray, lt, lte, or, sql } from "drizzle-orm";
import { getTableConfig } from "drizzle-orm/pg-core";
import type { Db } from "@/db/client";
import { analyses, findings, idempotencyKeys, mailOutbox, sites, systems, testEvents, uploads, user, vacuumTests, jobs } from "@/db/schema";
import { visibleTestsWhere, type Viewer } from "./visibility";
import type { Verdict } from "@/db/vocabulary";

export type VacuumTestRow = typeof vacuumTests.$inferSelect;
export type NewVacuumTestRow = typeof vacuumTests.$inferInsert;

/** Insert a test; the id is chosen by the caller (it names the raw file's key). */
export async function insertTest(db: Db, params: NewVacuumTestRow & { id: string; organizationId: string }) {
  const [row] = await db.insert(vacuumTests).values(params).returning();
  return row;
}

/** Everything a new test is written with; each id is the caller's, so rows can name each other. */
export interface NewVacuumTestRows {
  test: NewVacuumTestRow & { id: string; organizationId: string };
  upload: typeof uploads.$inferInsert;
  analysis: typeof analyses.$inferInsert & { id: string };
  findings: (typeof findings.$inferInsert)[];
  events: (typeof testEvents.$inferInsert)[];
  mails: (typeof mailOutbox.$inferInsert & { id: string })[];
  idempotencyKey: typeof idempotencyKeys.$inferInsert | null;
}

/**
 * A new test and every row that goes with it, in one statement and one round trip: the test's
 * INSERT … RETURNING carries the other INSERTs as data-modifying WITH queries. PostgreSQL runs
 * each of them exactly once and to completion, checks the foreign keys between them at the end
 * of the statement, and any error aborts the whole statement, so it is as atomic as the
 * separate inserts were (PostgreSQL manual, "Data-Modifying Statements in WITH"). An
 * Idempotency-Key already taken fails it with a unique violation (see isIdempotencyKeyTaken).
 */
export async function insertNewTestTogether(db: Db, rows: NewVacuumTestRows) {
  const parts = [
    db.$with("new_upload").as(db.insert(uploads).values(rows.upload)),
    db.$with("new_analysis").as(db.insert(analyses).values(rows.analysis)),
    ...(rows.findings.length ? [db.$with("new_findings").as(db.insert(findings).values(rows.findings))] : []),
    ...(rows.events.length ? [db.$with("new_events").as(db.insert(testEvents).values(rows.events))] : []),
    ...(rows.mails.length ? [db.$with("new_mail").as(db.insert(mailOutbox).values(rows.mails))] : []),
    ...(rows.idempotencyKey ? [db.$with("new_key").as(db.insert(idempotencyKeys).values(rows.idempotencyKey))] : []),
  ];
  const [row] = await db.with(...parts).insert(vacuumTests).values(rows.test).returning();
  return row;
}

/** The key's primary key as the schema names it (organization_id, key). */
const idempotencyKeyConstraint = getTableConfig(idempotencyKeys).primaryKeys[0].getName();

/** The error of insertNewTestTogether when another request already holds its Idempotency-Key. */
export function isIdempotencyKeyTaken(err: unknown): boolean {
  for (let e = err as { code?: string; constraint?: string; cause?: unknown } | undefined; e; e = e.cause as typeof e) {
    if (e.code === "23505" && e.constraint === idempotencyKeyConstraint) return true;
  }
  return false;
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
export type VacuumTestDetailRow = NonNullable<Awaited<ReturnType<typeof getTestById>>>;

/** Lock one test row of the organization for an update in this transaction (re-analysis). */
export async function lockTestById(db: Db, params: { organizationId: string; testId: string }) {
  const [row] = await db
    .select({ id: vacuumTests.id })
    .from(vacuumTests)
    .where(and(eq(vacuumTests.organizationId, params.organizationId), eq(vacuumTests.id, params.testId)))
    .for("update");
  return row ?? null;
}

export async function updateTestCurrentAnalysis(db: Db, params: { organizationId: string; testId: string; analysisId: string; verdict: Verdict }) {
  await db
    .update(vacuumTests)
    .set({ currentAnalysisId: params.analysisId, verdict: params.verdict, updatedAt: new Date() })
    .where(and(eq(vacuumTests.organizationId, params.organizationId), eq(vacuumTests.id, params.testId)));
}

export interface VacuumTestListFilters {
  verdict?: Verdict;
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
export async function listTestsByOrganization(db: Db, params: { viewer: Viewer; filters: VacuumTestListFilters }) {
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
      meetsProfile: sql<boolean | null>`(${analyses.result}->>'meetsProfile')::boolean`,
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

/** What one person's idempotency key already produced in this organization, if anything. */
export async function getIdempotencyKeyByKey(db: Db, params: { organizationId: string; userId: string; key: string }) {
  const [row] = await db
    .select({ testId: idempotencyKeys.testId, analysisId: idempotencyKeys.analysisId, requestFingerprint: idempotencyKeys.requestFingerprint })
    .from(idempotencyKeys)
    .where(and(eq(idempotencyKeys.organizationId, params.organizationId), eq(idempotencyKeys.userId, params.userId), eq(idempotencyKeys.key, params.key)))
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
  params: { organizationId: string; key: string; userId: string; testId: string; analysisId?: string | null; requestFingerprint: string },
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
export async function updateIdempotencyKeyAnalysis(db: Db, params: { organizationId: string; userId: string; key: string; analysisId: string }): Promise<void> {
  await db
    .update(idempotencyKeys)
    .set({ analysisId: params.analysisId })
    .where(and(eq(idempotencyKeys.organizationId, params.organizationId), eq(idempotencyKeys.userId, params.userId), eq(idempotencyKeys.key, params.key)));
}

/** Set (or clear) the note for the customer's copy of a test's report; false when there is no such test. */
export async function updateTestCustomerNoteById(db: Db, params: { organizationId: string; testId: string; customerNote: string | null }): Promise<boolean> {
  const rows = await db
    .update(vacuumTests)
    .set({ customerNote: params.customerNote, updatedAt: new Date() })
    .where(and(eq(vacuumTests.organizationId, params.organizationId), eq(vacuumTests.id, params.testId)))
    .returning({ id: vacuumTests.id });
  return rows.length === 1;
}

/** Of these storage keys of one organization, the ones a committed upload row references. */
export async function listReferencedObjectKeysByOrganization(db: Db, params: { organizationId: string; keys: string[] }): Promise<Set<string>> {
  if (!params.keys.length) return new Set();
  const rows = await db
    .select({ key: uploads.objectKey })
    .from(uploads)
    .where(and(eq(uploads.organizationId, params.organizationId), inArray(uploads.objectKey, params.keys)));
  return new Set(rows.map((r) => r.key));
}

/** The rule of a profile re-check: non-practice tests whose current analysis used a profile of one of these names. */
const currentProfileIs = (organizationId: string, profileNames: string[]) =>
  and(
    eq(vacuumTests.organizationId, organizationId),
    eq(vacuumTests.isPractice, false),
    inArray(sql<string>`${analyses.options}->'profile'->>'name'`, profileNames),
  );

export async function countTestsByCurrentProfileName(db: Db, params: { organizationId: string; profileNames: string[] }): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(vacuumTests)
    .innerJoin(analyses, and(eq(analyses.id, vacuumTests.currentAnalysisId), eq(analyses.organizationId, vacuumTests.organizationId)))
    .where(currentProfileIs(params.organizationId, params.profileNames));
  return row?.n ?? 0;
}

/** The next tests of a profile re-check after `afterId`, in id order (a chunked job carries on from its cursor). */
export async function listTestIdsByCurrentProfileName(db: Db, params: { organizationId: string; profileNames: string[]; afterId: string | null; limit: number }) {
  const rows = await db
    .select({ id: vacuumTests.id })
    .from(vacuumTests)
    .innerJoin(analyses, and(eq(analyses.id, vacuumTests.currentAnalysisId), eq(analyses.organizationId, vacuumTests.organizationId)))
    .where(and(currentProfileIs(params.organizationId, params.profileNames), params.afterId ? sql`${vacuumTests.id} > ${params.afterId}` : undefined))
    .orderBy(vacuumTests.id)
    .limit(params.limit);
  return rows.map((r) => r.id);
}
