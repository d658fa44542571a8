import { defineConfig } from "vitest/config";
import path from "node:path";

/**
 * The two-server test (tests/cluster/): against the production build, after the browser journeys,
 * on the test profile's PostgreSQL and S3 fake. The servers and this process share their own job
 * queue schema, so no other server takes their jobs.
 */
export default defineConfig({
  resolve: { alias: { "@": path.resolve(import.meta.dirname, "../..") } },
  root: path.resolve(import.meta.dirname, "../.."),
  test: {
    include: ["tests/cluster/**/*.test.ts"],
    testTimeout: 300_000,
    hookTimeout: 120_000,
    pool: "forks",
    fileParallelism: false,
    env: { JOBS_SCHEMA: "pgboss_cluster", ENGINE_WORKER_ENTRY: "source" },
  },
});
