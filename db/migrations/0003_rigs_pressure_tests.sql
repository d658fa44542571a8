CREATE TABLE "rig_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" text NOT NULL,
	"rig_id" uuid NOT NULL,
	"item_id" uuid,
	"kind" text NOT NULL,
	"occurred_on" date NOT NULL,
	"oil_reason" text,
	"lowest_microns" real,
	"pump_hours" real,
	"reference_microns" real,
	"gauge_microns" real,
	"note" text,
	"created_by_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rig_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" text NOT NULL,
	"rig_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"label" text NOT NULL,
	"free_air_cfm" real,
	"blank_off_rating_microns" real,
	"oil_every_hours" real,
	"oil_every_days" integer,
	"check_every_days" integer,
	"inside_diameter_in" real,
	"length_ft" real,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rigs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" text NOT NULL,
	"name" text NOT NULL,
	"truck" text,
	"keeper_id" text,
	"created_by_id" text NOT NULL,
	"notes" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "test_rigs" (
	"organization_id" text NOT NULL,
	"test_id" uuid NOT NULL,
	"rig_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "test_rigs_test_id_pk" PRIMARY KEY("test_id")
);
--> statement-breakpoint
CREATE TABLE "pressure_tests" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" text NOT NULL,
	"created_by_id" text NOT NULL,
	"job_id" uuid,
	"title" text NOT NULL,
	"source" text NOT NULL,
	"unit" text NOT NULL,
	"temperature_unit" text NOT NULL,
	"start_pressure" real NOT NULL,
	"start_temperature" real NOT NULL,
	"end_pressure" real NOT NULL,
	"end_temperature" real NOT NULL,
	"atmosphere_abs" real NOT NULL,
	"rated_test_pressure" real,
	"gauge_resolution" real,
	"duration_seconds" real,
	"series" jsonb,
	"verdict" text NOT NULL,
	"result" jsonb NOT NULL,
	"notes" text,
	"tested_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "rig_events" ADD CONSTRAINT "rig_events_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rig_events" ADD CONSTRAINT "rig_events_rig_id_rigs_id_fk" FOREIGN KEY ("rig_id") REFERENCES "public"."rigs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rig_events" ADD CONSTRAINT "rig_events_item_id_rig_items_id_fk" FOREIGN KEY ("item_id") REFERENCES "public"."rig_items"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rig_events" ADD CONSTRAINT "rig_events_created_by_id_user_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rig_items" ADD CONSTRAINT "rig_items_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rig_items" ADD CONSTRAINT "rig_items_rig_id_rigs_id_fk" FOREIGN KEY ("rig_id") REFERENCES "public"."rigs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rigs" ADD CONSTRAINT "rigs_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rigs" ADD CONSTRAINT "rigs_keeper_id_user_id_fk" FOREIGN KEY ("keeper_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rigs" ADD CONSTRAINT "rigs_created_by_id_user_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_rigs" ADD CONSTRAINT "test_rigs_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_rigs" ADD CONSTRAINT "test_rigs_test_id_vacuum_tests_id_fk" FOREIGN KEY ("test_id") REFERENCES "public"."vacuum_tests"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_rigs" ADD CONSTRAINT "test_rigs_rig_id_rigs_id_fk" FOREIGN KEY ("rig_id") REFERENCES "public"."rigs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD CONSTRAINT "pressure_tests_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD CONSTRAINT "pressure_tests_created_by_id_user_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD CONSTRAINT "pressure_tests_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "rig_events_rig_idx" ON "rig_events" USING btree ("rig_id","occurred_on");--> statement-breakpoint
CREATE INDEX "rig_items_rig_idx" ON "rig_items" USING btree ("rig_id");--> statement-breakpoint
CREATE INDEX "rigs_org_keeper_idx" ON "rigs" USING btree ("organization_id","keeper_id");--> statement-breakpoint
CREATE INDEX "test_rigs_rig_idx" ON "test_rigs" USING btree ("rig_id");--> statement-breakpoint
CREATE INDEX "pressure_tests_org_tested_idx" ON "pressure_tests" USING btree ("organization_id","tested_at");--> statement-breakpoint
CREATE INDEX "pressure_tests_org_creator_idx" ON "pressure_tests" USING btree ("organization_id","created_by_id");