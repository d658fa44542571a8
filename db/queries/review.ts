import { and, asc, desc, eq, gte, inArray, lte, sql, type SQL } from "drizzle-orm";
import type { Db } from "@/db/client";
import { getShopMailSettings } from "./mail-settings";
import { analyses, member, organization, sites, systems, testEvents, user, vacuumTests, type TestEventKind, type TestStatus } from "@/db/schema";
import { visibleTestsWhere, type Viewer } from "./visibility";
import type { Verdict } from "@/db/vocabulary";

/** The review fields of one test of the organization, locked for update in this transaction. */
export async function lockTestReviewStateById(db: Db, params: { organizationId: string; testId: string }) {
  const [row] = await db
    .select({
      id: vacuumTests.id,
      status: vacuumTests.status,
      helpRequested: vacuumTests.helpRequested,
      createdById: vacuumTests.createdById,
      title: vacuumTests.title,
      isPractice: vacuumTests.isPractice,
      verdict: vacuumTests.verdict,
      currentAnalysisId: vacuumTests.currentAnalysisId,
    })
    .from(vacuumTests)
    .where(and(eq(vacuumTests.organizationId, params.organizationId), eq(vacuumTests.id, params.testId)))
    .for("update");
  return row ?? null;
}

/** Move a test from one status to another; returns false when it was not in `fromStatus`. */
export async function updateTestStatusById(
  db: Db,
  params: { organizationId: string; testId: string; fromStatus: TestStatus; toStatus: TestStatus; helpRequested?: boolean },
): Promise<boolean> {
  const rows = await db
    .update(vacuumTests)
    .set({
      status: params.toStatus,
      ...(params.helpRequested !== undefined ? { helpRequested: params.helpRequested } : {}),
      updatedAt: new Date(),
    })
    .where(
      and(
        eq(vacuumTests.organizationId, params.organizationId),
        eq(vacuumTests.id, params.testId),
        eq(vacuumTests.status, params.fromStatus),
      ),
    )
    .returning({ id: vacuumTests.id });
  return rows.length === 1;
}

export interface NewTestEvent {
  organizationId: string;
  testId: string;
  actorId: string | null;
  kind: TestEventKind;
  fromStatus?: TestStatus | null;
  toStatus?: TestStatus | null;
  note?: string | null;
}

/** Append one entry to a test's audit trail. */
export async function insertTestEvent(db: Db, params: NewTestEvent) {
  const [row] = await db
    .insert(testEvents)
    .values({ ...params, fromStatus: params.fromStatus ?? null, toStatus: params.toStatus ?? null, note: params.note ?? null })
    .returning();
  return row;
}

/** A test's audit trail, oldest first, with the actor's name (null actor = Riseline itself). */
export async function listTestEventsByTest(db: Db, params: { organizationId: string; testId: string }) {
  return db
    .select({
      id: testEvents.id,
      kind: testEvents.kind,
      fromStatus: testEvents.fromStatus,
      toStatus: testEvents.toStatus,
      note: testEvents.note,
      createdAt: testEvents.createdAt,
      actorId: testEvents.actorId,
      actorName: user.name,
    })
    .from(testEvents)
    .leftJoin(user, eq(user.id, testEvents.actorId))
    .where(and(eq(testEvents.organizationId, params.organizationId), eq(testEvents.testId, params.testId)))
    .orderBy(asc(testEvents.createdAt), asc(testEvents.id));
}

/** The organization's leads, or its owners when it has no lead (rig upkeep for unkept rigs, for one). */
export async function listLeadEmailsByOrganization(db: Db, params: { organizationId: string }): Promise<string[]> {
  const rows = await db
    .select({ email: user.email, role: member.role })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .where(and(eq(member.organizationId, params.organizationId), inArray(member.role, ["lead", "owner"])))
    .orderBy(asc(user.email));
  const leads = rows.filter((r) => r.role === "lead").map((r) => r.email);
  return leads.length ? leads : rows.map((r) => r.email);
}

/**
 * Who gets review mail (review requests, re-tests, a technician's comment on a waiting test): the
 * members the owner chose (settings/mail), whatever their role; otherwise the leads (owners when none).
 */
export async function listReviewerEmailsByOrganization(db: Db, params: { organizationId: string }): Promise<string[]> {
  const { reviewMailTo } = await getShopMailSettings(db, params);
  if (reviewMailTo.length) {
    const chosen = await db
      .select({ email: user.email })
      .from(member)
      .innerJoin(user, eq(user.id, member.userId))
      .where(and(eq(member.organizationId, params.organizationId), inArray(member.userId, reviewMailTo)))
      .orderBy(asc(user.email));
    if (chosen.length) return chosen.map((r) => r.email);
  }
  return listLeadEmailsByOrganization(db, params);
}

