/**
 * What a thrown value means for the caller. A service that is really down is a 503 (try again);
 * input the database refuses to hold is a 422 (trying again never helps); a lost race is a 409;
 * anything else is a 500 — our bug, logged.
 *
 * PostgreSQL's SQLSTATE classes (PostgreSQL 15 manual, Appendix A): 08 connection exception,
 * 53 insufficient resources, 57 operator intervention (57P01 admin shutdown, 57014 statement
 * timeout), 22 data exception, 23 integrity constraint violation, 40 transaction rollback.
 */
import { AppError } from "@/lib/errors";

/** Node's and pg's own errors for a peer that is away, refusing, or silent. */
const UNREACHABLE_ERRNO = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "EPIPE", "EHOSTUNREACH", "ENETUNREACH", "ENOTFOUND", "EAI_AGAIN", "ECONNABORTED"]);
const UNREACHABLE_MESSAGE = /connection terminated|timeout exceeded when trying to connect|query read timeout|connection timeout|Client has encountered a connection error|Connection terminated unexpectedly|the database system is (starting up|shutting down)|terminating connection/i;

interface Coded {
  code?: unknown;
  message?: unknown;
  cause?: unknown;
  errors?: unknown;
}

/** The error and its causes (Drizzle wraps pg's error; better-auth may wrap Drizzle's). */
function* chain(err: unknown): Generator<Coded> {
  let cur: unknown = err;
  for (let depth = 0; cur && typeof cur === "object" && depth < 6; depth++) {
    yield cur as Coded;
    const agg = (cur as Coded).errors; // AggregateError from a dual-stack connect
    if (Array.isArray(agg) && agg[0]) yield agg[0] as Coded;
    cur = (cur as Coded).cause;
  }
}

export type FailureKind = "unreachable" | "data" | "constraint" | "race" | "unknown";

/** The kind of failure, read from SQLSTATE codes, errno codes and driver messages in the chain. */
export function failureKindOf(err: unknown): FailureKind {
  for (const e of chain(err)) {
    const code = typeof e.code === "string" ? e.code : "";
    const message = typeof e.message === "string" ? e.message : "";
    if (UNREACHABLE_ERRNO.has(code) || /^(08|53|57)/.test(code) || UNREACHABLE_MESSAGE.test(message)) return "unreachable";
    if (/^22/.test(code)) return "data";
    if (code === "23502" || code === "23514") return "data";
    if (/^23/.test(code)) return "constraint";
    if (/^40/.test(code)) return "race";
  }
  return "unknown";
}

/** True when the database (or the network to it) is the problem: worth a 503 and a retry. */
export function isDatabaseUnreachable(err: unknown): boolean {
  return failureKindOf(err) === "unreachable";
}

/** The AppError to answer with for an error that is not already one. */
export function failureOf(err: unknown): AppError {
  if (err instanceof AppError) return err;
  switch (failureKindOf(err)) {
    case "unreachable":
      return new AppError("database_unavailable");
    case "data":
      return new AppError(
        "unstorable_input",
        "A value in this request cannot be stored (a control character, or a number or text too large for its field). Nothing was saved; correct the input and send it again.",
      );
    case "constraint":
      return new AppError("conflict", "This refers to something that was changed or removed meanwhile; reload and try again.");
    case "race":
      return new AppError("conflict", "Someone else changed this at the same moment; try again.");
    default:
      return new AppError("internal");
  }
}
