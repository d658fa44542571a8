/**
 * The policy lives in the wrapper and in one table (common practice, no source): every API route
 * file exports only handlers made by the one wrapper (route, signedInRoute, publicRoute; better-auth's
 * own catch-all aside), every route() names a policy of lib/permissions.ts, and the matrix committed
 * in DEVELOPERS.md is the one scripts/permission-matrix.ts generates from the code.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { POLICIES } from "@/lib/permissions";
import { BEGIN, END, renderPermissionMatrix, renderPolicyTable } from "../scripts/permission-matrix";

const ROOT = path.resolve(import.meta.dirname, "..");

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? routeFiles(full) : name === "route.ts" ? [full] : [];
  });
}

const FILES = routeFiles(path.join(ROOT, "app/api")).filter((f) => !f.includes("[..."));
const WRAPPED = /^export const (GET|POST|PUT|PATCH|DELETE) = (route|signedInRoute|publicRoute)\(/;

describe("every API route behind the wrapper (common practice, no source)", () => {
  it("finds the route files", () => {
    expect(FILES.length).toBeGreaterThan(40);
  });

  it.each(FILES.map((f) => [path.relative(ROOT, f)]))("%s exports only wrapped handlers, each route() naming a known policy", (rel) => {
    const text = readFileSync(path.join(ROOT, rel), "utf8");
    const handlers = text.split("\n").filter((l) => /^export\b/.test(l) && /\b(GET|POST|PUT|PATCH|DELETE|HEAD|OPTIONS)\b/.test(l) && !/^export const (dynamic|runtime|revalidate)\b/.test(l));
    expect(handlers.length, "a route file without a handler").toBeGreaterThan(0);
    const bare = handlers.filter((l) => !WRAPPED.test(l));
    expect(bare, "handlers not made by route(), signedInRoute() or publicRoute()").toEqual([]);
    expect(text).not.toMatch(/export\s*\{[^}]*\b(GET|POST|PUT|PATCH|DELETE)\b/);
    for (const m of text.matchAll(/= route\(\s*\{([^}]*)/g)) {
      const policy = /policy: "([^"]+)"/.exec(m[1])?.[1];
      expect(policy, "route() without a policy").toBeDefined();
      expect(Object.keys(POLICIES)).toContain(policy);
    }
  });
});

describe("the permission matrix in DEVELOPERS.md is generated from the code", () => {
  it("matches what npm run docs:permissions writes (run it after changing lib/permissions.ts or a route's policy)", () => {
    const doc = readFileSync(path.join(ROOT, "DEVELOPERS.md"), "utf8");
    const a = doc.indexOf(BEGIN);
    const b = doc.indexOf(END);
    expect(a, "the begin marker").toBeGreaterThanOrEqual(0);
    expect(b, "the end marker after it").toBeGreaterThan(a);
    expect(doc.slice(a + BEGIN.length, b).trim()).toBe(renderPermissionMatrix().trim());
  });

  it("docs/PERMISSIONS.md lists every policy with its routes as npm run docs:permissions writes it", () => {
    const doc = readFileSync(path.join(ROOT, "docs/PERMISSIONS.md"), "utf8");
    const a = doc.indexOf(BEGIN);
    const b = doc.indexOf(END);
    expect(b, "both markers").toBeGreaterThan(a);
    expect(a).toBeGreaterThanOrEqual(0);
    expect(doc.slice(a + BEGIN.length, b).trim()).toBe(renderPolicyTable().trim());
    for (const name of Object.keys(POLICIES)) expect(doc).toContain(`\`${name}\``);
  });

  it("shows a trainer re-analysing only their own tests, as lib/permissions.ts decides", () => {
    expect(renderPermissionMatrix()).toMatch(/\| `tests\.reanalyse` — [^|]+\| ✓ \| ✓ \| ✓ own \| ✓ own \| ✓ own \|/);
  });
});