export async function getUserEmailById(db: Db, params: { organizationId: string; userId: string }) {
  const [row] = await db
    .select({ email: user.email, name: user.name })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .where(and(eq(member.organizationId, params.organizationId), eq(member.userId, params.userId)))
    .limit(1);
  return row ?? null;
}

export interface ReviewQueueFilters {
  technicianId?: string;
  verdict?: Verdict;
  helpOnly?: boolean;
  from?: Date;
  to?: Date;
}

/**
 * Tests waiting for review the viewer may see, oldest first (the longest waiting on top),
 * with the current analysis' verdict, whether it met the profile, and its chart series.
 */
export async function listReviewQueueByOrganization(db: Db, params: { viewer: Viewer; filters: ReviewQueueFilters; limit: number }) {
  const f = params.filters;
  const conds = [visibleTestsWhere(params.viewer), eq(vacuumTests.status, "waiting_review")];
  if (f.technicianId) conds.push(eq(vacuumTests.createdById, f.technicianId));
  if (f.verdict) conds.push(eq(vacuumTests.verdict, f.verdict));
  if (f.helpOnly) conds.push(eq(vacuumTests.helpRequested, true));
  if (f.from) conds.push(gte(vacuumTests.testedAt, f.from));
  if (f.to) conds.push(lte(vacuumTests.testedAt, f.to));
  // The moment it entered the queue: the newest event that moved it to waiting_review.
  const waitingSince = sql<string | null>`(select max(e.created_at) from ${testEvents} e where e.test_id = ${vacuumTests.id} and e.organization_id = ${vacuumTests.organizationId} and e.to_status = 'waiting_review')`;
  return db
    .select({
      id: vacuumTests.id,
      title: vacuumTests.title,
      status: vacuumTests.status,
      verdict: vacuumTests.verdict,
      helpRequested: vacuumTests.helpRequested,
      testedAt: vacuumTests.testedAt,
      technicianId: vacuumTests.createdById,
      technicianName: user.name,
      siteName: sites.name,
      systemName: systems.name,
      confidence: analyses.confidence,
      meetsProfile: sql<boolean | null>`(${analyses.result}->>'meetsProfile')::boolean`,
      endMicrons: sql<number | null>`(${analyses.result}->'decay'->>'endMicrons')::float8`,
      isolationAt: analyses.isolationAt,
      limitMicrons: sql<number | null>`(${analyses.profile}->>'limitMicrons')::float8`,
      series: analyses.series,
      waitingSince,
    })
    .from(vacuumTests)
    .innerJoin(user, eq(user.id, vacuumTests.createdById))
    .leftJoin(sites, and(eq(sites.id, vacuumTests.siteId), eq(sites.organizationId, vacuumTests.organizationId)))
    .leftJoin(systems, and(eq(systems.id, vacuumTests.systemId), eq(systems.organizationId, vacuumTests.organizationId)))
    .leftJoin(analyses, and(eq(analyses.id, vacuumTests.currentAnalysisId), eq(analyses.organizationId, vacuumTests.organizationId)))
    .where(and(...conds))
    .orderBy(sql`${waitingSince} asc nulls first`, asc(vacuumTests.testedAt), asc(vacuumTests.id))
    .limit(params.limit);
}

/**
 * Submitted, non-practice tests of the organization whose current analysis is not a pass,
 * misses the profile, or whose technician asked for help: they belong in the review queue.
 */
/** What the review rule reads of a test: columns for the queue, values for a test not yet inserted. */
interface ReviewRuleInputs {
  status: SQL;
  isPractice: SQL;
  helpRequested: SQL;
  verdict: SQL;
  meetsProfile: SQL;
}

/**
 * The one rule of the review queue, as one SQL predicate: a submitted, non-practice test that is
 * not a pass, misses its profile or asks for help. The queue and the sweep apply it to stored rows
 * (dueForReview); the upload applies it to the test it is about to insert (entersReviewOnUpload).
 */
function reviewRule(x: ReviewRuleInputs): SQL {
  return sql`(${x.status} = 'submitted' and ${x.isPractice} = false and (${x.helpRequested} or ${x.verdict} <> 'pass' or coalesce(${x.meetsProfile}, false) = false))`;
}

const dueForReview = () => [
  reviewRule({
    status: sql`${vacuumTests.status}`,
    isPractice: sql`${vacuumTests.isPractice}`,
    helpRequested: sql`${vacuumTests.helpRequested}`,
    verdict: sql`${analyses.verdict}`,
    meetsProfile: sql`(${analyses.result}->>'meetsProfile')::boolean`,
  }),
];

