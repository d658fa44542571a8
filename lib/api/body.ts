/**
 * Request bodies: which media types a state-changing route takes, and JSON read under a cap.
 *
 * JSON only as `application/json`: a `text/plain` or form-encoded body is what a foreign page can
 * send without a CORS preflight, so refusing it closes that door too (OWASP CSRF Prevention Cheat
 * Sheet, "Employing Custom Request Headers for AJAX/API" and the note on content types;
 * OWASP ASVS 4.0.3 V13.1.5 and V13.2.5: requests with an unexpected content type are refused).
 */
import { isStateChanging } from "@/lib/api/csrf";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";

/** "form" (form-encoded) is for the one-click unsubscribe only (RFC 8058 §3.1), whose token is its own proof. */
export type BodyKind = "json" | "multipart" | "form";

/** The media type of a request, lower-case, without parameters; "" when absent. */
export function mediaTypeOf(headers: Headers): string {
  return (headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
}

const TYPE_OF: Record<BodyKind, string> = { json: "application/json", multipart: "multipart/form-data", form: "application/x-www-form-urlencoded" };

function hasBody(req: Request): boolean {
  const length = req.headers.get("content-length");
  if (length !== null) return Number(length) > 0;
  return req.body !== null && req.headers.has("transfer-encoding");
}

/** 415 unless a state-changing request's body (if any) is of a kind the route takes. */
export function assertAcceptedBody(req: Request, accepts: readonly BodyKind[]): void {
  if (!isStateChanging(req.method)) return;
  const type = mediaTypeOf(req.headers);
  if (type === "" && !hasBody(req)) return;
  if (accepts.some((k) => TYPE_OF[k] === type)) return;
  const wanted = accepts.map((k) => TYPE_OF[k]).join(" or ");
  throw new AppError("unsupported_media_type", `Send this request as ${wanted}${type ? `, not ${type}` : ""}.`, { contentType: type || null, accepted: accepts.map((k) => TYPE_OF[k]) });
}

/**
 * The body, read with a hard cap: refused early on a Content-Length over it, and reading stops as
 * soon as a body without one passes it. `tooLarge` makes the error (413) for the size seen.
 */
export async function readBodyCapped(req: Request, capBytes: number, tooLarge: (sizeBytes: number) => AppError): Promise<Uint8Array<ArrayBuffer>> {
  const declared = Number(req.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > capBytes) throw tooLarge(declared);
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > capBytes) {
      await reader.cancel().catch(() => {});
      throw tooLarge(total);
    }
    chunks.push(value);
  }
  const out = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

function jsonTooLarge(limit: number) {
  return (sizeBytes: number) =>
    new AppError("body_too_large", `The request body is ${Math.ceil(sizeBytes / 1024)} kB; this request takes at most ${Math.floor(limit / 1024)} kB of JSON.`, { sizeBytes, limitBytes: limit });
}

/** Room for the form fields and multipart framing beside an uploaded file itself. */
export const MULTIPART_SLACK_BYTES = 256 * 1024;

/** 413 for an upload over MAX_UPLOAD_BYTES, naming the file's size and the limit. */
export function fileTooLarge(sizeBytes: number): AppError {
  const limit = env().MAX_UPLOAD_BYTES;
  return new AppError("file_too_large", `The file is ${(sizeBytes / 1048576).toFixed(1)} MB; the limit is ${(limit / 1048576).toFixed(0)} MB.`, {
    sizeBytes,
    limitBytes: limit,
  });
}

/** A multipart form under the upload cap (MAX_UPLOAD_BYTES and room for the fields): 413 above it, 400 when it is not a form. */
export async function readMultipartBody(req: Request): Promise<FormData> {
  const bytes = await readBodyCapped(req, env().MAX_UPLOAD_BYTES + MULTIPART_SLACK_BYTES, fileTooLarge);
  try {
    return await new Response(bytes, { headers: { "content-type": req.headers.get("content-type") ?? "" } }).formData();
  } catch {
    throw new AppError("invalid_input", "file: the form could not be read (expected multipart/form-data with a file field).");
  }
}

/** A JSON body under `capBytes` (MAX_JSON_BYTES unless a route that carries a log says more): 413 above it, 400 when it is not JSON. */
export async function readJsonBody(req: Request, capBytes = env().MAX_JSON_BYTES): Promise<unknown> {
  const bytes = await readBodyCapped(req, capBytes, jsonTooLarge(capBytes));
  try {
    return JSON.parse(new TextDecoder().decode(bytes));
  } catch {
    throw new AppError("invalid_input", "The request body is not valid JSON.");
  }
}
