/**
 * `npm run docs:permissions`: writes the permission matrix of DEVELOPERS.md from the code — the
 * rows of PERMISSIONS with each one's doc comment (lib/permissions.ts), the policies route() takes
 * and the API routes that name each one (app/api). It replaces what stands between the markers
 * <!-- permissions:begin --> and <!-- permissions:end -->; tests/permission-matrix.test.ts fails
 * when the committed text differs from what this prints.
 */
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { PERMISSIONS, POLICIES, ROLES, can, type Permission, type PolicyName, type Role } from "@/lib/permissions";

const ROOT = path.resolve(import.meta.dirname, "..");
export const BEGIN = "<!-- permissions:begin -->";
export const END = "<!-- permissions:end -->";

/** Each permission's doc comment in lib/permissions.ts, as the matrix's words. */
function wordsOfPermissions(): Record<string, string> {
  const text = readFileSync(path.join(ROOT, "lib/permissions.ts"), "utf8");
  const out: Record<string, string> = {};
  for (const m of text.matchAll(/\/\*\*\s*(.+?)\s*\*\/\s*\n\s*"([a-z_.]+)":/g)) out[m[2]] = m[1].replace(/\.$/, "");
  return out;
}

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? routeFiles(full) : name === "route.ts" ? [full] : [];
  });
}

/** "METHOD /api/…" for every handler that names each policy. */
function routesOfPolicies(): Record<string, string[]> {
  const app = path.join(ROOT, "app");
  const out: Record<string, string[]> = {};
  for (const file of routeFiles(path.join(app, "api")).sort()) {
    const url = "/" + path.relative(app, path.dirname(file)).split(path.sep).join("/").replace(/\[([^\]]+)\]/g, ":$1");
    for (const m of readFileSync(file, "utf8").matchAll(/export const (GET|POST|PUT|PATCH|DELETE) = route\(\s*\{\s*policy: "([^"]+)"/g)) (out[m[2]] ??= []).push(`${m[1]} ${url}`);
  }
  return out;
}

/** "✓", "✓ own" (only on tests they made) or "" for one role and one permission. */
function cell(role: Role, permission: Permission): string {
  if (!can(role, permission)) return "";
  const using = (Object.keys(POLICIES) as PolicyName[]).map((n) => POLICIES[n] as { permission: string; anyTest?: readonly Role[] }).filter((p) => p.permission === permission);
  const ownOnly = using.length > 0 && using.every((p) => p.anyTest && !p.anyTest.includes(role));
  return ownOnly ? "✓ own" : "✓";
}

/** The role × permission matrix (DEVELOPERS.md). */
export function renderPermissionMatrix(): string {
  const words = wordsOfPermissions();
  const lines = [
    "Generated from `lib/permissions.ts` by `npm run docs:permissions`; do not edit by hand.",
    "",
    `| permission | ${ROLES.join(" | ")} |`,
    `|---|${ROLES.map(() => "---").join("|")}|`,
    ...(Object.keys(PERMISSIONS) as Permission[]).map((p) => `| \`${p}\` — ${words[p] ?? ""} | ${ROLES.map((r) => cell(r, p)).join(" | ")} |`),
    "",
    "\"own\": only on the tests they made. Which policy each API route names: [docs/PERMISSIONS.md](docs/PERMISSIONS.md).",
  ];
  return lines.join("\n");
}

/** Every policy of `route({ policy })` with its permission, its row rule and its routes (docs/PERMISSIONS.md). */
export function renderPolicyTable(): string {
  const routes = routesOfPolicies();
  const lines = [
    "Generated from `lib/permissions.ts` and `app/api` by `npm run docs:permissions`; do not edit by hand.",
    "",
    "| policy | permission | on any test | rows | routes |",
    "|---|---|---|---|---|",
    ...(Object.keys(POLICIES) as PolicyName[]).map((n) => {
      const p = POLICIES[n] as { permission: string; anyTest?: readonly Role[]; rows?: string };
      return `| \`${n}\` | ${p.permission === "member" ? "any member" : `\`${p.permission}\``} | ${p.anyTest ? p.anyTest.join(", ") : "—"} | ${p.rows ?? "—"} | ${(routes[n] ?? []).map((r) => `\`${r}\``).join(", ") || "—"} |`;
    }),
  ];
  return lines.join("\n");
}

/** The document with the generated text between the markers (added at the end of the file when absent). */
export function withMatrix(doc: string, render: () => string = renderPermissionMatrix): string {
  const block = `${BEGIN}\n${render()}\n${END}`;
  const a = doc.indexOf(BEGIN);
  const b = doc.indexOf(END);
  if (a < 0 || b < a) return `${doc.trimEnd()}\n\n${block}\n`;
  return doc.slice(0, a) + block + doc.slice(b + END.length);
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const docs: [string, () => string, string][] = [
    ["DEVELOPERS.md", renderPermissionMatrix, ""],
    ["docs/PERMISSIONS.md", renderPolicyTable, "# Policies of the route wrapper\n\nEvery API route names one policy in `route({ policy })` (`lib/api/handler.ts`); the role matrix is in\n[DEVELOPERS.md](../DEVELOPERS.md).\n"],
  ];
  for (const [name, render, head] of docs) {
    const file = path.join(ROOT, name);
    const before = existsSync(file) ? readFileSync(file, "utf8") : head;
    const after = withMatrix(before, render);
    if (after !== before) writeFileSync(file, after);
    console.log(after === before ? `${name}: up to date` : `${name}: rewritten`);
  }
}
