/**
 * Rig upkeep reminders, worked out from the items and their logged events on a given day.
 * Pure: the day is passed in (never the wall clock), so tests use fixed dates.
 *
 * Rules (our own design; common practice, no published source):
 *  - oil_due: a pump's oil is due when the days since its last oil change reach `oilEveryDays`,
 *    or the pumping hours since then (latest hour-meter reading − reading at the change) reach
 *    `oilEveryHours`; "oil_due_soon" within 7 days of the date. A pump with no oil change logged
 *    and an interval set counts from the day it was added to the rig.
 *  - blank_off_worse: the last three blank-off readings each higher than the one before, the latest at
 *    least 1.5 × the first of them; blank_off_above_rating: the latest above 2 × the maker's rating.
 *  - gauge_check_overdue: days since the gauge was last checked against a reference (or added)
 *    reach `checkEveryDays`.
 */
export interface ReminderItem {
  id: string;
  kind: "pump" | "gauge" | "hose" | "core_tool";
  label: string;
  blankOffRatingMicrons: number | null;
  oilEveryHours: number | null;
  oilEveryDays: number | null;
  checkEveryDays: number | null;
  /** YYYY-MM-DD the item was added. */
  addedOn: string;
}

export interface ReminderEvent {
  itemId: string | null;
  kind: string;
  /** YYYY-MM-DD. */
  occurredOn: string;
  lowestMicrons: number | null;
  pumpHours: number | null;
}

export type ReminderCode = "oil_due" | "oil_due_soon" | "blank_off_worse" | "blank_off_above_rating" | "gauge_check_overdue";

export interface Reminder {
  code: ReminderCode;
  itemId: string;
  itemLabel: string;
  severity: "advice" | "warning";
  title: string;
  message: string;
  /** YYYY-MM-DD the reminder falls due, when it has a date. */
  dueOn: string | null;
}

export const OIL_SOON_DAYS = 7;
export const BLANK_OFF_WORSE_FACTOR = 1.5;
export const BLANK_OFF_RATING_FACTOR = 2;

const DAY_MS = 86_400_000;
function dayNumber(isoDate: string): number {
  const [y, m, d] = isoDate.slice(0, 10).split("-").map(Number);
  return Date.UTC(y, m - 1, d) / DAY_MS;
}
function isoOfDay(day: number): string {
  return new Date(day * DAY_MS).toISOString().slice(0, 10);
}

/** Events that belong to an item: its own, or the rig's unassigned ones when it is the only item of its kind. */
function eventsOf(item: ReminderItem, items: readonly ReminderItem[], events: readonly ReminderEvent[]): ReminderEvent[] {
  const only = items.filter((i) => i.kind === item.kind).length === 1;
  return events
    .filter((e) => e.itemId === item.id || (e.itemId === null && only))
    .sort((a, b) => dayNumber(a.occurredOn) - dayNumber(b.occurredOn));
}

