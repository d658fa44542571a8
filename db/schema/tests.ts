import {
  pgTable, text, timestamp, uuid, real, integer, boolean, jsonb, index, uniqueIndex, primaryKey, unique, foreignKey,
  type PgTableExtraConfigValue,
} from "drizzle-orm/pg-core";
import type { AnalysisResult, AnalyzeOptions, AcceptanceProfile } from "@/analysis/decay/types";
import { TEST_SOURCES, TEST_STATUSES, VERDICTS, type TestStatus, type Verdict } from "@/db/vocabulary";
import { organization, user } from "./auth";
import { oneOf } from "./checks";
import { jobs, sites, systems } from "./records";

export { TEST_STATUSES, type TestStatus };

/** One evacuation and decay test: the record a technician keeps. */
export const vacuumTests = pgTable(
  "vacuum_tests",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    createdById: text("created_by_id").notNull().references(() => user.id),
    // job, site, system and current analysis: composite foreign keys with the organization below.
    jobId: uuid("job_id"),
    siteId: uuid("site_id"),
    systemId: uuid("system_id"),
    title: text("title").notNull(),
    source: text("source", { enum: TEST_SOURCES }).notNull(),
    refrigerant: text("refrigerant"),
    lineSetFeet: real("line_set_feet"),
    liquidOd: text("liquid_od"),
    suctionOd: text("suction_od"),
    volumeLitres: real("volume_litres"),
    ambientC: real("ambient_c"),
    rigNote: text("rig_note"),
    notes: text("notes"),
    /** A note for the customer's copy of the report; `notes` stay internal and never reach it. */
    customerNote: text("customer_note"),
    isPractice: boolean("is_practice").default(false).notNull(),
    status: text("status", { enum: TEST_STATUSES }).default("submitted").notNull(),
    helpRequested: boolean("help_requested").default(false).notNull(),
    /** Denormalised from the current analysis for lists and filters. */
    verdict: text("verdict").$type<Verdict>(),
    currentAnalysisId: uuid("current_analysis_id"),
    testedAt: timestamp("tested_at", { withTimezone: true }).defaultNow().notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).defaultNow().notNull(),
  },
  // Typed by hand: the foreign keys to analyses and back make the inference circular.
  (t): PgTableExtraConfigValue[] => [
    index("tests_org_tested_idx").on(t.organizationId, t.testedAt),
    index("tests_org_creator_idx").on(t.organizationId, t.createdById),
    unique("vacuum_tests_org_id_key").on(t.organizationId, t.id),
    oneOf("vacuum_tests_status_check", t.status, TEST_STATUSES),
    oneOf("vacuum_tests_verdict_check", t.verdict, VERDICTS),
    oneOf("vacuum_tests_source_check", t.source, TEST_SOURCES),
    // The job, site, system and current analysis are the test's own organization's. Deleting one
    // empties only its column (the migration writes ON DELETE SET NULL (column), PostgreSQL 15+).
    foreignKey({ name: "vacuum_tests_job_fk", columns: [t.organizationId, t.jobId], foreignColumns: [jobs.organizationId, jobs.id] }).onDelete("set null"),
    foreignKey({ name: "vacuum_tests_site_fk", columns: [t.organizationId, t.siteId], foreignColumns: [sites.organizationId, sites.id] }).onDelete("set null"),
    foreignKey({ name: "vacuum_tests_system_fk", columns: [t.organizationId, t.systemId], foreignColumns: [systems.organizationId, systems.id] }).onDelete("set null"),
    // Circular with analyses (an analysis belongs to a test): checked at commit (DEFERRABLE INITIALLY DEFERRED in the migration).
    foreignKey({ name: "vacuum_tests_current_analysis_fk", columns: [t.organizationId, t.currentAnalysisId], foreignColumns: [analyses.organizationId, analyses.id] }).onDelete("set null"),
  ],
);

