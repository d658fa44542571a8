import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { can } from "@/lib/permissions";
import { applyReviewAction } from "@/lib/review/actions";
import { mayUploadRetest } from "@/lib/review/retest";
import { requireVisibleTest } from "@/lib/vacuum-tests/read";
import { reviewActionSchema } from "@/lib/review/schemas";
import { getLatestReviewEventByTest, getSignOffFactsByTest } from "@/db/queries/review-acceptance";
import { availableActions, signOffNeedsReason } from "@/lib/review/state";

/** The test's review state and the actions the caller may take now. */
export const GET = route({ policy: "vacuumTest.read", params: uuidParam }, async ({ actor, params }) => {
  const row = await requireVisibleTest(db(), actor, params.id);
  const facts = await getSignOffFactsByTest(db(), { organizationId: actor.organizationId, testId: params.id });
  const needsReason = signOffNeedsReason(facts.verdict, facts.meetsProfile);
  const org = actor.organizationId;
  const status = row.test.status;
  // What the last step said: the lead's request on a sent-back test, the sign-off (or acceptance) on a final one.
  const last =
    status === "sent_back" || status === "signed_off"
      ? await getLatestReviewEventByTest(db(), { organizationId: org, testId: params.id, kinds: status === "sent_back" ? ["sent_back"] : ["signed_off", "accepted_with_reason"] })
      : null;
  return {
    status: row.test.status,
    helpRequested: row.test.helpRequested,
    actions: availableActions(row.test.status, can(actor.role, "tests.review"), needsReason),
    /** The curve or the profile fails: a lead can only accept it with a reason. */
    signOffNeedsReason: needsReason,
    /** The step that put the test where it is: who, when, the lead's words (the request, or the reason). */
    lastStep: last ? { kind: last.kind, by: last.actorName ?? "A former member", at: last.at.toISOString(), note: last.note } : null,
    /** Sent back and the caller may upload the re-test log (POST /api/vacuum-tests/:id/retests). */
    retest: row.test.status === "sent_back" && mayUploadRetest(actor, row.test.createdById),
  };
});

/** Sign off, send back (with a request), ask for review or help, resubmit after a re-test. */
export const POST = route({ policy: "vacuumTest.review", params: uuidParam, body: reviewActionSchema }, async ({ actor, params, body }) => {
  const out = await applyReviewAction(db(), actor, { testId: params.id, action: body.action, note: body.note });
  return { status: out.status, fromStatus: out.fromStatus, helpRequested: out.helpRequested, eventId: out.eventId };
});
