/**
 * Minimal structured logging to stderr (one JSON line per event), with secrets taken out before
 * anything is written: no session token, password, reset token or query parameter ever reaches a
 * log line (OWASP ASVS 4.0.3 V7.1.1 and V7.1.2: no credentials or session tokens in logs).
 */
import { redactText, redactValue } from "./log-redact";

function write(level: "info" | "warn" | "error", message: string, fields?: Record<string, unknown>) {
  const line = { level, time: new Date().toISOString(), message: redactText(message), ...(redactValue(fields ?? {}) as Record<string, unknown>) };
  process.stderr.write(JSON.stringify(line) + "\n");
}

export const log = {
  info: (m: string, f?: Record<string, unknown>) => write("info", m, f),
  warn: (m: string, f?: Record<string, unknown>) => write("warn", m, f),
  error: (m: string, f?: Record<string, unknown>) => write("error", m, f),
};

/**
 * An error as a log field: its name, code and message, and the same of its causes — never the
 * query parameters a database error carries, nor a driver's `detail` (which quotes row values).
 */
export function describeError(err: unknown, depth = 0): Record<string, unknown> | string {
  if (!(err instanceof Error)) return redactText(String(err));
  const e = err as Error & { code?: unknown; cause?: unknown; query?: unknown };
  // Drizzle's query errors repeat the SQL and its parameters in the message: keep the SQL only.
  const message = typeof e.query === "string" ? `Failed query: ${e.query}` : e.message;
  const out: Record<string, unknown> = { name: e.name, message: redactText(message) };
  if (typeof e.code === "string" || typeof e.code === "number") out.code = e.code;
  if (e.cause !== undefined && depth < 4) out.cause = describeError(e.cause, depth + 1);
  if (depth === 0 && e.stack) out.stack = redactText(e.stack.split("\n").slice(1, 8).join("\n"));
  return out;
}
