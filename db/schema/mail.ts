import { pgTable, primaryKey, text, timestamp } from "drizzle-orm/pg-core";
import { organization, user } from "./auth";
import { oneOf } from "./checks";

/**
 * Kinds of mail a person may turn off for themselves. Password resets, invitations and reports to
 * customers have no kind: they are essential and always sent.
 */
export const MAIL_KINDS = ["review_request", "comment", "review_outcome", "rig_reminder"] as const;
export type MailKind = (typeof MAIL_KINDS)[number];

/** One row per kind a member turned off in one shop (absent: the mail is sent). */
export const mailOptOuts = pgTable(
  "mail_opt_outs",
  {
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    userId: text("user_id").notNull().references(() => user.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: MAIL_KINDS }).notNull(),
    /** "settings" (the person's page) or "unsubscribe" (the link in a mail). */
    via: text("via", { enum: ["settings", "unsubscribe"] }).notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [primaryKey({ columns: [t.organizationId, t.userId, t.kind] }), oneOf("mail_opt_outs_kind_check", t.kind, MAIL_KINDS)],
);
