ALTER TABLE "pressure_tests" ADD COLUMN "started_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD COLUMN "ended_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD COLUMN "highest_pressure" real;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD COLUMN "highest_at_seconds" real;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD COLUMN "atmosphere_source" text;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD COLUMN "elevation_m" real;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD COLUMN "assumptions" jsonb;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD COLUMN "over_pressure_acknowledged_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD COLUMN "over_pressure_acknowledged_by_id" text;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD CONSTRAINT "pressure_tests_over_pressure_acknowledged_by_id_user_id_fk" FOREIGN KEY ("over_pressure_acknowledged_by_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD CONSTRAINT "pressure_tests_over_pressure_acknowledged" CHECK ("pressure_tests"."verdict" <> 'stopped' OR ("pressure_tests"."over_pressure_acknowledged_at" IS NOT NULL AND "pressure_tests"."over_pressure_acknowledged_by_id" IS NOT NULL));--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD CONSTRAINT "pressure_tests_times_in_order" CHECK ("pressure_tests"."started_at" IS NULL OR "pressure_tests"."ended_at" IS NULL OR "pressure_tests"."ended_at" > "pressure_tests"."started_at");