import { sql } from "drizzle-orm";
import { pgTable, text, timestamp, uuid, real, jsonb, index, check, uniqueIndex } from "drizzle-orm/pg-core";
import type { NitrogenResult } from "@/analysis/calculators/nitrogen";
import { organization, user } from "./auth";
import { PRESSURE_VERDICTS } from "@/db/vocabulary";
import { oneOf } from "./checks";
import { jobs } from "./records";

/**
 * A nitrogen standing-pressure test: start and end readings with temperatures, when it started and
 * ended, the highest reading, the verdict, and (for a test that went above the rated test pressure)
 * who acknowledged that and when — the database refuses a "stopped" record without it.
 */
export const pressureTests = pgTable(
  "pressure_tests",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    createdById: text("created_by_id").notNull().references(() => user.id),
    jobId: uuid("job_id").references(() => jobs.id, { onDelete: "set null" }),
    title: text("title").notNull(),
    source: text("source", { enum: ["typed", "file"] }).notNull(),
    unit: text("unit", { enum: ["psig", "kpa_gauge", "bar_gauge"] }).notNull(),
    temperatureUnit: text("temperature_unit", { enum: ["F", "C"] }).notNull(),
    startPressure: real("start_pressure").notNull(),
    startTemperature: real("start_temperature").notNull(),
    endPressure: real("end_pressure").notNull(),
    endTemperature: real("end_temperature").notNull(),
    atmosphereAbs: real("atmosphere_abs").notNull(),
    ratedTestPressure: real("rated_test_pressure"),
    gaugeResolution: real("gauge_resolution"),
    durationSeconds: real("duration_seconds"),
    startedAt: timestamp("started_at", { withTimezone: true }),
    endedAt: timestamp("ended_at", { withTimezone: true }),
    /** The highest reading of the test (gauge unit) and seconds from the start it was read at. */
    highestPressure: real("highest_pressure"),
    highestAtSeconds: real("highest_at_seconds"),
    /** How the atmosphere was found; the site's elevation when it was computed from it. */
    atmosphereSource: text("atmosphere_source", { enum: ["standard", "entered", "elevation"] }),
    elevationM: real("elevation_m"),
    /** How the readings were read (the file's unit, gauge or absolute, and who said so). */
    assumptions: jsonb("assumptions").$type<string[]>(),
    overPressureAcknowledgedAt: timestamp("over_pressure_acknowledged_at", { withTimezone: true }),
    overPressureAcknowledgedById: text("over_pressure_acknowledged_by_id").references(() => user.id),
    /** The logger's readings (gauge unit) when the test came from a file. */
    series: jsonb("series").$type<{ tSeconds: number[]; pressureGauge: number[]; temperature: number[] | null }>(),
    verdict: text("verdict", { enum: PRESSURE_VERDICTS }).notNull(),
    result: jsonb("result").$type<NitrogenResult>().notNull(),
    notes: text("notes"),
    /** The Idempotency-Key the record was made with (a retry answers with this record), scoped to the person who sent it. */
    idempotencyKey: text("idempotency_key"),
    /** SHA-256 of the create request's meaning: the same key with another request is refused (422). */
    requestFingerprint: text("request_fingerprint"),
    testedAt: timestamp("tested_at", { withTimezone: true }).defaultNow().notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [
    index("pressure_tests_org_tested_idx").on(t.organizationId, t.testedAt),
    index("pressure_tests_org_creator_idx").on(t.organizationId, t.createdById),
    uniqueIndex("pressure_tests_key_idx").on(t.organizationId, t.createdById, t.idempotencyKey),
    check("pressure_tests_over_pressure_acknowledged", sql`${t.verdict} <> 'stopped' OR (${t.overPressureAcknowledgedAt} IS NOT NULL AND ${t.overPressureAcknowledgedById} IS NOT NULL)`),
    oneOf("pressure_tests_verdict_check", t.verdict, PRESSURE_VERDICTS),
    check("pressure_tests_times_in_order", sql`${t.startedAt} IS NULL OR ${t.endedAt} IS NULL OR ${t.endedAt} > ${t.startedAt}`),
  ],
);
