import { pgTable, text, timestamp, uuid, integer, jsonb, index, uniqueIndex } from "drizzle-orm/pg-core";
import { organization, user } from "./auth";
import { oneOf } from "./checks";
import { vacuumTests } from "./tests";

/** Background work a person started and follows: a large log being analysed, a re-analysis of many tests. */
export const TASK_KINDS = ["log_analysis", "bulk_reanalysis"] as const;
export type TaskKind = (typeof TASK_KINDS)[number];

export const TASK_STATES = ["queued", "running", "done", "failed"] as const;
export type TaskState = (typeof TASK_STATES)[number];

/** What the task is doing now, for the page that follows it. */
export const TASK_STAGES = ["queued", "reading", "analysing", "saving", "done", "failed"] as const;
export type TaskStage = (typeof TASK_STAGES)[number];

/**
 * One followed background task (its pg-boss job carries the id). Progress is written here by the
 * job, in the same transaction as the work it counts, so a retried job never counts twice.
 */
export const backgroundTasks = pgTable(
  "background_tasks",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    requestedById: text("requested_by_id").notNull().references(() => user.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: TASK_KINDS }).notNull(),
    state: text("state", { enum: TASK_STATES }).default("queued").notNull(),
    stage: text("stage", { enum: TASK_STAGES }).default("queued").notNull(),
    /** Items to do and done so far (a bulk re-analysis: tests; a log: 1). */
    total: integer("total").default(1).notNull(),
    done: integer("done").default(0).notNull(),
    /** Items that could not be done (a log that no longer reads, say), counted in `done` too. */
    failedItems: integer("failed_items").default(0).notNull(),
    /** What the job needs (the upload's metadata, the profile to re-check with). */
    input: jsonb("input").notNull(),
    /** A large log's stored raw file, until the test that names it is committed. */
    objectKey: text("object_key"),
    /** Where a chunked job carries on: the last item done. */
    cursor: text("cursor"),
    /** The test a log analysis made. */
    testId: uuid("test_id").references(() => vacuumTests.id, { onDelete: "set null" }),
    /** The upload's Idempotency-Key: a retried upload answers with this task. */
    idempotencyKey: text("idempotency_key"),
    /** A failure in words, and its details (an unreadable log's line and reason). */
    error: text("error"),
    errorDetails: jsonb("error_details"),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).defaultNow().notNull(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [
    // Keys belong to the person who sent them, as idempotency_keys do.
    uniqueIndex("background_tasks_key_idx").on(t.organizationId, t.requestedById, t.idempotencyKey),
    index("background_tasks_org_state_idx").on(t.organizationId, t.state),
    oneOf("background_tasks_state_check", t.state, TASK_STATES),
    oneOf("background_tasks_stage_check", t.stage, TASK_STAGES),
  ],
);
