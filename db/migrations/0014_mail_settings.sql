CREATE TABLE "mail_opt_outs" (
	"organization_id" text NOT NULL,
	"user_id" text NOT NULL,
	"kind" text NOT NULL,
	"via" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "mail_opt_outs_organization_id_user_id_kind_pk" PRIMARY KEY("organization_id","user_id","kind"),
	CONSTRAINT "mail_opt_outs_kind_check" CHECK ("mail_opt_outs"."kind" IN ('review_request', 'comment', 'review_outcome', 'rig_reminder'))
);
--> statement-breakpoint
ALTER TABLE "mail_outbox" DROP CONSTRAINT "mail_outbox_status_check";--> statement-breakpoint
ALTER TABLE "mail_outbox" ADD COLUMN "kind" text;--> statement-breakpoint
ALTER TABLE "organization_settings" ADD COLUMN "mail_sender_name" text;--> statement-breakpoint
ALTER TABLE "organization_settings" ADD COLUMN "review_mail_to" text[];--> statement-breakpoint
ALTER TABLE "mail_opt_outs" ADD CONSTRAINT "mail_opt_outs_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mail_opt_outs" ADD CONSTRAINT "mail_opt_outs_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mail_outbox" ADD CONSTRAINT "mail_outbox_status_check" CHECK ("mail_outbox"."status" IN ('pending', 'sent', 'failed', 'dead', 'off'));