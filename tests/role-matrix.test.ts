/**
 * Every route × every role, and an outsider: OWASP ASVS 4.0.3 V4.1.1 (access control enforced on
 * the server), V4.1.3 (least privilege), V4.2.1 (no access to another tenant's records by id,
 * IDOR). The expected answer of each role is derived from lib/permissions.ts and the row rules
 * beside it (tests/role-matrix/expect.ts); a route without a probe fails the first test, so a new
 * route cannot skip the matrix.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { ROLES } from "@/lib/permissions";
import { matches, type Probe } from "./role-matrix/expect";
import { MAIL_PROBES } from "./role-matrix/probes-mail";
import { RECORD_PROBES } from "./role-matrix/probes-records";
import { TEST_PROBES } from "./role-matrix/probes-vacuum-tests";
import { buildWorld, type World } from "./role-matrix/world";

const PROBES: Probe[] = [...TEST_PROBES, ...RECORD_PROBES, ...MAIL_PROBES];

/** Routes with a dedicated test of their own access rules instead of a probe here. */
const COVERED_ELSEWHERE: Record<string, string> = {
  "GET /api/health": "public by design: tests/health.test.ts, tests/faults/*",
  "POST /api/invitations/:id/accept": "signed in, before any shop: tests/invitations-verified.test.ts",
  "GET /api/mail/unsubscribe": "no session, a signed token instead: tests/mail-settings.test.ts",
  "POST /api/mail/unsubscribe": "no session, a signed token instead: tests/mail-settings.test.ts",
};

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? routeFiles(full) : name === "route.ts" ? [full] : [];
  });
}

/** "METHOD /api/x/:id" for every handler exported by app/api (better-auth's catch-all aside). */
function servedRoutes(): string[] {
  const root = path.resolve(import.meta.dirname, "../app");
  return routeFiles(path.join(root, "api"))
    .filter((f) => !f.includes("[..."))
    .flatMap((f) => {
      const url = "/" + path.relative(root, path.dirname(f)).split(path.sep).join("/").replace(/\[([^\]]+)\]/g, ":$1");
      const methods = [...readFileSync(f, "utf8").matchAll(/export (?:const|async function) (GET|POST|PUT|PATCH|DELETE)\b/g)].map((m) => m[1]);
      return methods.map((m) => `${m} ${url}`);
    })
    .sort();
}

let w: World;
beforeAll(async () => {
  w = await buildWorld();
}, 120_000);

describe("route × role matrix (OWASP ASVS 4.0.3 V4.1.1, V4.1.3, V4.2.1)", () => {
  it("has a probe for every route app/api serves, and none for a route that is gone", () => {
    const probed = [...PROBES.map((p) => p.route), ...Object.keys(COVERED_ELSEWHERE)].sort();
    expect(new Set(probed).size, "a route probed twice").toBe(probed.length);
    expect(probed).toEqual(servedRoutes());
  });

  it.each(PROBES.map((p) => [p.route, p] as const))("%s: each role gets what lib/permissions.ts and the row rules give it; the outsider nothing of this shop; anonymous 401", async (_name, probe) => {
    const violations: string[] = [];
    for (const role of ROLES) {
      const res = await probe.call(w.crew[role], w);
      const want = probe.expect(role);
      if (!matches(res.status, want)) violations.push(`${role}: got ${res.status}, want ${want} (${(await res.text()).slice(0, 160)})`);
    }
    const out = await probe.call(w.outsider, w);
    const text = await out.text();
    const leaked = w.secrets.filter((s) => text.includes(s));
    if (leaked.length) violations.push(`outsider: the answer holds this shop's ${leaked.join(", ")}`);
    if (probe.outsider === "no-leak" ? out.status >= 500 : !matches(out.status, probe.outsider)) violations.push(`outsider: got ${out.status}, want ${probe.outsider}`);
    const anon = await probe.call(null, w);
    if (anon.status !== 401) violations.push(`anonymous: got ${anon.status}, want 401`);
    expect(violations).toEqual([]);
  });
});
