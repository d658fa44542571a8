/**
 * The one cross-site request check for every state-changing request (our routes, better-auth's,
 * and server actions should any be added): OWASP Cross-Site Request Forgery Prevention Cheat
 * Sheet, "Verifying Origin with Standard Headers" and "Fetch Metadata headers".
 *
 *  1. `Origin` present: it must be one of Riseline's own origins (BETTER_AUTH_URL and
 *     TRUSTED_ORIGINS). `Origin: null` (sandboxed frames, file: pages, some redirects) is refused.
 *  2. No `Origin`: `Sec-Fetch-Site` must be `same-origin` (or `none`, a request the person made
 *     themselves). `same-site` is refused too: another port on the same host (the S3 store) is the
 *     same site but not the same origin.
 *  3. Neither: a `Referer`, if any, must be ours.
 *  4. None of the three: not a browser (browsers send Origin on every cross-origin POST, Fetch
 *     standard §3.1), so there is no ambient cookie to forge with; the request goes on to the
 *     session check like any other.
 */
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";

const UNSAFE = new Set(["POST", "PUT", "PATCH", "DELETE"]);

export function isStateChanging(method: string): boolean {
  return UNSAFE.has(method.toUpperCase());
}

function originOf(url: string): string | null {
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}

let cached: { key: string; set: Set<string> } | null = null;

/** Riseline's own origins: where the app is served, and the extra ones configured. */
export function ownOrigins(): Set<string> {
  const e = env();
  const key = `${e.BETTER_AUTH_URL}|${e.TRUSTED_ORIGINS}`;
  if (cached?.key !== key) {
    const list = [e.BETTER_AUTH_URL, ...e.TRUSTED_ORIGINS.split(",")].map((s) => s.trim()).filter(Boolean);
    cached = { key, set: new Set(list.map(originOf).filter((o): o is string => !!o)) };
  }
  return cached.set;
}

/** Why a request looks cross-site, or null when it does not. */
export function crossSiteReason(headers: Headers): string | null {
  const own = ownOrigins();
  const origin = headers.get("origin");
  if (origin !== null) {
    if (origin.trim().toLowerCase() === "null") return "its Origin is null";
    const o = originOf(origin);
    return o && own.has(o) ? null : `its Origin (${origin.slice(0, 100)}) is not Riseline's`;
  }
  const site = headers.get("sec-fetch-site");
  if (site !== null) return site === "same-origin" || site === "none" ? null : `the browser marked it ${site.slice(0, 20)}`;
  const referer = headers.get("referer");
  if (referer !== null) {
    const r = originOf(referer);
    return r && own.has(r) ? null : "its Referer is not a Riseline page";
  }
  return null;
}

/** Throws 403 cross_site for a state-changing request that another site could have made. */
export function assertSameOrigin(req: Request): void {
  if (!isStateChanging(req.method)) return;
  const why = crossSiteReason(req.headers);
  if (why) throw new AppError("cross_site", undefined, { reason: why });
}
