import { db } from "@/db/client";
import { createRigEvent, getRigItemById, listRigEventsByRig } from "@/db/queries/rigs";
import { route } from "@/lib/api/handler";
import { readBlankOffLog } from "@/lib/engine/door";
import { AppError } from "@/lib/errors";
import { rigEventSchema, rigParams } from "@/lib/rigs/schemas";
import { requireRigAccess, viewerOf } from "@/lib/rigs/service";

export const GET = route({ policy: "rig.read", params: rigParams }, async ({ actor, params }) => {
  await requireRigAccess(db(), viewerOf(actor), params.id, "read");
  return { events: await listRigEventsByRig(db(), { organizationId: actor.organizationId, rigId: params.id }) };
});

/**
 * Log upkeep on a rig the caller manages: oil change (with why), blank-off test (typed lowest
 * reading, or a gauge log whose lowest reading is taken), gauge cleaned or checked, hose gaskets,
 * pump hour-meter reading.
 */
export const POST = route({ policy: "rig.manage", params: rigParams, body: rigEventSchema, maxJsonBytes: 9 * 1024 * 1024 }, async ({ actor, params, body }) => {
  await requireRigAccess(db(), viewerOf(actor), params.id, "manage");
  if (body.itemId && !(await getRigItemById(db(), { organizationId: actor.organizationId, rigId: params.id, itemId: body.itemId })))
    throw new AppError("invalid_input", "itemId: not an item of this rig");
  let lowestMicrons = body.lowestMicrons ?? null;
  let note = body.note ?? null;
  if (body.kind === "blank_off" && body.logText) {
    const read = await readBlankOffLog(body.logText);
    lowestMicrons = read.lowestMicrons;
    note = [note, `lowest of ${read.readings} logged readings (${read.unit})`].filter(Boolean).join("; ");
  }
  const event = await createRigEvent(db(), {
    organizationId: actor.organizationId,
    rigId: params.id,
    values: {
      kind: body.kind,
      itemId: body.itemId ?? null,
      occurredOn: body.occurredOn,
      oilReason: body.kind === "oil_changed" ? body.oilReason ?? null : null,
      lowestMicrons: body.kind === "blank_off" ? lowestMicrons : null,
      pumpHours: body.pumpHours ?? null,
      referenceMicrons: body.kind === "gauge_checked" ? body.referenceMicrons ?? null : null,
      gaugeMicrons: body.kind === "gauge_checked" ? body.gaugeMicrons ?? null : null,
      note,
      createdById: actor.userId,
    },
  });
  return Response.json({ event }, { status: 201 });
});
