/** Requests and storage checks for the tests API integration tests (real DB, real S3 fake). */
import { readFileSync } from "node:fs";
import path from "node:path";
import { createHash } from "node:crypto";
import { ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { env } from "@/lib/env";
import { appRequest, type TestMember } from "./members";

export const SAMPLES_DIR = path.resolve(import.meta.dirname, "../../fixtures/samples");

export function sampleText(name: string): string {
  return readFileSync(path.join(SAMPLES_DIR, name), "utf8");
}

export function sha256(bytes: Uint8Array | string): string {
  return createHash("sha256").update(bytes).digest("hex");
}

/** A multipart POST with one file and string fields. */
export function uploadRequest(
  urlPath: string,
  opts: { as?: TestMember | null; file?: { body: string | Uint8Array; name: string; type?: string }; fields?: Record<string, string>; headers?: Record<string, string> },
): Request {
  const form = new FormData();
  if (opts.file) {
    const body = typeof opts.file.body === "string" ? new TextEncoder().encode(opts.file.body) : opts.file.body;
    form.set("file", new File([body as Uint8Array<ArrayBuffer>], opts.file.name, { type: opts.file.type ?? "text/csv" }));
  }
  for (const [k, v] of Object.entries(opts.fields ?? {})) form.set(k, v);
  return appRequest(urlPath, { method: "POST", body: form, headers: opts.headers, as: opts.as });
}

export function jsonRequest(urlPath: string, body: unknown, as: TestMember | null, headers: Record<string, string> = {}): Request {
  return appRequest(urlPath, { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json", ...headers }, as });
}

let s3: S3Client | null = null;
/** Keys under a prefix in the S3 fake, read directly (not through the app). */
export async function listKeys(prefix: string): Promise<string[]> {
  const e = env();
  s3 ??= new S3Client({
    region: e.S3_REGION,
    endpoint: e.S3_ENDPOINT,
    forcePathStyle: true,
    credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
  });
  const out = await s3.send(new ListObjectsV2Command({ Bucket: e.S3_BUCKET, Prefix: prefix }));
  return (out.Contents ?? []).map((c) => c.Key!).filter(Boolean);
}

/** Row counts of the tests tables for one organization. */
export async function countRows(organizationId: string) {
  const q = async (table: string) => {
    const r = await db().execute<{ n: number }>(sql.raw(`select count(*)::int as n from ${table} where organization_id = '${organizationId.replace(/'/g, "")}'`));
    return r.rows[0].n;
  };
  return {
    tests: await q("vacuum_tests"),
    uploads: await q("uploads"),
    analyses: await q("analyses"),
    findings: await q("findings"),
    idempotencyKeys: await q("idempotency_keys"),
    sites: await q("sites"),
  };
}
