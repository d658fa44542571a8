ALTER TABLE "pressure_tests" ADD COLUMN "idempotency_key" text;--> statement-breakpoint
ALTER TABLE "pressure_tests" ADD COLUMN "request_fingerprint" text;--> statement-breakpoint
CREATE UNIQUE INDEX "pressure_tests_key_idx" ON "pressure_tests" USING btree ("organization_id","created_by_id","idempotency_key");