import { db } from "@/db/client";
import { deleteRigItemById, updateRigItemById } from "@/db/queries/rigs";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { rigItemParams, rigItemUpdateSchema } from "@/lib/rigs/schemas";
import { requireRigAccess, viewerOf } from "@/lib/rigs/service";

export const PATCH = route({ policy: "rig.manage", params: rigItemParams, body: rigItemUpdateSchema }, async ({ actor, params, body }) => {
  await requireRigAccess(db(), viewerOf(actor), params.id, "manage");
  const item = await updateRigItemById(db(), { organizationId: actor.organizationId, rigId: params.id, itemId: params.itemId, values: body });
  if (!item) throw new AppError("not_found", "No such item on this rig.");
  return { item };
});

export const DELETE = route({ policy: "rig.manage", params: rigItemParams }, async ({ actor, params }) => {
  await requireRigAccess(db(), viewerOf(actor), params.id, "manage");
  if (!(await deleteRigItemById(db(), { organizationId: actor.organizationId, rigId: params.id, itemId: params.itemId })))
    throw new AppError("not_found", "No such item on this rig.");
  return new Response(null, { status: 204 });
});