/** The review rule for a new test the upload is about to insert as submitted: true when it goes straight into the queue. */
export async function entersReviewOnUpload(db: Db, k: { verdict: string; meetsProfile: boolean | null; helpRequested: boolean; isPractice: boolean }): Promise<boolean> {
  const rule = reviewRule({
    status: sql`'submitted'`,
    isPractice: sql`${k.isPractice}::boolean`,
    helpRequested: sql`${k.helpRequested}::boolean`,
    verdict: sql`${k.verdict}::text`,
    meetsProfile: sql`${k.meetsProfile}::boolean`,
  });
  const r = await db.execute<{ due: boolean }>(sql`select ${rule} as due`);
  return r.rows[0]?.due === true;
}

/** Organizations with tests due for review (the review sweep's first step; a system job across shops). */
export async function listOrganizationsWithTestsDueForReview(db: Db): Promise<string[]> {
  const rows = await db
    .selectDistinct({ organizationId: vacuumTests.organizationId })
    .from(vacuumTests)
    .innerJoin(analyses, and(eq(analyses.id, vacuumTests.currentAnalysisId), eq(analyses.organizationId, vacuumTests.organizationId)))
    .where(and(...dueForReview()));
  return rows.map((r) => r.organizationId);
}

export async function listTestsDueForReviewByOrganization(db: Db, params: { organizationId: string; testId?: string; limit: number }) {
  const conds = [eq(vacuumTests.organizationId, params.organizationId), ...dueForReview()];
  if (params.testId) conds.push(eq(vacuumTests.id, params.testId));
  return db
    .select({
      id: vacuumTests.id,
      createdById: vacuumTests.createdById,
      helpRequested: vacuumTests.helpRequested,
      verdict: analyses.verdict,
      meetsProfile: sql<boolean | null>`(${analyses.result}->>'meetsProfile')::boolean`,
    })
    .from(vacuumTests)
    .innerJoin(analyses, and(eq(analyses.id, vacuumTests.currentAnalysisId), eq(analyses.organizationId, vacuumTests.organizationId)))
    .where(and(...conds))
    .orderBy(asc(vacuumTests.createdAt))
    .limit(params.limit);
}

/** How many tests wait for review (for a badge in the navigation). */
export async function countTestsWaitingReviewByOrganization(db: Db, params: { viewer: Viewer }): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(vacuumTests)
    .where(and(visibleTestsWhere(params.viewer), eq(vacuumTests.status, "waiting_review")));
  return row?.n ?? 0;
}


/** The organization's name (for the report heading). */
export async function getOrganizationNameById(db: Db, params: { organizationId: string }): Promise<string | null> {
  const [row] = await db.select({ name: organization.name }).from(organization).where(eq(organization.id, params.organizationId)).limit(1);
  return row?.name ?? null;
}

/** The latest sign-off of a test (plain, or an acceptance with a reason) with who and when, or null. */
export async function getLatestSignOffByTest(db: Db, params: { organizationId: string; testId: string }) {
  const [row] = await db
    .select({ kind: testEvents.kind, at: testEvents.createdAt, note: testEvents.note, actorName: user.name })
    .from(testEvents)
    .leftJoin(user, eq(user.id, testEvents.actorId))
    .where(and(eq(testEvents.organizationId, params.organizationId), eq(testEvents.testId, params.testId), inArray(testEvents.kind, ["signed_off", "accepted_with_reason"])))
    .orderBy(desc(testEvents.createdAt))
    .limit(1);
  return row ?? null;
}

/** Review events the report tells: sign-offs, send-backs, review requests and resubmissions. */
const REVIEW_STORY_KINDS = ["signed_off", "accepted_with_reason", "sent_back", "review_requested", "help_requested", "resubmitted", "retest_uploaded"] as const;

/** A test's review events, newest first, with who made each (null: Riseline itself, or a former member). */
export async function listReviewEventsByTest(db: Db, params: { organizationId: string; testId: string }) {
  return db
    .select({ kind: testEvents.kind, at: testEvents.createdAt, note: testEvents.note, actorName: user.name, toStatus: testEvents.toStatus })
    .from(testEvents)
    .leftJoin(user, eq(user.id, testEvents.actorId))
    .where(and(eq(testEvents.organizationId, params.organizationId), eq(testEvents.testId, params.testId), inArray(testEvents.kind, [...REVIEW_STORY_KINDS])))
    .orderBy(desc(testEvents.createdAt));
}
