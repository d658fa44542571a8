CREATE TABLE "casebook_collections" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" text NOT NULL,
	"title" text NOT NULL,
	"description" text,
	"is_simulated" boolean DEFAULT false NOT NULL,
	"seed_key" text,
	"created_by_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "casebook_entries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" text NOT NULL,
	"collection_id" uuid NOT NULL,
	"test_id" uuid NOT NULL,
	"title" text NOT NULL,
	"notes" text,
	"order" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "casebook_pins" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" text NOT NULL,
	"entry_id" uuid NOT NULL,
	"at_seconds" real NOT NULL,
	"text" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "practice_calls" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" text NOT NULL,
	"test_id" uuid NOT NULL,
	"apprentice_id" text NOT NULL,
	"call" text NOT NULL,
	"reason" text NOT NULL,
	"analysis_verdict" text NOT NULL,
	"matched" boolean NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "practice_comments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" text NOT NULL,
	"call_id" uuid NOT NULL,
	"author_id" text NOT NULL,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "casebook_collections" ADD CONSTRAINT "casebook_collections_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "casebook_collections" ADD CONSTRAINT "casebook_collections_created_by_id_user_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "casebook_entries" ADD CONSTRAINT "casebook_entries_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "casebook_entries" ADD CONSTRAINT "casebook_entries_collection_id_casebook_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."casebook_collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "casebook_entries" ADD CONSTRAINT "casebook_entries_test_id_vacuum_tests_id_fk" FOREIGN KEY ("test_id") REFERENCES "public"."vacuum_tests"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "casebook_pins" ADD CONSTRAINT "casebook_pins_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "casebook_pins" ADD CONSTRAINT "casebook_pins_entry_id_casebook_entries_id_fk" FOREIGN KEY ("entry_id") REFERENCES "public"."casebook_entries"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practice_calls" ADD CONSTRAINT "practice_calls_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practice_calls" ADD CONSTRAINT "practice_calls_test_id_vacuum_tests_id_fk" FOREIGN KEY ("test_id") REFERENCES "public"."vacuum_tests"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practice_calls" ADD CONSTRAINT "practice_calls_apprentice_id_user_id_fk" FOREIGN KEY ("apprentice_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practice_comments" ADD CONSTRAINT "practice_comments_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practice_comments" ADD CONSTRAINT "practice_comments_call_id_practice_calls_id_fk" FOREIGN KEY ("call_id") REFERENCES "public"."practice_calls"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practice_comments" ADD CONSTRAINT "practice_comments_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "casebook_collections_org_idx" ON "casebook_collections" USING btree ("organization_id");--> statement-breakpoint
CREATE UNIQUE INDEX "casebook_collections_seed_idx" ON "casebook_collections" USING btree ("organization_id","seed_key");--> statement-breakpoint
CREATE INDEX "casebook_entries_collection_idx" ON "casebook_entries" USING btree ("collection_id","order");--> statement-breakpoint
CREATE INDEX "casebook_entries_org_idx" ON "casebook_entries" USING btree ("organization_id");--> statement-breakpoint
CREATE INDEX "casebook_pins_entry_idx" ON "casebook_pins" USING btree ("entry_id");--> statement-breakpoint
CREATE UNIQUE INDEX "practice_calls_test_apprentice_idx" ON "practice_calls" USING btree ("test_id","apprentice_id");--> statement-breakpoint
CREATE INDEX "practice_calls_org_apprentice_idx" ON "practice_calls" USING btree ("organization_id","apprentice_id");--> statement-breakpoint
CREATE INDEX "practice_comments_call_idx" ON "practice_comments" USING btree ("call_id");