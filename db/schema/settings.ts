import { pgTable, primaryKey, text, timestamp } from "drizzle-orm/pg-core";
import { organization, user } from "./auth";

/** A shop's own settings, one row per organization (absent = the defaults). */
export const organizationSettings = pgTable("organization_settings", {
  organizationId: text("organization_id").primaryKey().references(() => organization.id, { onDelete: "cascade" }),
  /** IANA time zone the shop's reports and e-mails write times in ("America/Chicago"). */
  timeZone: text("time_zone").default("UTC").notNull(),
  /** "imperial" (°F, ft, lb·oz, psig) or "metric" (°C, m, kg, kPa): the shop's working units. */
  unitSystem: text("unit_system").default("imperial").notNull(),
  /** The From display name of the shop's mail (the address stays MAIL_FROM); null: MAIL_FROM's own. */
  mailSenderName: text("mail_sender_name"),
  /** Who receives review mail: user ids of members; null or empty: every lead (owners when no lead). */
  reviewMailTo: text("review_mail_to").array(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).defaultNow().notNull(),
});

/** One member's own preferences in one shop (absent = the shop's). */
export const memberPreferences = pgTable(
  "member_preferences",
  {
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    userId: text("user_id").notNull().references(() => user.id, { onDelete: "cascade" }),
    /** "imperial" or "metric"; null = follow the shop's. */
    unitSystem: text("unit_system"),
    updatedAt: timestamp("updated_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [primaryKey({ columns: [t.organizationId, t.userId] })],
);
