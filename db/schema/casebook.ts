import { pgTable, text, timestamp, uuid, real, integer, boolean, index, uniqueIndex } from "drizzle-orm/pg-core";
import { organization, user } from "./auth";
import { vacuumTests } from "./tests";

/** A trainer's collection of curves worth teaching from ("Leaks that look like moisture"). */
export const casebookCollections = pgTable(
  "casebook_collections",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    description: text("description"),
    /** Built from the simulator (the starter casebook), not from a real job. */
    isSimulated: boolean("is_simulated").default(false).notNull(),
    /** A stable key for seeded collections, so seeding twice finds the first. */
    seedKey: text("seed_key"),
    createdById: text("created_by_id").notNull().references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("casebook_collections_org_idx").on(t.organizationId), uniqueIndex("casebook_collections_seed_idx").on(t.organizationId, t.seedKey)],
);

/** One test in a collection, with the trainer's title and notes. */
export const casebookEntries = pgTable(
  "casebook_entries",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    collectionId: uuid("collection_id").notNull().references(() => casebookCollections.id, { onDelete: "cascade" }),
    testId: uuid("test_id").notNull().references(() => vacuumTests.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    notes: text("notes"),
    order: integer("order").default(0).notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("casebook_entries_collection_idx").on(t.collectionId, t.order), index("casebook_entries_org_idx").on(t.organizationId)],
);

/** A note pinned at a time on an entry's curve (seconds from the test's first data row). */
export const casebookPins = pgTable(
  "casebook_pins",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    entryId: uuid("entry_id").notNull().references(() => casebookEntries.id, { onDelete: "cascade" }),
    atSeconds: real("at_seconds").notNull(),
    text: text("text").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("casebook_pins_entry_idx").on(t.entryId)],
);

export const PRACTICE_CALLS = ["pass", "leak", "moisture", "leak_and_moisture", "inconclusive"] as const;
export type PracticeCall = (typeof PRACTICE_CALLS)[number];

/** An apprentice's own reading of a practice test, made before the verdict was shown. */
export const practiceCalls = pgTable(
  "practice_calls",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    testId: uuid("test_id").notNull().references(() => vacuumTests.id, { onDelete: "cascade" }),
    apprenticeId: text("apprentice_id").notNull().references(() => user.id, { onDelete: "cascade" }),
    call: text("call", { enum: PRACTICE_CALLS }).notNull(),
    reason: text("reason").notNull(),
    /** The analysis' verdict when the call was made (the call is judged against this). */
    analysisVerdict: text("analysis_verdict").notNull(),
    matched: boolean("matched").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [uniqueIndex("practice_calls_test_apprentice_idx").on(t.testId, t.apprenticeId), index("practice_calls_org_apprentice_idx").on(t.organizationId, t.apprenticeId)],
);

/** A trainer's (or anyone's) comment on a practice call. */
export const practiceComments = pgTable(
  "practice_comments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    callId: uuid("call_id").notNull().references(() => practiceCalls.id, { onDelete: "cascade" }),
    authorId: text("author_id").notNull().references(() => user.id, { onDelete: "cascade" }),
    body: text("body").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("practice_comments_call_idx").on(t.callId)],
);
