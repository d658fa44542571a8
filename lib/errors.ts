/** Every failure the app reports to a user has one of these codes. */
export type AppErrorCode =
  | "unauthenticated"
  | "forbidden"
  | "no_organization"
  | "not_found"
  | "invalid_input"
  | "invalid_file"
  | "unsupported_file"
  | "file_too_large"
  | "conflict"
  | "storage_unavailable"
  | "database_unavailable"
  | "analysis_unavailable"
  | "rate_limited"
  | "cross_site"
  | "unsupported_media_type"
  | "body_too_large"
  | "unstorable_input"
  | "idempotency_mismatch"
  | "account_locked"
  | "internal";

const STATUS: Record<AppErrorCode, number> = {
  unauthenticated: 401,
  forbidden: 403,
  no_organization: 403,
  not_found: 404,
  invalid_input: 400,
  invalid_file: 422,
  unsupported_file: 415,
  file_too_large: 413,
  conflict: 409,
  storage_unavailable: 503,
  database_unavailable: 503,
  analysis_unavailable: 503,
  rate_limited: 429,
  cross_site: 403,
  unsupported_media_type: 415,
  body_too_large: 413,
  unstorable_input: 422,
  idempotency_mismatch: 422,
  account_locked: 429,
  internal: 500,
};

const DEFAULT_MESSAGE: Record<AppErrorCode, string> = {
  unauthenticated: "Please sign in.",
  forbidden: "Your role does not allow this.",
  no_organization: "Join or create a shop first.",
  not_found: "Not found.",
  invalid_input: "Some fields are not valid.",
  invalid_file: "The file could not be read.",
  unsupported_file: "That file type is not supported.",
  file_too_large: "The file is too large.",
  conflict: "That was changed by someone else; reload and try again.",
  storage_unavailable: "File storage is not answering. Nothing was saved; please try again.",
  database_unavailable: "The database is not answering. Nothing was saved; please try again.",
  analysis_unavailable: "The analysis could not finish for this log. Nothing was saved; please try again.",
  rate_limited: "Too many attempts; wait a minute and try again.",
  cross_site: "This request came from another site and was refused. Open Riseline itself and try again there.",
  unsupported_media_type: "Send this request as JSON (Content-Type: application/json).",
  body_too_large: "The request body is too large.",
  unstorable_input: "Some of the input cannot be stored as it is; correct it and send again.",
  idempotency_mismatch: "This Idempotency-Key was already used for a different request; send a new key for a new request.",
  account_locked: "Too many wrong passwords for this account; wait and try again.",
  internal: "Something went wrong on our side. Nothing was lost; please try again.",
};

/** A failure with a code, a user-facing message and optional field-level details. */
export class AppError extends Error {
  readonly code: AppErrorCode;
  readonly details?: Record<string, unknown>;
  constructor(code: AppErrorCode, message?: string, details?: Record<string, unknown>) {
    super(message ?? DEFAULT_MESSAGE[code]);
    this.name = "AppError";
    this.code = code;
    this.details = details;
  }
  get status(): number {
    return STATUS[this.code];
  }
}

export function statusOf(code: AppErrorCode): number {
  return STATUS[code];
}

/** The JSON body every error response has. */
export interface ErrorBody {
  error: { code: AppErrorCode; message: string; details?: Record<string, unknown> };
}

/** Seconds to wait before a retry, for the Retry-After header of a 429 or 503 (RFC 9110 §10.2.3). */
function retryAfterOf(err: AppError): number | null {
  const given = err.details?.retryAfterSeconds;
  if (typeof given === "number" && Number.isFinite(given) && given > 0) return Math.ceil(given);
  return err.status === 503 ? 5 : null;
}

export function errorResponse(err: AppError): Response {
  const body: ErrorBody = { error: { code: err.code, message: err.message, details: err.details } };
  const retryAfter = retryAfterOf(err);
  return Response.json(body, { status: err.status, headers: retryAfter ? { "retry-after": String(retryAfter) } : undefined });
}
