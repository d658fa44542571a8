import { db } from "@/db/client";
import { createRig, isMemberOfOrganization, listRigsByViewer } from "@/db/queries/rigs";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { canManageAllRigs, canManageOwnRigs } from "@/lib/rigs/access";
import { rigCreateSchema } from "@/lib/rigs/schemas";
import { viewerOf } from "@/lib/rigs/service";

/** Rigs the caller may see (owners and leads: all; others: the ones they keep). */
export const GET = route({ policy: "rig.read" }, async ({ actor }) => {
  return { rigs: await listRigsByViewer(db(), { viewer: viewerOf(actor) }), canManageAll: canManageAllRigs(actor.role), canCreate: canManageOwnRigs(actor.role) };
});

/** A new rig. Technicians keep the rigs they create; owners and leads may name any member as keeper. */
export const POST = route({ policy: "rig.manage", body: rigCreateSchema }, async ({ actor, body }) => {
  if (!canManageOwnRigs(actor.role)) throw new AppError("forbidden", "Your role may not add rigs.");
  let keeperId: string | null = actor.userId;
  if (canManageAllRigs(actor.role) && body.keeperId !== undefined) {
    keeperId = body.keeperId;
    if (keeperId && !(await isMemberOfOrganization(db(), { organizationId: actor.organizationId, userId: keeperId })))
      throw new AppError("invalid_input", "keeperId: not a member of this shop");
  }
  const rig = await createRig(db(), {
    organizationId: actor.organizationId,
    createdById: actor.userId,
    name: body.name,
    truck: body.truck ?? null,
    keeperId,
    notes: body.notes ?? null,
  });
  return Response.json({ rig }, { status: 201 });
});
