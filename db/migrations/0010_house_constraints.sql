-- A test, its analysis, its job, site and system, and a system's site belong to one organization
-- (composite foreign keys on (organization_id, id)); the current analysis has a foreign key, checked
-- at commit because analyses also point at their test; verdicts and states are CHECKed against the
-- lists in contracts/vocabulary.ts and the schema files.
-- Edited by hand after drizzle-kit generate: the UNIQUE keys come before the foreign keys that need
-- them; ON DELETE SET NULL names its column (PostgreSQL 15+) so organization_id is never nulled;
-- the current analysis key is DEFERRABLE INITIALLY DEFERRED. drizzle-kit cannot express either.
ALTER TABLE "systems" DROP CONSTRAINT "systems_site_id_sites_id_fk";
--> statement-breakpoint
ALTER TABLE "analyses" DROP CONSTRAINT "analyses_test_id_vacuum_tests_id_fk";
--> statement-breakpoint
ALTER TABLE "vacuum_tests" DROP CONSTRAINT "vacuum_tests_job_id_jobs_id_fk";
--> statement-breakpoint
ALTER TABLE "vacuum_tests" DROP CONSTRAINT "vacuum_tests_site_id_sites_id_fk";
--> statement-breakpoint
ALTER TABLE "vacuum_tests" DROP CONSTRAINT "vacuum_tests_system_id_systems_id_fk";
--> statement-breakpoint
ALTER TABLE "jobs" ADD CONSTRAINT "jobs_org_id_key" UNIQUE("organization_id","id");
--> statement-breakpoint
ALTER TABLE "sites" ADD CONSTRAINT "sites_org_id_key" UNIQUE("organization_id","id");
--> statement-breakpoint
ALTER TABLE "systems" ADD CONSTRAINT "systems_org_id_key" UNIQUE("organization_id","id");
--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_org_id_key" UNIQUE("organization_id","id");
--> statement-breakpoint
ALTER TABLE "vacuum_tests" ADD CONSTRAINT "vacuum_tests_org_id_key" UNIQUE("organization_id","id");
--> statement-breakpoint
ALTER TABLE "systems" ADD CONSTRAINT "systems_site_fk" FOREIGN KEY ("organization_id","site_id") REFERENCES "public"."sites"("organization_id","id") ON DELETE cascade ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_test_fk" FOREIGN KEY ("organization_id","test_id") REFERENCES "public"."vacuum_tests"("organization_id","id") ON DELETE cascade ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "vacuum_tests" ADD CONSTRAINT "vacuum_tests_job_fk" FOREIGN KEY ("organization_id","job_id") REFERENCES "public"."jobs"("organization_id","id") ON DELETE SET NULL ("job_id") ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "vacuum_tests" ADD CONSTRAINT "vacuum_tests_site_fk" FOREIGN KEY ("organization_id","site_id") REFERENCES "public"."sites"("organization_id","id") ON DELETE SET NULL ("site_id") ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "vacuum_tests" ADD CONSTRAINT "vacuum_tests_system_fk" FOREIGN KEY ("organization_id","system_id") REFERENCES "public"."systems"("organization_id","id") ON DELETE SET NULL ("system_id") ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "vacuum_tests" ADD CONSTRAINT "vacuum_tests_current_analysis_fk" FOREIGN KEY ("organization_id","current_analysis_id") REFERENCES "public"."analyses"("organization_id","id") ON DELETE SET NULL ("current_analysis_id") ON UPDATE no action DEFERRABLE INITIALLY DEFERRED;
--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_verdict_check" CHECK ("analyses"."verdict" IN ('pass', 'leak', 'moisture', 'leak_and_moisture', 'inconclusive'));
--> statement-breakpoint
ALTER TABLE "vacuum_tests" ADD CONSTRAINT "vacuum_tests_status_check" CHECK ("vacuum_tests"."status" IN ('submitted', 'waiting_review', 'signed_off', 'sent_back'));
--> statement-breakpoint
ALTER TABLE "vacuum_tests" ADD CONSTRAINT "vacuum_tests_verdict_check" CHECK ("vacuum_tests"."verdict" IN ('pass', 'leak', 'moisture', 'leak_and_moisture', 'inconclusive'));
--> statement-breakpoint
ALTER TABLE "vacuum_tests" ADD CONSTRAINT "vacuum_tests_source_check" CHECK ("vacuum_tests"."source" IN ('file', 'typed'));
--> statement-breakpoint
ALTER TABLE "mail_outbox" ADD CONSTRAINT "mail_outbox_status_check" CHECK ("mail_outbox"."status" IN ('pending', 'sent', 'failed', 'dead'));
--> statement-breakpoint
ALTER TABLE "test_events" ADD CONSTRAINT "test_events_kind_check" CHECK ("test_events"."kind" IN ('submitted', 'review_requested', 'help_requested', 'signed_off', 'sent_back', 'resubmitted', 'retest_uploaded', 'commented', 'report_emailed', 'share_link_created', 'share_link_revoked'));
--> statement-breakpoint
ALTER TABLE "test_events" ADD CONSTRAINT "test_events_from_status_check" CHECK ("test_events"."from_status" IN ('submitted', 'waiting_review', 'signed_off', 'sent_back'));
--> statement-breakpoint
ALTER TABLE "test_events" ADD CONSTRAINT "test_events_to_status_check" CHECK ("test_events"."to_status" IN ('submitted', 'waiting_review', 'signed_off', 'sent_back'));
--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD CONSTRAINT "pressure_tests_verdict_check" CHECK ("pressure_tests"."verdict" IN ('holds', 'drops', 'rises', 'stopped'));
--> statement-breakpoint
ALTER TABLE "practice_calls" ADD CONSTRAINT "practice_calls_call_check" CHECK ("practice_calls"."call" IN ('pass', 'leak', 'moisture', 'leak_and_moisture'));
--> statement-breakpoint
ALTER TABLE "practice_calls" ADD CONSTRAINT "practice_calls_analysis_verdict_check" CHECK ("practice_calls"."analysis_verdict" IN ('pass', 'leak', 'moisture', 'leak_and_moisture', 'inconclusive'));
--> statement-breakpoint
ALTER TABLE "background_tasks" ADD CONSTRAINT "background_tasks_state_check" CHECK ("background_tasks"."state" IN ('queued', 'running', 'done', 'failed'));
--> statement-breakpoint
ALTER TABLE "background_tasks" ADD CONSTRAINT "background_tasks_stage_check" CHECK ("background_tasks"."stage" IN ('queued', 'reading', 'analysing', 'saving', 'done', 'failed'));
