/**
 * Upload-to-verdict latency of POST /api/tests for a 1-hour, 1 Hz gauge log (3,600 rows, simulated),
 * at 1 and at 20 concurrent uploads, against a running server (see scripts/bench-api.sh).
 * Prints p50 and p95 in milliseconds, and the first-load JS (gzip) of /tests/new from .next.
 * Bounded loops only; loopback only.
 */
import { randomUUID } from "node:crypto";
import { gzipSync } from "node:zlib";
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { getAuth } from "@/lib/auth";
import { closeDb } from "@/db/client";
import { simulateLog } from "@/analysis/simulate";

const base = process.argv[2] ?? "http://127.0.0.1:3300";
if (!/^http:\/\/(127\.0\.0\.1|localhost)(:\d+)?$/.test(base)) throw new Error("bench runs against loopback only");

const SEQUENTIAL_UPLOADS = 20;
const CONCURRENCY = 20;
const CONCURRENT_ROUNDS = 4;
const WARMUP_UPLOADS = 3;

async function benchMember(): Promise<string> {
  const email = `bench-${randomUUID().slice(0, 8)}@example.test`;
  const password = "bench-password-not-secret";
  const { user } = await getAuth().api.signUpEmail({ body: { email, password, name: "Bench Tech" } });
  await getAuth().api.createOrganization({ body: { name: "Bench shop", slug: `bench-${randomUUID().slice(0, 12)}`, userId: user.id } });
  const res = await getAuth().api.signInEmail({ body: { email, password }, asResponse: true });
  return res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

function hourLog(): string {
  const sim = simulateLog({ scenario: "leak", seed: 7, sampleSeconds: 1, startInHold: true, holdMinutes: 60, layout: "iso" });
  return sim.text;
}

async function uploadOnce(cookie: string, text: string): Promise<number> {
  const form = new FormData();
  form.set("file", new File([text], "hour-1hz.csv", { type: "text/csv" }));
  const t0 = performance.now();
  const res = await fetch(`${base}/api/tests`, { method: "POST", body: form, headers: { cookie, origin: base } });
  const body = (await res.json()) as { analysis?: { verdict?: string } };
  const ms = performance.now() - t0;
  if (res.status !== 201 || !body.analysis?.verdict) throw new Error(`upload failed: ${res.status} ${JSON.stringify(body).slice(0, 300)}`);
  return ms;
}

function percentile(sorted: number[], p: number): number {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[i];
}

function summary(label: string, ms: number[]) {
  const s = [...ms].sort((a, b) => a - b);
  console.log(`${label}: n=${s.length}  p50=${percentile(s, 50).toFixed(0)} ms  p95=${percentile(s, 95).toFixed(0)} ms  max=${s[s.length - 1].toFixed(0)} ms`);
  return { p50: percentile(s, 50), p95: percentile(s, 95) };
}

/** Sum of gzip sizes of the JS chunks /tests/new loads first (from the build's manifests). */
function firstLoadJsKb(): number | null {
  const dir = ".next";
  const candidates = [
    path.join(dir, "server/app/(app)/tests/new/page_client-reference-manifest.js"),
    path.join(dir, "server/app/(app)/tests/new/page/build-manifest.json"),
  ];
  const chunks = new Set<string>();
  const buildManifest = path.join(dir, "build-manifest.json");
  if (existsSync(buildManifest)) {
    const m = JSON.parse(readFileSync(buildManifest, "utf8")) as { rootMainFiles?: string[]; polyfillFiles?: string[] };
    for (const f of m.rootMainFiles ?? []) chunks.add(f);
  }
  let found = false;
  for (const c of candidates) {
    if (!existsSync(c)) continue;
    found = true;
    const text = readFileSync(c, "utf8");
    for (const m of text.matchAll(/static\/chunks\/[A-Za-z0-9_\-./~]+?\.js/g)) chunks.add(m[0]);
  }
  if (!found) return null;
  let bytes = 0;
  for (const c of chunks) {
    const file = path.join(dir, c.replace(/^\/?_next\//, ""));
    if (existsSync(file)) bytes += gzipSync(readFileSync(file)).byteLength;
  }
  return bytes / 1024;
}

const cookie = await benchMember();
const text = hourLog();
console.log(`log: ${text.split("\n").length - 1} lines, ${(Buffer.byteLength(text) / 1024).toFixed(0)} kB`);
for (let i = 0; i < WARMUP_UPLOADS; i++) await uploadOnce(cookie, text);

const one: number[] = [];
for (let i = 0; i < SEQUENTIAL_UPLOADS; i++) one.push(await uploadOnce(cookie, text));
const many: number[] = [];
for (let r = 0; r < CONCURRENT_ROUNDS; r++) many.push(...(await Promise.all(Array.from({ length: CONCURRENCY }, () => uploadOnce(cookie, text)))));

const a = summary("1 concurrent ", one);
const b = summary(`${CONCURRENCY} concurrent`, many);
const kb = firstLoadJsKb();
console.log(kb === null ? "first-load JS of /tests/new: page not in the build" : `first-load JS of /tests/new: ${kb.toFixed(1)} kB gzip (goal ≤ 180 kB)`);
console.log(`goal p95 < 500 ms at ${CONCURRENCY} concurrent: ${b.p95 < 500 ? "met" : "NOT met"} (p50 at 1: ${a.p50.toFixed(0)} ms)`);
await closeDb();
