/**
 * First-load JavaScript of a page, from the production build's own manifests (run after
 * `npm run build`): the root main files of .next/build-manifest.json plus the entry chunks of
 * every segment on the route's path (root layout, group layouts, the page) from its
 * page_client-reference-manifest.js, each gzipped (node:zlib, level 9) as a server would send it.
 * Also finds the phone engine's worker chunk and says whether it is part of that first load.
 * Prints figures; asserts nothing. Usage: tsx scripts/measure-first-load.ts [/(app)/vacuum-tests/new]
 */
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { gzipSync } from "node:zlib";

const route = process.argv[2] ?? "/(app)/vacuum-tests/new";
const BUDGET_KB = 180;
const next = ".next";
const build = JSON.parse(readFileSync(join(next, "build-manifest.json"), "utf8")) as { rootMainFiles: string[]; polyfillFiles: string[] };
const manifestFile = join(next, "server/app", route, "page_client-reference-manifest.js");
if (!existsSync(manifestFile)) throw new Error(`${manifestFile} not found: run npm run build first`);

const g = globalThis as { __RSC_MANIFEST?: Record<string, { entryJSFiles: Record<string, string[]> }> };
new Function(readFileSync(manifestFile, "utf8"))();
const entry = g.__RSC_MANIFEST![`${route}/page`].entryJSFiles;

// The segments on the route's path: app/layout, app/(group)/layout, …, the page itself.
const parts = route.split("/").filter(Boolean);
const segments = ["[project]/app/layout", ...parts.map((_, i) => `[project]/app/${parts.slice(0, i + 1).join("/")}/layout`), `[project]/app/${parts.join("/")}/page`];
const files = new Set(build.rootMainFiles);
for (const s of segments) for (const f of entry[s] ?? []) files.add(f);

const gz = (f: string) => gzipSync(readFileSync(join(next, f)), { level: 9 }).length;
let total = 0;
console.log(`First-load JavaScript of ${route} (gzip):`);
for (const f of files) {
  const n = gz(f);
  total += n;
  console.log(`  ${(n / 1024).toFixed(1).padStart(7)} kB  ${f}`);
}
console.log(`  ${(total / 1024).toFixed(1).padStart(7)} kB  total (budget ${BUDGET_KB} kB; ${total / 1024 <= BUDGET_KB ? "within" : "OVER"})`);
console.log(`  (polyfills for old browsers only, not counted: ${build.polyfillFiles.map((f) => `${(gz(f) / 1024).toFixed(1)} kB`).join(", ")})`);

// The engine worker: the chunk carrying the worker's own message.
const chunkDir = join(next, "static/chunks");
const engine = readdirSync(chunkDir).filter((f) => f.endsWith(".js") && readFileSync(join(chunkDir, f), "utf8").includes("This phone could not analyse the log."));
for (const f of engine) {
  const rel = `static/chunks/${f}`;
  console.log(`Engine worker chunk: ${rel}, ${(gz(rel) / 1024).toFixed(1)} kB gzip, ${files.has(rel) ? "IN the first load" : "loaded on demand (not in the first load)"}`);
}
if (existsSync("public/sw.js")) console.log(`Service worker public/sw.js: ${(gzipSync(readFileSync("public/sw.js"), { level: 9 }).length / 1024).toFixed(1)} kB gzip (fetched by the browser after load, not part of the page's JS)`);
