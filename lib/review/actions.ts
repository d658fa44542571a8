/**
 * Review actions on one test: check visibility and role, lock the test, check the transition,
 * change the status, write the audit event and queue the e-mails with their delivery job, all in
 * one transaction. An illegal transition is a 409 with the state machine's words.
 */
import type { Database, Tx } from "@/db/client";
import {
  getUserEmailById, insertTestEvent, listReviewerEmailsByOrganization, lockTestReviewStateById, updateTestStatusById,
} from "@/db/queries/review";
import type { TestStatus } from "@/db/schema";
import type { Actor } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/permissions";
import { requireVisibleTest } from "@/lib/vacuum-tests/read";
import { reviewRequestedMail, sentBackMail, signedOffMail, type VacuumTestSummary } from "@/lib/notify/messages";
import { queueMail } from "@/lib/notify/outbox";
import type { OutgoingMail } from "@/lib/mail";
import { getSignOffFactsByTest } from "@/db/queries/review-acceptance";
import { ACTION_PERMISSION, NOTE_REQUIRED, checkTransition, signOffNeedsReason, signOffRuleMessage, type ReviewAction } from "./state";

export interface ReviewOutcome {
  testId: string;
  fromStatus: TestStatus;
  status: TestStatus;
  helpRequested: boolean;
  eventId: string;
  mailIds: string[];
}

const EVENT_KIND = {
  request_review: "review_requested",
  ask_help: "help_requested",
  sign_off: "signed_off",
  accept_with_reason: "accepted_with_reason",
  send_back: "sent_back",
  resubmit: "resubmitted",
} as const;

async function mailsFor(tx: Tx, actor: Actor, action: ReviewAction, summary: VacuumTestSummary, createdById: string, note: string | null): Promise<OutgoingMail[]> {
  const org = actor.organizationId;
  if (action === "sign_off" || action === "accept_with_reason" || action === "send_back") {
    if (createdById === actor.userId) return [];
    const tech = await getUserEmailById(tx, { organizationId: org, userId: createdById });
    if (!tech) return [];
    if (action === "send_back") return [sentBackMail(tech.email, summary, { by: actor.name, request: note ?? "" })];
    return [signedOffMail(tech.email, summary, { by: actor.name, note, acceptedWithReason: action === "accept_with_reason" })];
  }
  const reviewers = (await listReviewerEmailsByOrganization(tx, { organizationId: org })).filter((e) => e !== actor.email);
  return reviewers.map((to) => reviewRequestedMail(to, summary, { by: actor.name, help: action === "ask_help", note }));
}

/** Apply one review action for a member. Throws 404 / 403 / 400 / 409 AppErrors. */
export async function applyReviewAction(
  db: Database,
  actor: Actor,
  params: { testId: string; action: ReviewAction; note?: string | null },
): Promise<ReviewOutcome> {
  const { testId, action } = params;
  const note = params.note?.trim() || null;
  const detail = await requireVisibleTest(db, actor, testId);
  if (!can(actor.role, ACTION_PERMISSION[action])) {
    throw new AppError("forbidden", `Your role (${actor.role}) cannot ${action.replace("_", " ")} a test; a lead or the owner can.`);
  }
  if (NOTE_REQUIRED[action] && !note) {
    throw new AppError(
      "invalid_input",
      action === "send_back"
        ? "note: say what to do (for example: pull down again and hold 15 minutes)."
        : action === "accept_with_reason"
          ? "note: say why you accept a test that does not pass (for example: customer declined the repair, recorded on the work order)."
          : "note: say what you need help with.",
    );
  }
  const outcome = await db.transaction(async (tx) => {
    const locked = await lockTestReviewStateById(tx, { organizationId: actor.organizationId, testId });
    if (!locked) throw new AppError("not_found", "No such test.");
    const check = checkTransition(locked.status, action);
    if (!check.ok) throw new AppError("conflict", check.message, { status: locked.status, action });
    if (action === "sign_off" || action === "accept_with_reason") {
      const facts = await getSignOffFactsByTest(tx, { organizationId: actor.organizationId, testId });
      const refused = signOffRuleMessage(action, signOffNeedsReason(facts.verdict, facts.meetsProfile));
      if (refused) throw new AppError("conflict", refused, { action, verdict: facts.verdict, meetsProfile: facts.meetsProfile });
    }
    const helpRequested = action === "ask_help" ? true : action === "sign_off" || action === "accept_with_reason" || action === "send_back" ? false : locked.helpRequested;
    const moved = await updateTestStatusById(tx, { organizationId: actor.organizationId, testId, fromStatus: locked.status, toStatus: check.to, helpRequested });
    if (!moved) throw new AppError("conflict");
    const event = await insertTestEvent(tx, {
      organizationId: actor.organizationId, testId, actorId: actor.userId, kind: EVENT_KIND[action], fromStatus: locked.status, toStatus: check.to, note,
    });
    const summary: VacuumTestSummary = { id: testId, title: locked.title, verdict: locked.verdict, technicianName: detail.createdByName, siteName: detail.siteName };
    const mails = await mailsFor(tx, actor, action, summary, locked.createdById, note);
    const mailIds = await queueMail(tx, mails.map((m) => ({ ...m, organizationId: actor.organizationId, testId })));
    return { testId, fromStatus: locked.status, status: check.to, helpRequested, eventId: event.id, mailIds };
  });
  return outcome;
}
