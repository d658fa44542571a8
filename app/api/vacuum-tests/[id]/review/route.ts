import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { can } from "@/lib/permissions";
import { applyReviewAction } from "@/lib/review/actions";
import { mayUploadRetest } from "@/lib/review/retest";
import { requireVisibleTest } from "@/lib/vacuum-tests/read";
import { reviewActionSchema } from "@/lib/review/schemas";
import { availableActions } from "@/lib/review/state";

/** The test's review state and the actions the caller may take now. */
export const GET = route({ policy: "vacuumTest.read", params: uuidParam }, async ({ actor, params }) => {
  const row = await requireVisibleTest(db(), actor, params.id);
  return {
    status: row.test.status,
    helpRequested: row.test.helpRequested,
    actions: availableActions(row.test.status, can(actor.role, "tests.review")),
    /** Sent back and the caller may upload the re-test log (POST /api/vacuum-tests/:id/retests). */
    retest: row.test.status === "sent_back" && mayUploadRetest(actor, row.test.createdById),
  };
});

/** Sign off, send back (with a request), ask for review or help, resubmit after a re-test. */
export const POST = route({ policy: "vacuumTest.review", params: uuidParam, body: reviewActionSchema }, async ({ actor, params, body }) => {
  const out = await applyReviewAction(db(), actor, { testId: params.id, action: body.action, note: body.note });
  return { status: out.status, fromStatus: out.fromStatus, helpRequested: out.helpRequested, eventId: out.eventId };
});
