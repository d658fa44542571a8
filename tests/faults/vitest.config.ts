import { defineConfig } from "vitest/config";
import path from "node:path";

/** The fault tests (scripts/faults.sh): one file at a time, on the "faults" services they break. */
export default defineConfig({
  resolve: { alias: { "@": path.resolve(import.meta.dirname, "../..") } },
  root: path.resolve(import.meta.dirname, "../.."),
  test: {
    include: ["tests/faults/**/*.test.ts"],
    testTimeout: 240_000,
    hookTimeout: 120_000,
    pool: "forks",
    fileParallelism: false,
    env: { ENGINE_WORKER_ENTRY: "source" },
  },
});
