import { pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { organization } from "./auth";

/** A shop's own settings, one row per organization (absent = the defaults). */
export const organizationSettings = pgTable("organization_settings", {
  organizationId: text("organization_id").primaryKey().references(() => organization.id, { onDelete: "cascade" }),
  /** IANA time zone the shop's reports and e-mails write times in ("America/Chicago"). */
  timeZone: text("time_zone").default("UTC").notNull(),
  /** The From display name of the shop's mail (the address stays MAIL_FROM); null: MAIL_FROM's own. */
  mailSenderName: text("mail_sender_name"),
  /** Who receives review mail: user ids of members; null or empty: every lead (owners when no lead). */
  reviewMailTo: text("review_mail_to").array(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).defaultNow().notNull(),
});
