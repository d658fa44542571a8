/**
 * The framework's own console output with secrets taken out: Next.js and libraries print errors
 * with console.error, and a database error object carries its query parameters (a session token,
 * for the session lookup). Errors are printed as their name, code and message (lib/log.ts
 * describeError), and every line passes through the same redaction as our own log.
 */
import { format } from "node:util";
import { describeError } from "./log";
import { redactText } from "./log-redact";

const g = globalThis as unknown as { rlConsoleRedacted?: boolean };

function safeArg(arg: unknown): unknown {
  if (arg instanceof Error) return JSON.stringify(describeError(arg));
  if (arg && typeof arg === "object" && ("params" in arg || "query" in arg)) return JSON.stringify(describeError(Object.assign(new Error("error"), arg)));
  return arg;
}

export function installConsoleRedaction(): void {
  if (g.rlConsoleRedacted) return;
  g.rlConsoleRedacted = true;
  for (const level of ["error", "warn", "log", "info"] as const) {
    const original = console[level].bind(console);
    console[level] = (...args: unknown[]) => original(redactText(format(...args.map(safeArg))));
  }
}
