import { defineConfig } from "vitest/config";
import path from "node:path";

/** The secrets-in-logs check, run after a suite's servers have written their logs (scripts/test.sh, scripts/faults.sh). */
export default defineConfig({
  resolve: { alias: { "@": path.resolve(import.meta.dirname, "../..") } },
  root: path.resolve(import.meta.dirname, "../.."),
  test: { include: ["tests/secrets/**/*.test.ts"], testTimeout: 120_000, pool: "forks" },
});
