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

export type BodyKind = "json" | "multipart";

/** The media type of a request, lower-case, without parameters; "" when absent. */
export function mediaTypeOf(headers: Headers): string {
  return (headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
}

const TYPE_OF: Record<BodyKind, string> = { json: "application/json", multipart: "multipart/form-data" };

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

/** A JSON body under `capBytes` (MAX_JSON_BYTES unless a route that carries a log says more): 413 above it, 400 when it is not JSON. */
export async function readJsonBody(req: Request, capBytes = env().MAX_JSON_BYTES): Promise<unknown> {
  const bytes = await readBodyCapped(req, capBytes, jsonTooLarge(capBytes));
  try {
    return JSON.parse(new TextDecoder().decode(bytes));
  } catch {
    throw new AppError("invalid_input", "The request body is not valid JSON.");
  }
}
