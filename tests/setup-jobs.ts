/**
 * Each test process gets its own job-queue schema (pg-boss's `schema` option), so a file's jobs
 * are run only by that file's own runner (tests/helpers/jobs.ts) and test seams there (a dead SMTP
 * sender, say) apply to exactly its jobs. The production app and worker share one schema.
 */
process.env.JOBS_SCHEMA ??= `pgboss_t${process.pid}`;
