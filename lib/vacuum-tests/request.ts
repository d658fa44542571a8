/**
 * Turning a POST /api/vacuum-tests (or /api/imports/preview) request into an upload: multipart with a
 * file, or JSON with typed readings written out as an equivalent CSV (stored as the raw file).
 */
import { mediaTypeOf } from "@/lib/api/body";
import { assertStorable } from "@/lib/api/storable";
import { AppError } from "@/lib/errors";
import { assertTextLog, decodeLogText } from "./files";
import { parseInput, testMetadataSchema, typedReadingsSchema } from "./schemas";
import { typedReadingsToCsv } from "./typed";
import type { UploadInput } from "./upload";

export interface ReceivedFile {
  filename: string;
  contentType: string;
  bytes: Uint8Array;
  text: string;
}

/** The body route() read under its cap: the multipart form, or (typed readings) the JSON. */
export interface ReadBody {
  form?: FormData;
  json?: unknown;
}

function formOf(body: ReadBody): FormData {
  if (!body.form) throw new AppError("invalid_input", "file: the form could not be read (expected multipart/form-data with a file field).");
  return body.form;
}

async function fileOf(form: FormData): Promise<ReceivedFile> {
  const file = form.get("file");
  if (!file || typeof file === "string") throw new AppError("invalid_input", "file: choose a gauge log to upload.", { field: "file" });
  const bytes = new Uint8Array(await file.arrayBuffer());
  assertStorable(file.name, "file name");
  const filename = (file.name || "log.csv").slice(-200);
  assertTextLog(bytes, file.type, filename);
  return { filename, contentType: file.type || "text/csv", bytes, text: decodeLogText(bytes) };
}

function fieldsOf(form: FormData): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of form.entries()) if (k !== "file" && typeof v === "string") out[k] = v;
  assertStorable(out, "form");
  return out;
}

function isJson(req: Request): boolean {
  return mediaTypeOf(req.headers) === "application/json";
}

/** Just the file, for the preview (nothing saved). */
export async function readPreviewFile(body: ReadBody): Promise<{ file: ReceivedFile; fields: Record<string, string> }> {
  const form = formOf(body);
  return { file: await fileOf(form), fields: fieldsOf(form) };
}

/** The upload in a POST /api/vacuum-tests request (without the idempotency key). */
export async function readUploadRequest(req: Request, body: ReadBody): Promise<UploadInput> {
  if (isJson(req)) {
    const json = body.json; // typed readings: read by route() under the JSON cap
    assertStorable(json, "body");
    const obj = (json && typeof json === "object" ? json : {}) as Record<string, unknown>;
    const { readings, timeMode, ...rest } = obj;
    const typed = parseInput(typedReadingsSchema, { readings, timeMode }, "body");
    const metadata = parseInput(testMetadataSchema, rest, "body");
    const { text, importDefaults, isolationAtSeconds } = typedReadingsToCsv(typed);
    const bytes = new TextEncoder().encode(text);
    return { metadata, source: "typed", filename: "typed-readings.csv", contentType: "text/csv", bytes, text, importDefaults, isolationAtSeconds };
  }
  if (mediaTypeOf(req.headers) !== "multipart/form-data")
    throw new AppError("unsupported_file", "Send the log as multipart/form-data (field 'file') or typed readings as JSON.");
  const form = formOf(body);
  const file = await fileOf(form);
  const metadata = parseInput(testMetadataSchema, fieldsOf(form), "form");
  return { metadata, source: "file", ...file };
}
