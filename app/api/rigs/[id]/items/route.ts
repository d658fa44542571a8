import { db } from "@/db/client";
import { createRigItem, listRigItemsByRig } from "@/db/queries/rigs";
import { route } from "@/lib/api/handler";
import { rigItemSchema, rigParams } from "@/lib/rigs/schemas";
import { requireRigAccess, viewerOf } from "@/lib/rigs/service";

export const GET = route({ policy: "rig.read", params: rigParams }, async ({ actor, params }) => {
  await requireRigAccess(db(), viewerOf(actor), params.id, "read");
  return { items: await listRigItemsByRig(db(), { organizationId: actor.organizationId, rigId: params.id }) };
});

/** Add a pump, micron gauge, hose or core-removal tool to a rig the caller manages. */
export const POST = route({ policy: "rig.manage", params: rigParams, body: rigItemSchema }, async ({ actor, params, body }) => {
  await requireRigAccess(db(), viewerOf(actor), params.id, "manage");
  const item = await createRigItem(db(), { organizationId: actor.organizationId, rigId: params.id, values: body });
  return Response.json({ item }, { status: 201 });
});
