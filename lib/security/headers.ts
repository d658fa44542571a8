/**
 * Riseline's security headers, written once and set on every response by proxy.ts.
 *
 *  - Pages get a Content-Security-Policy with a fresh nonce per request, as the Next.js 16 guide
 *    "How to set a Content Security Policy (CSP)" describes (nonce + 'strict-dynamic'; Next.js puts
 *    the nonce on its own scripts; 'unsafe-eval' only under `next dev`). Style attributes
 *    (`style-src-attr`) stay allowed: React and chart.js size elements with them, and CSS cannot
 *    run script. Everything else (API answers, files) gets `default-src 'none'`.
 *  - `frame-ancestors 'none'` and X-Frame-Options: DENY: no page can be framed (clickjacking).
 *  - X-Content-Type-Options: nosniff on everything; Referrer-Policy: same-origin (share-link tokens
 *    in a path never leave for another site); a Permissions-Policy that turns off the device APIs
 *    Riseline never uses; the opener and resource isolation headers.
 *  - Strict-Transport-Security and upgrade-insecure-requests in production only: the demo and
 *    the tests are served over plain HTTP on loopback.
 * OWASP ASVS 4.0.3 V14.4 (HTTP security headers) and the OWASP Secure Headers Project.
 */

export interface HeaderMode {
  /** RISELINE_MODE=production: HSTS and upgrade-insecure-requests. */
  production: boolean;
  /** `next dev`: React needs eval for its debugging aids, and styles are injected inline. */
  development: boolean;
}

const PERMISSIONS_POLICY = [
  "accelerometer=()", "autoplay=()", "camera=()", "display-capture=()", "geolocation=()", "gyroscope=()",
  "magnetometer=()", "microphone=()", "midi=()", "payment=()", "usb=()", "xr-spatial-tracking=()",
].join(", ");

/** Headers every response carries, whatever it is. */
export function commonSecurityHeaders(mode: HeaderMode): Record<string, string> {
  return {
    "x-content-type-options": "nosniff",
    "x-frame-options": "DENY",
    "referrer-policy": "same-origin",
    "permissions-policy": PERMISSIONS_POLICY,
    "cross-origin-opener-policy": "same-origin",
    "cross-origin-resource-policy": "same-origin",
    ...(mode.production ? { "strict-transport-security": "max-age=63072000; includeSubDomains" } : {}),
  };
}

/** The policy of an HTML page rendered with this nonce. */
export function pagePolicy(nonce: string, mode: HeaderMode): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${mode.development ? " 'unsafe-eval'" : ""}`,
    mode.development ? "style-src 'self' 'unsafe-inline'" : `style-src 'self' 'nonce-${nonce}'`,
    "style-src-attr 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    "connect-src 'self'",
    "worker-src 'self' blob:",
    "manifest-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(mode.production ? ["upgrade-insecure-requests"] : []),
  ].join("; ");
}

/**
 * The policy of anything that is not a page (JSON, a PDF report, a static file): nothing may load
 * or run from it, nor frame it. A PDF keeps `object-src` open, which the browser's own viewer
 * needs to show it inline.
 */
export function nonPagePolicy(path: string): string {
  // A Web Worker's bootstrap (the phone's engine, lib/offline/engine-client.ts) runs under its own
  // response's policy and loads its chunks with importScripts: same-origin scripts only.
  if (/^\/_next\/static\/chunks\/turbopack-worker-[\w-]+\.js$/.test(path)) return "default-src 'none'; script-src 'self'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";
  const pdf = /^\/api\/(?:vacuum-)?tests\/[^/]+\/report$|^\/share\/[^/]+\/pdf$/.test(path);
  return pdf ? "default-src 'none'; object-src 'self'; style-src 'unsafe-inline'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'" : "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";
}

/** Paths answered by something other than an HTML page. */
export function isNonPagePath(path: string): boolean {
  return path.startsWith("/api/") || path.startsWith("/_next/static/") || path.startsWith("/_next/image") || /^\/share\/[^/]+\/pdf$/.test(path) || /\.(svg|png|ico|txt|xml|json|webmanifest|woff2?)$/.test(path);
}

/** A nonce of 128 random bits, base64 (CSP Level 3 §2.3.1 nonce-source). */
export function newNonce(): string {
  return Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString("base64");
}
