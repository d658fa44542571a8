/**
 * Next.js calls register() once when a server starts. In the Node.js runtime its console output
 * passes through Riseline's redaction (lib/log-console.ts), so no framework error message carries a
 * token or password to the log, and it starts the background job runner in this process
 * (lib/jobs/in-app.ts), so `next start` alone runs every job; set JOBS_IN_APP=off where
 * `npm run worker` runs them instead.
 */
export async function register(): Promise<void> {
  // Next.js's own switch between its runtimes (replaced at build time), not configuration.
  if (process.env.NEXT_RUNTIME === "nodejs") {
    const { installConsoleRedaction } = await import("./lib/log-console");
    installConsoleRedaction();
    const { startJobsInApp } = await import("./lib/jobs/in-app");
    await startJobsInApp();
  }
}
