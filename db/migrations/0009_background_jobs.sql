CREATE TABLE "rig_reminder_notices" (
	"organization_id" text NOT NULL,
	"rig_id" uuid NOT NULL,
	"item_id" uuid NOT NULL,
	"code" text NOT NULL,
	"notified_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "rig_reminder_notices_item_id_code_pk" PRIMARY KEY("item_id","code")
);
--> statement-breakpoint
CREATE TABLE "background_tasks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" text NOT NULL,
	"requested_by_id" text NOT NULL,
	"kind" text NOT NULL,
	"state" text DEFAULT 'queued' NOT NULL,
	"stage" text DEFAULT 'queued' NOT NULL,
	"total" integer DEFAULT 1 NOT NULL,
	"done" integer DEFAULT 0 NOT NULL,
	"failed_items" integer DEFAULT 0 NOT NULL,
	"input" jsonb NOT NULL,
	"object_key" text,
	"cursor" text,
	"test_id" uuid,
	"idempotency_key" text,
	"error" text,
	"error_details" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "mail_outbox" ADD COLUMN "next_attempt_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "mail_outbox" ADD COLUMN "retry_until" timestamp with time zone DEFAULT now() + interval '24 hours' NOT NULL;--> statement-breakpoint
ALTER TABLE "rig_reminder_notices" ADD CONSTRAINT "rig_reminder_notices_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rig_reminder_notices" ADD CONSTRAINT "rig_reminder_notices_rig_id_rigs_id_fk" FOREIGN KEY ("rig_id") REFERENCES "public"."rigs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rig_reminder_notices" ADD CONSTRAINT "rig_reminder_notices_item_id_rig_items_id_fk" FOREIGN KEY ("item_id") REFERENCES "public"."rig_items"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "background_tasks" ADD CONSTRAINT "background_tasks_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "background_tasks" ADD CONSTRAINT "background_tasks_requested_by_id_user_id_fk" FOREIGN KEY ("requested_by_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "background_tasks" ADD CONSTRAINT "background_tasks_test_id_vacuum_tests_id_fk" FOREIGN KEY ("test_id") REFERENCES "public"."vacuum_tests"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "rig_reminder_notices_rig_idx" ON "rig_reminder_notices" USING btree ("organization_id","rig_id");--> statement-breakpoint
CREATE UNIQUE INDEX "background_tasks_key_idx" ON "background_tasks" USING btree ("organization_id","requested_by_id","idempotency_key");--> statement-breakpoint
CREATE INDEX "background_tasks_org_state_idx" ON "background_tasks" USING btree ("organization_id","state");