/**
 * The layers only point down: app/ and components/ → lib/ → db/, and analysis/ (the pure engine)
 * imports none of them. A back-edge (lib/ importing a component, db/ importing lib/) fails here
 * with the file and the import that made it. Common practice (layered architecture), no source.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const ROOT = path.resolve(import.meta.dirname, "..");

/** What each top-level folder may not import. */
const FORBIDDEN: Record<string, readonly string[]> = {
  analysis: ["app", "components", "lib", "db"],
  db: ["app", "components", "lib"],
  lib: ["app", "components"],
};

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return name === "node_modules" ? [] : sourceFiles(full);
    return /\.(ts|tsx|mts)$/.test(name) ? [full] : [];
  });
}

/** Every module a file names in an import, export-from or dynamic import(). */
export function importedSpecifiers(text: string): string[] {
  const out: string[] = [];
  for (const m of text.matchAll(/(?:^|[\s;])(?:import|export)\s[^"'`;]*?from\s*["']([^"']+)["']|(?:^|[\s;(])import\s*\(\s*["']([^"']+)["']\s*\)|^\s*import\s*["']([^"']+)["']/gm)) {
    out.push(m[1] ?? m[2] ?? m[3]);
  }
  return out;
}

/** The top-level folder an import lands in ("lib", "db", …), or null for a package. */
function targetFolder(fromFile: string, spec: string): string | null {
  let target: string;
  if (spec.startsWith("@/")) target = spec.slice(2);
  else if (spec.startsWith(".")) target = path.relative(ROOT, path.resolve(path.dirname(fromFile), spec));
  else return null;
  return target.split(/[\\/]/)[0];
}

function backEdges(folder: string): string[] {
  const forbidden = FORBIDDEN[folder];
  return sourceFiles(path.join(ROOT, folder)).flatMap((file) =>
    importedSpecifiers(readFileSync(file, "utf8"))
      .filter((spec) => forbidden.includes(targetFolder(file, spec) ?? ""))
      .map((spec) => `${path.relative(ROOT, file)} imports ${spec}`),
  );
}

describe("layers point down (common practice, no source)", () => {
  it("reads every kind of import a file can write, so the scan below sees them all", () => {
    const text = [
      'import { a } from "@/lib/a";',
      "import type { B } from '../db/b';",
      'export { c } from "@/components/c";',
      'const d = await import("@/app/d");',
      'import "@/lib/side-effect";',
      'import {\n  e,\n  f,\n} from "@/lib/e";',
    ].join("\n");
    expect(importedSpecifiers(text)).toEqual(["@/lib/a", "../db/b", "@/components/c", "@/app/d", "@/lib/side-effect", "@/lib/e"]);
    expect(targetFolder(path.join(ROOT, "db/queries/x.ts"), "../../lib/env")).toBe("lib");
    expect(targetFolder(path.join(ROOT, "db/queries/x.ts"), "./visibility")).toBe("db");
    expect(targetFolder(path.join(ROOT, "db/queries/x.ts"), "drizzle-orm")).toBeNull();
  });

  it.each(Object.keys(FORBIDDEN))("%s/ has no import pointing up", (folder) => {
    expect(sourceFiles(path.join(ROOT, folder)).length).toBeGreaterThan(0);
    expect(backEdges(folder)).toEqual([]);
  });
});
