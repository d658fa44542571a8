import { defineConfig } from "vitest/config";
import path from "node:path";

/** Browser journeys: a real Chromium against a running Riseline (APP_URL). */
export default defineConfig({
  resolve: { alias: { "@": path.resolve(import.meta.dirname, "../..") } },
  root: path.resolve(import.meta.dirname, "../.."),
  test: {
    include: ["tests/journeys/**/*.test.ts"],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    pool: "forks",
    fileParallelism: false,
  },
});
