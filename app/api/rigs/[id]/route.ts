import { db } from "@/db/client";
import { deleteRigById, isMemberOfOrganization, updateRigById } from "@/db/queries/rigs";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { canManageAllRigs } from "@/lib/rigs/access";
import { rigParams, rigUpdateSchema, todayQuery } from "@/lib/rigs/schemas";
import { requireRigAccess, rigDetail, todayIso, viewerOf } from "@/lib/rigs/service";

/** The rig with its items, recent events, blank-off trend and reminders (`?today=YYYY-MM-DD` to evaluate on a given day). */
export const GET = route({ policy: "rig.read", params: rigParams, query: todayQuery }, async ({ actor, params, query }) => {
  return rigDetail(db(), viewerOf(actor), params.id, query.today ?? todayIso());
});

export const PATCH = route({ policy: "rig.manage", params: rigParams, body: rigUpdateSchema }, async ({ actor, params, body }) => {
  const viewer = viewerOf(actor);
  await requireRigAccess(db(), viewer, params.id, "manage");
  const values: Parameters<typeof updateRigById>[1]["values"] = {};
  if (body.name !== undefined) values.name = body.name;
  if (body.truck !== undefined) values.truck = body.truck;
  if (body.notes !== undefined) values.notes = body.notes;
  if (body.keeperId !== undefined) {
    if (!canManageAllRigs(actor.role)) throw new AppError("forbidden", "Only owners and leads hand a rig to someone else.");
    if (body.keeperId && !(await isMemberOfOrganization(db(), { organizationId: actor.organizationId, userId: body.keeperId })))
      throw new AppError("invalid_input", "keeperId: not a member of this shop");
    values.keeperId = body.keeperId;
  }
  const rig = await updateRigById(db(), { viewer, rigId: params.id, values });
  if (!rig) throw new AppError("not_found", "No such rig.");
  return { rig };
});

export const DELETE = route({ policy: "rig.manage", params: rigParams }, async ({ actor, params }) => {
  const viewer = viewerOf(actor);
  await requireRigAccess(db(), viewer, params.id, "manage");
  await deleteRigById(db(), { viewer, rigId: params.id });
  return new Response(null, { status: 204 });
});
