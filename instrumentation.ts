/**
 * Runs once when a Next.js server starts: its console output passes through Riseline's redaction
 * (lib/log-console.ts), so no framework error message carries a token or password to the log.
 */
export async function register() {
  if (process.env.NEXT_RUNTIME === "nodejs") {
    const { installConsoleRedaction } = await import("@/lib/log-console");
    installConsoleRedaction();
  }
}
