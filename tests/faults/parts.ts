/**
 * Breaking the parts of the "faults" profile one at a time (scripts/services.sh), and what the
 * fault tests check after each: nothing confirmed lost, nothing half-written left.
 */
import { execFileSync } from "node:child_process";
import path from "node:path";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { getObjectBytes } from "@/lib/storage";
import { listKeys, sha256 } from "../helpers/uploads";

const ROOT = path.resolve(import.meta.dirname, "../..");

function services(action: string): string {
  return execFileSync("bash", ["scripts/services.sh", action, "faults"], { cwd: ROOT, encoding: "utf8", stdio: ["ignore", "pipe", "pipe"] }).trim();
}

export const postgres = {
  stop: () => services("pg-stop"),
  start: () => services("pg-start"),
  /** SIGSTOP to the postmaster and every backend: connections are accepted and nothing answers. */
  freeze: () => signalAll(services("pg-pids"), "SIGSTOP"),
  thaw: () => signalAll(services("pg-pids"), "SIGCONT"),
};

function signalAll(pids: string, signal: NodeJS.Signals) {
  for (const pid of pids.split(/\s+/).filter(Boolean)) {
    try {
      process.kill(Number(pid), signal);
    } catch {
      /* a backend that has just ended */
    }
  }
}

/** The S3 fake and the SMTP catcher (one process, scripts/fakes.mjs). */
export const fakes = {
  stop: () => services("fakes-stop"),
  start: () => services("fakes-start"),
  /** SIGSTOP: the port still accepts connections, and nothing answers. */
  freeze: () => process.kill(Number(services("fakes-pid")), "SIGSTOP"),
  thaw: () => process.kill(Number(services("fakes-pid")), "SIGCONT"),
};

/** How long a call takes, and its result or error. */
export async function timed<T>(run: () => Promise<T>): Promise<{ ms: number; value?: T; error?: unknown }> {
  const t0 = performance.now();
  try {
    const value = await run();
    return { ms: performance.now() - t0, value };
  } catch (error) {
    return { ms: performance.now() - t0, error };
  }
}

export async function until(check: () => Promise<boolean> | boolean, ms: number, what: string): Promise<void> {
  const end = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

export interface Consistency {
  tests: number;
  /** Tests without their upload, or without a current analysis: half-written. */
  halfWritten: string[];
  /** Upload rows whose object is missing or differs from its SHA-256. */
  brokenFiles: string[];
  /** Objects in the store no upload row refers to. */
  orphanObjects: string[];
}

/** Reads one organization's rows and objects and says what does not fit together. */
export async function consistencyOf(organizationId: string): Promise<Consistency> {
  const tests = await db().execute<{ id: string; uploads: number; analysis: boolean }>(sql`
    select t.id, (select count(*)::int from uploads u where u.test_id = t.id) as uploads,
           exists (select 1 from analyses a where a.id = t.current_analysis_id) as analysis
    from vacuum_tests t where t.organization_id = ${organizationId}`);
  const uploads = await db().execute<{ object_key: string; sha256: string }>(sql`select object_key, sha256 from uploads where organization_id = ${organizationId}`);
  const keys = new Set(await listKeys(`orgs/${organizationId}/`));
  const brokenFiles: string[] = [];
  for (const u of uploads.rows) {
    if (!keys.has(u.object_key)) brokenFiles.push(`${u.object_key} (missing)`);
    else if (sha256(await getObjectBytes(u.object_key)) !== u.sha256) brokenFiles.push(`${u.object_key} (changed)`);
  }
  const referenced = new Set(uploads.rows.map((u) => u.object_key));
  return {
    tests: tests.rows.length,
    halfWritten: tests.rows.filter((t) => t.uploads === 0 || !t.analysis).map((t) => t.id),
    brokenFiles,
    orphanObjects: [...keys].filter((k) => !referenced.has(k)),
  };
}
