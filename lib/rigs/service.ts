/**
 * Rig pieces the routes share: who is looking, the rig's full picture (items, recent events,
 * reminders), and 404 for rigs the viewer may not see.
 */
import type { Db } from "@/db/client";
import { getRigAccessById, getRigById, listRigEventsByRig, listRigItemsByRig, type RigEventRow, type RigItemRow } from "@/db/queries/rigs";
import type { Viewer } from "@/db/queries/visibility";
import type { Actor } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { rigReminders, type ReminderEvent, type ReminderItem } from "./reminders";

export function viewerOf(actor: Actor): Viewer {
  return { organizationId: actor.organizationId, userId: actor.userId, role: actor.role };
}

/** Today as YYYY-MM-DD in UTC, for reminders computed on the server. */
export function todayIso(): string {
  return new Date().toISOString().slice(0, 10);
}

export function reminderInputs(items: RigItemRow[], events: RigEventRow[]): { items: ReminderItem[]; events: ReminderEvent[] } {
  return {
    items: items.map((i) => ({
      id: i.id,
      kind: i.kind,
      label: i.label,
      blankOffRatingMicrons: i.blankOffRatingMicrons,
      oilEveryHours: i.oilEveryHours,
      oilEveryDays: i.oilEveryDays,
      checkEveryDays: i.checkEveryDays,
      addedOn: i.createdAt.toISOString().slice(0, 10),
    })),
    events: events.map((e) => ({ itemId: e.itemId, kind: e.kind, occurredOn: e.occurredOn, lowestMicrons: e.lowestMicrons, pumpHours: e.pumpHours })),
  };
}

/** Throws not_found unless the viewer may see the rig; forbidden when they may see but not change it. */
export async function requireRigAccess(db: Db, viewer: Viewer, rigId: string, need: "read" | "manage") {
  const access = await getRigAccessById(db, { viewer, rigId });
  if (!access) throw new AppError("not_found", "No such rig.");
  if (need === "manage" && access !== "manage") throw new AppError("forbidden", "Your role may see this rig but not change it.");
  return access;
}

/** The rig with its items, recent events (newest first), blank-off trend and reminders for `today`. */
export async function rigDetail(db: Db, viewer: Viewer, rigId: string, today: string, eventLimit = 50) {
  const rig = await getRigById(db, { viewer, rigId });
  if (!rig) throw new AppError("not_found", "No such rig.");
  return rigDetailOf(db, viewer, rig, today, eventLimit);
}

export async function rigDetailOf(
  db: Db,
  viewer: Viewer,
  rig: NonNullable<Awaited<ReturnType<typeof getRigById>>>,
  today: string,
  eventLimit = 50,
) {
  const [items, events, access] = await Promise.all([
    listRigItemsByRig(db, { organizationId: viewer.organizationId, rigId: rig.id }),
    listRigEventsByRig(db, { organizationId: viewer.organizationId, rigId: rig.id, limit: 500 }),
    getRigAccessById(db, { viewer, rigId: rig.id }),
  ]);
  const inputs = reminderInputs(items, events);
  const blankOffTrend = events
    .filter((e) => e.kind === "blank_off" && e.lowestMicrons !== null)
    .map((e) => ({ occurredOn: e.occurredOn, itemId: e.itemId, lowestMicrons: e.lowestMicrons! }))
    .reverse();
  return {
    rig,
    canManage: access === "manage",
    items,
    events: events.slice(0, eventLimit),
    blankOffTrend,
    reminders: rigReminders(inputs.items, inputs.events, today),
  };
}
