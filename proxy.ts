/**
 * Runs before every request (Next.js 16's Proxy, formerly Middleware):
 *  1. the security headers of lib/security/headers.ts on every response, with a fresh CSP nonce
 *     for pages (Next.js reads it from the request's Content-Security-Policy and puts it on its
 *     own scripts; the root layout reads `x-nonce` for ours);
 *  2. while the database does not answer, a page is a 503 with a plain explanation (lib/health);
 *  3. the headers a client could forge to pick its rate-limit bucket are taken off the request
 *     (lib/security/client-ip.ts says why and what replaces them).
 */
import { NextResponse, type NextRequest } from "next/server";
import { runtimeMode } from "@/lib/env";
import { databaseAnswersForPages, outagePage } from "@/lib/health/database";
import { FORWARDED_CHAIN_HEADER, INTERNAL_HEADERS } from "@/lib/security/client-ip";
import { commonSecurityHeaders, isNonPagePath, newNonce, nonPagePolicy, pagePolicy } from "@/lib/security/headers";

export async function proxy(request: NextRequest) {
  const { mode, nodeEnv } = runtimeMode();
  const headerMode = { production: mode === "production", development: nodeEnv === "development" };
  const path = request.nextUrl.pathname;

  const requestHeaders = new Headers(request.headers);
  for (const h of INTERNAL_HEADERS) requestHeaders.delete(h);
  const forwarded = requestHeaders.get("x-forwarded-for");
  if (forwarded !== null) {
    requestHeaders.set(FORWARDED_CHAIN_HEADER, forwarded);
    requestHeaders.delete("x-forwarded-for"); // Next.js then writes the TCP peer's address here
  }
  requestHeaders.delete("x-real-ip");

  let policy: string;
  let nonce: string | null = null;
  if (isNonPagePath(path)) {
    policy = nonPagePolicy(path);
  } else {
    nonce = newNonce();
    policy = pagePolicy(nonce, headerMode);
    requestHeaders.set("x-nonce", nonce);
    requestHeaders.set("content-security-policy", policy);
  }

  // A page needs the database (the session, the records): while it is away, say so with a 503.
  const response =
    nonce !== null && !(await databaseAnswersForPages())
      ? new NextResponse(outagePage(nonce), { status: 503, headers: { "content-type": "text/html; charset=utf-8", "retry-after": "30", "cache-control": "no-store" } })
      : NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("content-security-policy", policy);
  for (const [name, value] of Object.entries(commonSecurityHeaders(headerMode))) response.headers.set(name, value);
  return response;
}
