/**
 * Reading an uploaded gauge log safely: size limits before and while reading, content type and
 * byte sniffing (a spreadsheet, an image or a PDF is refused with 415), and decoding to text.
 */
import { createHash } from "node:crypto";
import { AppError } from "@/lib/errors";
import { env } from "@/lib/env";
import { fileTooLarge as tooLarge } from "@/lib/api/body";

const TEXT_TYPES = new Set([
  "",
  "text/csv",
  "text/plain",
  "text/tab-separated-values",
  "text/x-csv",
  "text/comma-separated-values",
  "application/csv",
  "application/x-csv",
  "application/vnd.ms-excel", // what some desktop browsers send for any .csv
  "application/octet-stream",
]);
const TEXT_EXTENSIONS = /\.(csv|txt|tsv|tab|log|dat)$/i;
const REFUSED_EXTENSIONS = /\.(xlsx|xlsm|xls|ods|numbers|pdf|png|jpe?g|gif|heic|zip|gz|docx?)$/i;

export function sha256Hex(bytes: Uint8Array): string {
  return createHash("sha256").update(bytes).digest("hex");
}

/** Refuse anything that is not a text log, by its declared type, its name and its bytes. */
export function assertTextLog(bytes: Uint8Array, contentType: string, filename: string): void {
  if (bytes.byteLength > env().MAX_UPLOAD_BYTES) throw tooLarge(bytes.byteLength);
  const type = contentType.split(";")[0].trim().toLowerCase();
  const hint = "Export the gauge log as CSV (comma, semicolon or tab separated text) and upload that.";
  if (!TEXT_TYPES.has(type) && !type.startsWith("text/"))
    throw new AppError("unsupported_file", `A ${type} file is not a gauge log. ${hint}`, { contentType: type });
  if (REFUSED_EXTENSIONS.test(filename) && !TEXT_EXTENSIONS.test(filename))
    throw new AppError("unsupported_file", `${filename} is not a text log. ${hint}`, { filename });
  const head = bytes.subarray(0, 8192);
  let magic = "";
  for (let i = 0; i < Math.min(5, head.length); i++) magic += String.fromCharCode(head[i]);
  if (magic.startsWith("%PDF") || magic.startsWith("PK\x03\x04") || magic.startsWith("\x89PNG") || magic.startsWith("GIF8") || (head[0] === 0xff && head[1] === 0xd8))
    throw new AppError("unsupported_file", `${filename} is a document or an image, not a text log. ${hint}`, { filename });
  let control = 0;
  for (const b of head) {
    if (b === 0) throw new AppError("unsupported_file", `${filename} contains binary data (NUL bytes), not text. ${hint}`, { filename });
    if (b < 0x09 || (b > 0x0d && b < 0x20 && b !== 0x1a)) control++;
  }
  if (head.length > 0 && control / head.length > 0.01)
    throw new AppError("unsupported_file", `${filename} looks binary (control characters), not text. ${hint}`, { filename });
}

/** UTF-8 (with or without BOM), falling back to Windows-1252 for older desktop exports. */
export function decodeLogText(bytes: Uint8Array): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return new TextDecoder("windows-1252").decode(bytes);
  }
}
