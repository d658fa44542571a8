import { db } from "@/db/client";
import { getRigByTest, isTestVisible, upsertTestRig } from "@/db/queries/rigs";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { testParams, testRigSchema, todayQuery } from "@/lib/rigs/schemas";
import { requireRigAccess, rigDetailOf, todayIso, viewerOf } from "@/lib/rigs/service";

/**
 * The rig a vacuum test was made with and its recent history (events, blank-off trend, reminders),
 * so "target not reached" can point to it. `{ rig: null }` when none was recorded.
 */
export const GET = route({ policy: "rig.read", params: testParams, query: todayQuery }, async ({ actor, params, query }) => {
  const viewer = viewerOf(actor);
  if (!(await isTestVisible(db(), { viewer, testId: params.testId }))) throw new AppError("not_found", "No such test.");
  const rig = await getRigByTest(db(), { viewer, testId: params.testId });
  if (!rig) return { rig: null };
  return rigDetailOf(db(), viewer, rig, query.today ?? todayIso(), 20);
});

/** Record which rig was used for a test the caller can see (a rig the caller can see). */
export const PUT = route({ policy: "rig.manage", params: testParams, body: testRigSchema }, async ({ actor, params, body }) => {
  const viewer = viewerOf(actor);
  if (!(await isTestVisible(db(), { viewer, testId: params.testId }))) throw new AppError("not_found", "No such test.");
  await requireRigAccess(db(), viewer, body.rigId, "read");
  await upsertTestRig(db(), { organizationId: actor.organizationId, testId: params.testId, rigId: body.rigId });
  return { testId: params.testId, rigId: body.rigId };
});
