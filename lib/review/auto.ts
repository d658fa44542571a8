/**
 * The rule that puts a new test in the lead's queue without anyone asking: a test that is not a
 * pass, misses the organization's profile, or whose technician asked for help goes from
 * submitted to waiting_review, with an audit event by Riseline itself and an e-mail to the
 * leads. Practice tests never enter the queue. Idempotent: a test already moved is left alone.
 */
import type { Database, Db } from "@/db/client";
import { getTestById } from "@/db/queries/vacuum-tests";
import { randomUUID } from "node:crypto";
import { getSiteById } from "@/db/queries/records";
import {
  getUserEmailById, insertTestEvent, listReviewerEmailsByOrganization, listTestsDueForReviewByOrganization, updateTestStatusById, type NewTestEvent,
} from "@/db/queries/review";
import { reviewRequestedMail } from "@/lib/notify/messages";
import { queueMail } from "@/lib/notify/outbox";
import { verdictLabel } from "@/lib/reports/words";

export interface RoutedTest {
  routed: boolean;
  /** Why it entered the queue, in words ("the curve: Steady climb: leak likely", "misses the profile", …). */
  reasons: string[];
  mailIds: string[];
}

function reasonsOf(due: { verdict: string | null; meetsProfile: boolean | null; helpRequested: boolean }): string[] {
  const r: string[] = [];
  if (due.verdict !== "pass") r.push(`the curve: ${verdictLabel(due.verdict)}`);
  if (due.meetsProfile !== true) r.push("misses the acceptance profile");
  if (due.helpRequested) r.push("the technician asked for help");
  return r;
}

/**
 * What the upload knows of a test it is about to insert, so the rule need not read it back: the
 * upload inserts it already in the status entersReviewOnUpload gives it, with the rows of
 * reviewRowsOfNewTest. Names left undefined are read from the database for the leads' message.
 */
export interface KnownNewTest {
  verdict: string;
  meetsProfile: boolean;
  helpRequested: boolean;
  isPractice: boolean;
  title: string;
  technicianName?: string;
  siteName?: string | null;
}

/** The rule of listTestsDueForReviewByOrganization, for a test about to be inserted: the same SQL predicate (db/queries/review.ts). */
export { entersReviewOnUpload } from "@/db/queries/review";

/**
 * The rows the rule adds to a new test that the upload inserts straight into review: Riseline's
 * audit event and the leads' e-mail, with their ids, for the caller to write in the same
 * statement as the test (and to deliver after commit). Names the upload did not read are read here.
 */
export async function reviewRowsOfNewTest(
  db: Db,
  params: { organizationId: string; testId: string; technicianId: string; siteId: string | null; known: KnownNewTest },
) {
  const { organizationId, testId, known: k } = params;
  const automatic = reasonsOf(k).join("; ");
  const event = automaticReviewEvent(organizationId, testId, automatic);
  const technicianName = k.technicianName ?? (await getUserEmailById(db, { organizationId, userId: params.technicianId }))?.name ?? "A technician";
  const siteName = k.siteName !== undefined ? k.siteName : params.siteId ? ((await getSiteById(db, { organizationId, siteId: params.siteId }))?.name ?? null) : null;
  const summary = { id: testId, title: k.title, verdict: k.verdict, meetsProfile: k.meetsProfile, technicianName, siteName };
  const reviewers = await listReviewerEmailsByOrganization(db, { organizationId });
  const mails = reviewers.map((to) => ({
    ...reviewRequestedMail(to, summary, { by: null, help: k.helpRequested, automatic }), id: randomUUID(), organizationId, testId,
  }));
  return { event, mails };
}

/** Riseline's own entry in the audit trail when the rule moves a test into review. */
function automaticReviewEvent(organizationId: string, testId: string, automatic: string): NewTestEvent {
  return { organizationId, testId, actorId: null, kind: "review_requested", fromStatus: "submitted", toStatus: "waiting_review", note: `Automatic: ${automatic}.` };
}

/**
 * Inside the caller's transaction: move a stored test into review if the rule says so and queue
 * the leads' e-mail. The caller delivers `mailIds` after commit.
 */
export async function queueNewTestForReview(tx: Db, params: { organizationId: string; testId: string; actorId: string | null }): Promise<RoutedTest> {
  const [due] = await listTestsDueForReviewByOrganization(tx, { organizationId: params.organizationId, testId: params.testId, limit: 1 });
  if (!due) return { routed: false, reasons: [], mailIds: [] };
  const moved = await updateTestStatusById(tx, { organizationId: params.organizationId, testId: due.id, fromStatus: "submitted", toStatus: "waiting_review" });
  if (!moved) return { routed: false, reasons: [], mailIds: [] };
  const reasons = reasonsOf(due);
  const automatic = reasons.join("; ");
  await insertTestEvent(tx, automaticReviewEvent(params.organizationId, due.id, automatic));
  const summary = { ...(await namesForMail(tx, params.organizationId, params.actorId, due)), meetsProfile: due.meetsProfile };
  const reviewers = await listReviewerEmailsByOrganization(tx, { organizationId: params.organizationId });
  const mailIds = await queueMail(
    tx,
    reviewers.map((to) => ({ ...reviewRequestedMail(to, summary, { by: null, help: due.helpRequested, automatic }), organizationId: params.organizationId, testId: due.id })),
  );
  return { routed: true, reasons, mailIds };
}

/** Read with a lead's eyes: the test's names for the message (visibility is the whole organization). */
async function namesForMail(tx: Db, organizationId: string, actorId: string | null, due: { id: string; verdict: string | null }) {
  const detail = await getTestById(tx, { viewer: { organizationId, userId: actorId ?? "", role: "owner" }, testId: due.id });
  return { id: due.id, title: detail?.test.title ?? "Vacuum test", verdict: due.verdict, technicianName: detail?.createdByName ?? "A technician", siteName: detail?.siteName };
}

/**
 * Call after a new test (and its first analysis) is committed: applies the rule in its own
 * transaction, with the leads' e-mail and its delivery job. Safe to call twice.
 */
export async function routeNewTestToReview(db: Database, params: { organizationId: string; testId: string; actorId: string | null }): Promise<RoutedTest> {
  return db.transaction((tx) => queueNewTestForReview(tx, params));
}

/**
 * The same rule over every submitted test of an organization that should be in the queue. The
 * review sweep job runs it every minute (lib/review/sweep.ts), so a test stored by any path is
 * never missed.
 */
export async function sweepNewTestsIntoReview(db: Database, params: { organizationId: string; limit?: number }): Promise<number> {
  const due = await listTestsDueForReviewByOrganization(db, { organizationId: params.organizationId, limit: params.limit ?? 50 });
  let n = 0;
  for (const t of due) {
    const out = await routeNewTestToReview(db, { organizationId: params.organizationId, testId: t.id, actorId: t.createdById });
    if (out.routed) n++;
  }
  return n;
}
