/** Any thrown value as a response. Details go to the log (secrets taken out), never to the client. */
import { ZodError } from "zod";
import { LogError } from "@/analysis/shared/errors";
import { AppError, errorResponse } from "@/lib/errors";
import { describeError, log } from "@/lib/log";
import { failureOf } from "./failures";

export function zodDetails(err: ZodError, where: string) {
  return {
    where,
    issues: err.issues.map((i) => ({ path: i.path.join("."), message: i.message })),
  };
}

function pathOf(req: Request): string {
  try {
    return new URL(req.url).pathname;
  } catch {
    return "?";
  }
}

export function toErrorResponse(err: unknown, req: Request): Response {
  if (err instanceof AppError) return errorResponse(err);
  if (err instanceof LogError) {
    return errorResponse(new AppError("invalid_file", err.message, { reason: err.code, line: err.line, column: err.column }));
  }
  if (err instanceof ZodError) return errorResponse(new AppError("invalid_input", undefined, zodDetails(err, "request")));
  if (req.signal?.aborted || (err as Error)?.name === "RequestGone" || (err as Error)?.name === "AbortError") {
    // Nobody is listening any more; what matters is that nothing was committed.
    log.warn("request abandoned before it finished; nothing was kept", { method: req.method, path: pathOf(req) });
    return errorResponse(new AppError("conflict", "The request was abandoned before it was saved; nothing was kept. Send it again."));
  }
  const failure = failureOf(err);
  const fields = { method: req.method, path: pathOf(req), err: describeError(err) };
  if (failure.code === "database_unavailable") log.error("database unavailable", fields);
  else if (failure.code === "internal") log.error("unhandled error", fields);
  else log.warn(`answered ${failure.status} ${failure.code}`, fields);
  return errorResponse(failure);
}