/** The raw file as uploaded: stored once in S3, never modified. */
export const uploads = pgTable(
  "uploads",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    testId: uuid("test_id").notNull().references(() => vacuumTests.id, { onDelete: "cascade" }),
    objectKey: text("object_key").notNull().unique(),
    sha256: text("sha256").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    filename: text("filename").notNull(),
    contentType: text("content_type").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("uploads_test_idx").on(t.testId)],
);

/** Each run of the analysis on a test; the test points to the current one. */
export const analyses = pgTable(
  "analyses",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    /** The test of the same organization (composite foreign key below). */
    testId: uuid("test_id").notNull(),
    version: integer("version").notNull(),
    engineVersion: text("engine_version").notNull(),
    options: jsonb("options").$type<AnalyzeOptions>().notNull(),
    profile: jsonb("profile").$type<AcceptanceProfile>().notNull(),
    result: jsonb("result").$type<AnalysisResult>().notNull(),
    series: jsonb("series").$type<{ t: number[]; p: number[] }>().notNull(),
    verdict: text("verdict").$type<Verdict>().notNull(),
    confidence: real("confidence").notNull(),
    isolationAt: real("isolation_at"),
    reason: text("reason"),
    createdById: text("created_by_id").notNull().references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t): PgTableExtraConfigValue[] => [
    uniqueIndex("analyses_test_version_idx").on(t.testId, t.version),
    unique("analyses_org_id_key").on(t.organizationId, t.id),
    oneOf("analyses_verdict_check", t.verdict, VERDICTS),
    foreignKey({ name: "analyses_test_fk", columns: [t.organizationId, t.testId], foreignColumns: [vacuumTests.organizationId, vacuumTests.id] }).onDelete("cascade"),
  ],
);

export const findings = pgTable(
  "findings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    analysisId: uuid("analysis_id").notNull().references(() => analyses.id, { onDelete: "cascade" }),
    testId: uuid("test_id").notNull().references(() => vacuumTests.id, { onDelete: "cascade" }),
    code: text("code").notNull(),
    severity: text("severity").notNull(),
    title: text("title").notNull(),
  },
  (t) => [index("findings_analysis_idx").on(t.analysisId), index("findings_org_code_idx").on(t.organizationId, t.code)],
);

/**
 * A retried upload, re-test upload or re-analysis with the same key returns the first result
 * instead of a duplicate (IETF httpapi draft "The Idempotency-Key HTTP Header Field"): a key is
 * scoped to the person who sent it, and stored with the fingerprint of the request it came with.
 */
export const idempotencyKeys = pgTable(
  "idempotency_keys",
  {
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    key: text("key").notNull(),
    userId: text("user_id").notNull().references(() => user.id, { onDelete: "cascade" }),
    testId: uuid("test_id").notNull().references(() => vacuumTests.id, { onDelete: "cascade" }),
    /** Set for a re-test upload: the analysis it made (a retry answers with that one). */
    analysisId: uuid("analysis_id").references(() => analyses.id, { onDelete: "cascade" }),
    /** SHA-256 of the request's meaning (route, file, fields); null for keys stored before it was kept. */
    requestFingerprint: text("request_fingerprint"),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [primaryKey({ columns: [t.organizationId, t.userId, t.key] })],
);

/** A test shared with a member who could not otherwise see it. */
export const testShares = pgTable(
  "test_shares",
  {
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    testId: uuid("test_id").notNull().references(() => vacuumTests.id, { onDelete: "cascade" }),
    userId: text("user_id").notNull().references(() => user.id, { onDelete: "cascade" }),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [primaryKey({ columns: [t.testId, t.userId] })],
);

/** An organization's acceptance rules; one is the default. */
export const acceptanceProfiles = pgTable(
  "acceptance_profiles",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    targetMicrons: real("target_microns").notNull(),
    holdMinutes: real("hold_minutes").notNull(),
    limitMicrons: real("limit_microns").notNull(),
    leakRateMicronsPerMinute: real("leak_rate_microns_per_minute").notNull(),
    isDefault: boolean("is_default").default(false).notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("profiles_org_idx").on(t.organizationId)],
);
