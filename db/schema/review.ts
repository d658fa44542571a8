import { sql } from "drizzle-orm";
import { pgTable, text, timestamp, uuid, real, integer, index, uniqueIndex } from "drizzle-orm/pg-core";
import { organization, user } from "./auth";
import { oneOf } from "./checks";
import { MAIL_KINDS } from "./mail";
import { TEST_STATUSES, vacuumTests } from "./tests";

/** What happened to a test, for the audit trail shown on the test page. */
export const TEST_EVENT_KINDS = [
  "submitted",
  "review_requested",
  "help_requested",
  "signed_off",
  "accepted_with_reason",
  "sent_back",
  "resubmitted",
  "retest_uploaded",
  "commented",
  "report_emailed",
  "share_link_created",
  "share_link_revoked",
] as const;
export type TestEventKind = (typeof TEST_EVENT_KINDS)[number];

/** The audit trail: every state change and comment with who and when. Append-only. */
export const testEvents = pgTable(
  "test_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    testId: uuid("test_id").notNull().references(() => vacuumTests.id, { onDelete: "cascade" }),
    /** null for the system itself (automatic routing into review). */
    actorId: text("actor_id").references(() => user.id, { onDelete: "set null" }),
    kind: text("kind", { enum: TEST_EVENT_KINDS }).notNull(),
    fromStatus: text("from_status", { enum: TEST_STATUSES }),
    toStatus: text("to_status", { enum: TEST_STATUSES }),
    note: text("note"),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [
    index("test_events_test_idx").on(t.organizationId, t.testId, t.createdAt),
    oneOf("test_events_kind_check", t.kind, TEST_EVENT_KINDS),
    oneOf("test_events_from_status_check", t.fromStatus, TEST_STATUSES),
    oneOf("test_events_to_status_check", t.toStatus, TEST_STATUSES),
  ],
);

/** A comment on a test, optionally pinned to a time on the curve. */
export const testComments = pgTable(
  "test_comments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    testId: uuid("test_id").notNull().references(() => vacuumTests.id, { onDelete: "cascade" }),
    authorId: text("author_id").notNull().references(() => user.id),
    body: text("body").notNull(),
    /** Seconds from the first data row (same time base as the analysis), or null. */
    atSeconds: real("at_seconds"),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("test_comments_test_idx").on(t.organizationId, t.testId, t.createdAt)],
);

/** "dead": Riseline stopped trying (the address was refused, or a day of tries went by); a person may send it again. */
/** "off": not sent because the person turned that kind of mail off for themselves (db/schema/mail.ts). */
export const MAIL_STATUSES = ["pending", "sent", "failed", "dead", "off"] as const;
export type MailStatus = (typeof MAIL_STATUSES)[number];

/** Outgoing e-mail, written in the same transaction as the change it announces; sent after commit. */
export const mailOutbox = pgTable(
  "mail_outbox",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    testId: uuid("test_id").references(() => vacuumTests.id, { onDelete: "set null" }),
    to: text("to_address").notNull(),
    subject: text("subject").notNull(),
    text: text("text_body").notNull(),
    html: text("html_body").notNull(),
    /** Built at send time so the body never goes stale: "report_pdf" attaches the test's report. */
    attachment: text("attachment", { enum: ["report_pdf"] }),
    /** The kind a person may turn off (null: essential mail, always sent, no unsubscribe link). */
    kind: text("kind", { enum: MAIL_KINDS }),
    status: text("status", { enum: MAIL_STATUSES }).default("pending").notNull(),
    attempts: integer("attempts").default(0).notNull(),
    lastError: text("last_error"),
    /** When the delivery job tries again after a failure (null: not waiting for a retry). */
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }),
    /** Automatic tries stop after this (a day after it was queued, or after a person sent it again). */
    retryUntil: timestamp("retry_until", { withTimezone: true }).default(sql`now() + interval '24 hours'`).notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
  },
  (t) => [
    index("mail_outbox_status_idx").on(t.status, t.createdAt),
    index("mail_outbox_org_idx").on(t.organizationId),
    oneOf("mail_outbox_status_check", t.status, MAIL_STATUSES),
  ],
);

/** A read-only link to one test's report. Only the SHA-256 of the token is stored. */
export const shareLinks = pgTable(
  "share_links",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    testId: uuid("test_id").notNull().references(() => vacuumTests.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdById: text("created_by_id").notNull().references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [uniqueIndex("share_links_token_idx").on(t.tokenHash), index("share_links_test_idx").on(t.organizationId, t.testId)],
);
