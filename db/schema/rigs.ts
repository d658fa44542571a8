import { pgTable, text, timestamp, uuid, real, integer, date, index, primaryKey } from "drizzle-orm/pg-core";
import { organization, user } from "./auth";
import { vacuumTests } from "./tests";

export const RIG_ITEM_KINDS = ["pump", "gauge", "hose", "core_tool"] as const;
export type RigItemKind = (typeof RIG_ITEM_KINDS)[number];

export const RIG_EVENT_KINDS = ["oil_changed", "blank_off", "gauge_cleaned", "gauge_checked", "hose_gaskets_replaced", "pump_hours"] as const;
export type RigEventKind = (typeof RIG_EVENT_KINDS)[number];

export const OIL_CHANGE_REASONS = ["routine", "after_burnout", "cloudy_oil"] as const;
export type OilChangeReason = (typeof OIL_CHANGE_REASONS)[number];

/** A technician's or a truck's evacuation kit. `keeperId` is the member who keeps it (manages it). */
export const rigs = pgTable(
  "rigs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    truck: text("truck"),
    keeperId: text("keeper_id").references(() => user.id, { onDelete: "set null" }),
    createdById: text("created_by_id").notNull().references(() => user.id),
    notes: text("notes"),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("rigs_org_keeper_idx").on(t.organizationId, t.keeperId)],
);

/** One piece of equipment on a rig: pump, micron gauge, hose or core-removal tool. */
export const rigItems = pgTable(
  "rig_items",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    rigId: uuid("rig_id").notNull().references(() => rigs.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: RIG_ITEM_KINDS }).notNull(),
    label: text("label").notNull(),
    /** Pumps: free-air displacement (CFM) and the maker's blank-off rating (microns). */
    freeAirCfm: real("free_air_cfm"),
    blankOffRatingMicrons: real("blank_off_rating_microns"),
    /** Pumps: change the oil every so many pumping hours and/or days. */
    oilEveryHours: real("oil_every_hours"),
    oilEveryDays: integer("oil_every_days"),
    /** Gauges: check against a reference every so many days. */
    checkEveryDays: integer("check_every_days"),
    /** Hoses. */
    insideDiameterIn: real("inside_diameter_in"),
    lengthFt: real("length_ft"),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("rig_items_rig_idx").on(t.rigId)],
);

/** Upkeep and checks: oil changes, blank-off tests, gauge cleaning and checks, hose gaskets, hour-meter readings. */
export const rigEvents = pgTable(
  "rig_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    rigId: uuid("rig_id").notNull().references(() => rigs.id, { onDelete: "cascade" }),
    itemId: uuid("item_id").references(() => rigItems.id, { onDelete: "set null" }),
    kind: text("kind", { enum: RIG_EVENT_KINDS }).notNull(),
    occurredOn: date("occurred_on").notNull(),
    oilReason: text("oil_reason", { enum: OIL_CHANGE_REASONS }),
    /** Blank-off: the lowest reading with the pump alone on the gauge. */
    lowestMicrons: real("lowest_microns"),
    /** Pump hour meter (or running total of pumping hours) at the event. */
    pumpHours: real("pump_hours"),
    /** Gauge check: what the reference read and what this gauge read. */
    referenceMicrons: real("reference_microns"),
    gaugeMicrons: real("gauge_microns"),
    note: text("note"),
    createdById: text("created_by_id").notNull().references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("rig_events_rig_idx").on(t.rigId, t.occurredOn)],
);

/** Which rig a vacuum test was made with (one rig per test). */
export const testRigs = pgTable(
  "test_rigs",
  {
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    testId: uuid("test_id").notNull().references(() => vacuumTests.id, { onDelete: "cascade" }),
    rigId: uuid("rig_id").notNull().references(() => rigs.id, { onDelete: "cascade" }),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [primaryKey({ columns: [t.testId] }), index("test_rigs_rig_idx").on(t.rigId)],
);

/**
 * Rig reminders already e-mailed: one row per item and reminder while the reminder stands, so the
 * daily job mails a reminder once when it comes up, and again only if it clears and comes back.
 */
export const rigReminderNotices = pgTable(
  "rig_reminder_notices",
  {
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    rigId: uuid("rig_id").notNull().references(() => rigs.id, { onDelete: "cascade" }),
    itemId: uuid("item_id").notNull().references(() => rigItems.id, { onDelete: "cascade" }),
    code: text("code").notNull(),
    notifiedAt: timestamp("notified_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [primaryKey({ columns: [t.itemId, t.code] }), index("rig_reminder_notices_rig_idx").on(t.organizationId, t.rigId)],
);
