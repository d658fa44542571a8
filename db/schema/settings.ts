import { pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { organization } from "./auth";

/** A shop's own settings, one row per organization (absent = the defaults). */
export const organizationSettings = pgTable("organization_settings", {
  organizationId: text("organization_id").primaryKey().references(() => organization.id, { onDelete: "cascade" }),
  /** IANA time zone the shop's reports and e-mails write times in ("America/Chicago"). */
  timeZone: text("time_zone").default("UTC").notNull(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).defaultNow().notNull(),
});
