/**
 * Taking secrets out of text and values bound for a log. Applied to every log line (lib/log.ts)
 * and to the framework's own console output (instrumentation.ts).
 */

/** Field names whose values are never logged. */
const SECRET_KEY = /pass(word)?|secret|token|cookie|authorization|api[-_]?key|credential|signature/i;

const PATTERNS: [RegExp, string][] = [
  // Drizzle's "Failed query: … params: …": the parameters may be a session token or a password hash.
  [/(\bparams:)[^\n]*/g, "$1 [redacted]"],
  // Cookies and bearer credentials, wherever they appear.
  [/((?:__Secure-|__Host-)?better-auth\.[a-z_]+=)[^;\s"',]+/gi, "$1[redacted]"],
  [/(\bbearer\s+)[A-Za-z0-9._~+/=-]+/gi, "$1[redacted]"],
  // Tokens carried in links: ?token=…, /reset-password/…, /share/…, /invite/…?key=…
  [/([?&](?:token|key|code|signature|X-Amz-Signature|X-Amz-Credential)=)[^&\s"']+/gi, "$1[redacted]"],
  [/(\/(?:reset-password|share|verify-email)\/)[A-Za-z0-9._~-]+/g, "$1[redacted]"],
];

export function redactText(text: string): string {
  let out = text;
  for (const [re, to] of PATTERNS) out = out.replace(re, to);
  return out;
}

/** A copy of a log field value with secret-named keys blanked and every string redacted. */
export function redactValue(value: unknown, depth = 0): unknown {
  if (typeof value === "string") return redactText(value);
  if (value === null || typeof value !== "object" || depth > 6) return value;
  if (value instanceof Error) return redactText(`${value.name}: ${value.message}`);
  if (Array.isArray(value)) return value.map((v) => redactValue(v, depth + 1));
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(value)) out[k] = SECRET_KEY.test(k) ? "[redacted]" : redactValue(v, depth + 1);
  return out;
}
