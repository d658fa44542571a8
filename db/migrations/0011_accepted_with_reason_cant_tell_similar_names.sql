-- Similar-name warnings before a customer, site or system is created (db/queries/similar-names.ts):
-- trigram similarity from PostgreSQL's pg_trgm extension (shipped in Debian's postgresql-15 package).
CREATE EXTENSION IF NOT EXISTS pg_trgm;--> statement-breakpoint
ALTER TABLE "test_events" DROP CONSTRAINT "test_events_kind_check";--> statement-breakpoint
ALTER TABLE "practice_calls" DROP CONSTRAINT "practice_calls_call_check";--> statement-breakpoint
ALTER TABLE "test_events" ADD CONSTRAINT "test_events_kind_check" CHECK ("test_events"."kind" IN ('submitted', 'review_requested', 'help_requested', 'signed_off', 'accepted_with_reason', 'sent_back', 'resubmitted', 'retest_uploaded', 'commented', 'report_emailed', 'share_link_created', 'share_link_revoked'));--> statement-breakpoint
ALTER TABLE "practice_calls" ADD CONSTRAINT "practice_calls_call_check" CHECK ("practice_calls"."call" IN ('pass', 'leak', 'moisture', 'leak_and_moisture', 'inconclusive'));