function pumpReminders(item: ReminderItem, own: ReminderEvent[], today: number): Reminder[] {
  const out: Reminder[] = [];
  const oil = own.filter((e) => e.kind === "oil_changed");
  const lastOil = oil[oil.length - 1];
  const sinceDay = lastOil ? dayNumber(lastOil.occurredOn) : dayNumber(item.addedOn);
  const since = lastOil ? `since the last oil change (${lastOil.occurredOn})` : `since it was added (${item.addedOn}) with no oil change logged`;
  let oilDue = false;
  if (item.oilEveryDays) {
    const due = sinceDay + item.oilEveryDays;
    if (today >= due) {
      oilDue = true;
      out.push({ code: "oil_due", itemId: item.id, itemLabel: item.label, severity: "warning", title: `Oil change due: ${item.label}`, message: `${today - sinceDay} days ${since}; the interval is ${item.oilEveryDays} days.`, dueOn: isoOfDay(due) });
    } else if (due - today <= OIL_SOON_DAYS) {
      out.push({ code: "oil_due_soon", itemId: item.id, itemLabel: item.label, severity: "advice", title: `Oil change soon: ${item.label}`, message: `Due on ${isoOfDay(due)} (${item.oilEveryDays}-day interval).`, dueOn: isoOfDay(due) });
    }
  }
  if (item.oilEveryHours && !oilDue) {
    const readings = own.filter((e) => e.pumpHours !== null && dayNumber(e.occurredOn) <= today);
    const latest = readings[readings.length - 1]?.pumpHours ?? null;
    const atChange = lastOil?.pumpHours ?? (lastOil ? null : 0);
    if (latest !== null && atChange !== null && latest - atChange >= item.oilEveryHours)
      out.push({ code: "oil_due", itemId: item.id, itemLabel: item.label, severity: "warning", title: `Oil change due: ${item.label}`, message: `${(latest - atChange).toFixed(1)} pumping hours ${since}; the interval is ${item.oilEveryHours} hours.`, dueOn: null });
  }
  const blankOffs = own.filter((e) => e.kind === "blank_off" && e.lowestMicrons !== null && dayNumber(e.occurredOn) <= today);
  const last3 = blankOffs.slice(-3).map((e) => e.lowestMicrons!);
  if (last3.length === 3 && last3[1] > last3[0] && last3[2] > last3[1] && last3[2] >= BLANK_OFF_WORSE_FACTOR * last3[0])
    out.push({ code: "blank_off_worse", itemId: item.id, itemLabel: item.label, severity: "advice", title: `Blank-off getting worse: ${item.label}`, message: `The last three blank-off tests read ${last3.map((m) => Math.round(m)).join(" → ")} microns. Change the oil; if it stays high, the pump needs service.`, dueOn: null });
  const latest = last3[last3.length - 1];
  if (latest !== undefined && item.blankOffRatingMicrons && latest > BLANK_OFF_RATING_FACTOR * item.blankOffRatingMicrons)
    out.push({ code: "blank_off_above_rating", itemId: item.id, itemLabel: item.label, severity: "warning", title: `Blank-off far above rating: ${item.label}`, message: `Latest blank-off ${Math.round(latest)} microns; the maker rates it ${item.blankOffRatingMicrons} microns.`, dueOn: null });
  return out;
}

function gaugeReminders(item: ReminderItem, own: ReminderEvent[], today: number): Reminder[] {
  if (!item.checkEveryDays) return [];
  const checks = own.filter((e) => e.kind === "gauge_checked" && dayNumber(e.occurredOn) <= today);
  const last = checks[checks.length - 1];
  const from = last ? dayNumber(last.occurredOn) : dayNumber(item.addedOn);
  const due = from + item.checkEveryDays;
  if (today < due) return [];
  return [{
    code: "gauge_check_overdue",
    itemId: item.id,
    itemLabel: item.label,
    severity: "advice",
    title: `Gauge check overdue: ${item.label}`,
    message: last ? `Last checked against a reference on ${last.occurredOn}; the interval is ${item.checkEveryDays} days.` : `Never checked against a reference since it was added (${item.addedOn}); the interval is ${item.checkEveryDays} days.`,
    dueOn: isoOfDay(due),
  }];
}

/** Every reminder for a rig on `today` (YYYY-MM-DD), warnings first. */
export function rigReminders(items: readonly ReminderItem[], events: readonly ReminderEvent[], today: string): Reminder[] {
  const day = dayNumber(today);
  const out: Reminder[] = [];
  for (const item of items) {
    const own = eventsOf(item, items, events);
    if (item.kind === "pump") out.push(...pumpReminders(item, own, day));
    if (item.kind === "gauge") out.push(...gaugeReminders(item, own, day));
  }
  return out.sort((a, b) => (a.severity === b.severity ? 0 : a.severity === "warning" ? -1 : 1));
}
