import { pgTable, text, timestamp, uuid, real, jsonb, index } from "drizzle-orm/pg-core";
import type { NitrogenResult } from "@/analysis/nitrogen";
import { organization, user } from "./auth";
import { jobs } from "./records";

/** A nitrogen standing-pressure test: start and end readings with temperatures, and the verdict. */
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
    /** The logger's readings (gauge unit) when the test came from a file. */
    series: jsonb("series").$type<{ tSeconds: number[]; pressureGauge: number[]; temperature: number[] | null }>(),
    verdict: text("verdict", { enum: ["holds", "drops", "rises"] }).notNull(),
    result: jsonb("result").$type<NitrogenResult>().notNull(),
    notes: text("notes"),
    testedAt: timestamp("tested_at", { withTimezone: true }).defaultNow().notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("pressure_tests_org_tested_idx").on(t.organizationId, t.testedAt), index("pressure_tests_org_creator_idx").on(t.organizationId, t.createdById)],
);
