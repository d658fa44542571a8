/**
 * `Content-Disposition: attachment` with a file name every browser reads back as it was written,
 * including names outside Latin-1 ("ログ.csv", "Prüfung.csv").
 *
 * RFC 6266 §4.3 and Appendix D: send `filename*` in the RFC 5987 form (`UTF-8''` + percent-encoded
 * UTF-8 octets) for the real name, and before it a plain `filename` quoted-string fallback made of
 * printable ASCII only, for the rare client without RFC 5987 support. The header value itself is
 * then pure ASCII, so no HTTP stack mangles or refuses it.
 */

/** RFC 5987 §3.2.1 attr-char: ALPHA / DIGIT / "!#$&+-.^_`|~" — everything else is percent-encoded. */
const ATTR_CHAR = /[A-Za-z0-9!#$&+\-.^_`|~]/;

/** The RFC 5987 ext-value of a string: UTF-8, percent-encoding every octet that is not an attr-char. */
export function rfc5987Value(text: string): string {
  let out = "UTF-8''";
  for (const ch of text) {
    if (ATTR_CHAR.test(ch)) out += ch;
    else for (const byte of new TextEncoder().encode(ch)) out += `%${byte.toString(16).toUpperCase().padStart(2, "0")}`;
  }
  return out;
}

/**
 * A safe file name: no path (RFC 6266 §4.3: recipients drop directory parts; we do it first), no
 * control characters, no quote or backslash, at most 150 characters; "log.csv" when nothing is left.
 */
export function safeFilename(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? "";
  const clean = base.replace(/[\u0000-\u001f\u007f-\u009f"\\]/g, "").replace(/^[.\s]+/, "").trim();
  return [...clean].slice(-150).join("") || "log.csv";
}

/** The ASCII fallback for the plain `filename` parameter: other characters become "_". */
function asciiFallback(name: string): string {
  return name.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
}

/** `attachment; filename="…"; filename*=UTF-8''…` for a file name as the uploader gave it. */
export function attachmentDisposition(filename: string): string {
  const name = safeFilename(filename);
  return `attachment; filename="${asciiFallback(name)}"; filename*=${rfc5987Value(name)}`;
}
