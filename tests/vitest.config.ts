import { defineConfig } from "vitest/config";
import path from "node:path";

export default defineConfig({
  resolve: { alias: { "@": path.resolve(import.meta.dirname, "..") } },
  root: path.resolve(import.meta.dirname, ".."),
  test: {
    include: ["tests/**/*.test.ts", "analysis/**/*.test.ts"],
    exclude: ["tests/journeys/**", "tests/faults/**", "tests/secrets/**", "tests/cluster/**", "node_modules/**"],
    testTimeout: 120_000,
    hookTimeout: 60_000,
    pool: "forks",
    setupFiles: ["tests/setup-jobs.ts"],
    // The engine's worker threads run lib/engine/worker.ts through tsx (no Next.js bundle here).
    env: { ENGINE_WORKER_ENTRY: "source" },
  },
});
