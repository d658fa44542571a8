/**
 * better-auth's endpoints, behind the same guards as every other route: the one same-origin check
 * (lib/api/csrf.ts) and JSON only as application/json; the client address for its rate limits
 * resolved from the TCP peer and a trusted proxy only (lib/security/client-ip.ts); and a database
 * that does not answer is a 503 with our words, not better-auth's 500.
 */
import { sql } from "drizzle-orm";
import { toNextJsHandler } from "better-auth/next-js";
import { db } from "@/db/client";
import { assertAcceptedBody } from "@/lib/api/body";
import { assertSameOrigin } from "@/lib/api/csrf";
import { isDatabaseUnreachable } from "@/lib/api/failures";
import { describeError, log } from "@/lib/log";
import { getAuth } from "@/lib/auth";
import { env } from "@/lib/env";
import { AppError, errorResponse, type AppErrorCode } from "@/lib/errors";
import { CLIENT_IP_HEADER, FORWARDED_CHAIN_HEADER, clientIpOf, parseCidrs } from "@/lib/security/client-ip";

export const dynamic = "force-dynamic";

let trusted: { list: string; cidrs: ReturnType<typeof parseCidrs> } | null = null;
function trustedProxies() {
  const list = env().TRUSTED_PROXIES;
  if (trusted?.list !== list) trusted = { list, cidrs: parseCidrs(list) };
  return trusted.cidrs;
}

/** The request as better-auth sees it: with the resolved client address, and nothing forged. */
function withClientIp(req: Request): Request {
  const headers = new Headers(req.headers);
  headers.delete(CLIENT_IP_HEADER);
  const ip = clientIpOf(headers.get("x-forwarded-for"), headers.get(FORWARDED_CHAIN_HEADER), trustedProxies());
  if (ip) headers.set(CLIENT_IP_HEADER, ip);
  const init: RequestInit & { duplex?: "half" } = { method: req.method, headers, body: req.body, signal: req.signal, duplex: "half" };
  return new Request(req.url, init);
}

async function databaseAnswers(): Promise<boolean> {
  try {
    await Promise.race([db().execute(sql`select 1`), new Promise((_, reject) => setTimeout(() => reject(new Error("timeout")), 2000))]);
    return true;
  } catch {
    return false;
  }
}

/** better-auth's error body shape ({ code, message }) with our code and words. */
function authError(code: AppErrorCode, details?: Record<string, unknown>): Response {
  const e = new AppError(code, undefined, details);
  const res = errorResponse(e);
  return new Response(JSON.stringify({ code: code.toUpperCase(), message: e.message, ...details }), { status: res.status, headers: res.headers });
}

async function handle(req: Request, run: (r: Request) => Promise<Response>): Promise<Response> {
  try {
    assertSameOrigin(req);
    assertAcceptedBody(req, ["json"]);
  } catch (err) {
    if (err instanceof AppError) return authError(err.code, err.details);
    throw err;
  }
  let res: Response;
  try {
    res = await run(withClientIp(req));
  } catch (err) {
    if (isDatabaseUnreachable(err)) return authError("database_unavailable");
    log.error("auth request failed", { path: new URL(req.url).pathname, err: describeError(err) });
    res = authError("internal");
  }
  if (res.status >= 500 && !(await databaseAnswers())) return authError("database_unavailable");
  return res;
}

export async function GET(req: Request) {
  return handle(req, (r) => toNextJsHandler(getAuth()).GET(r));
}

export async function POST(req: Request) {
  return handle(req, (r) => toNextJsHandler(getAuth()).POST(r));
}
