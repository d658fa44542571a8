/**
 * Idempotency-Key handling as the IETF httpapi draft "The Idempotency-Key HTTP Header Field"
 * (draft-ietf-httpapi-idempotency-key-header) describes it:
 *
 *  - §2.2 uniqueness: a key is scoped to the person who sent it (organization, user, key), so one
 *    technician's key never answers with another's test;
 *  - §2.4 fingerprint: the server stores a fingerprint of the request with the key; the same key
 *    with a different request is refused with 422 (§2.7), never answered with the first result;
 *  - §2.6 a retry of the same request with the same key answers with the first request's result.
 *
 * The fingerprint is taken over what the request means (the route, the file's SHA-256 and name,
 * the parsed fields), not its bytes: a browser frames the same form with a new multipart boundary
 * on every retry.
 */
import { createHash } from "node:crypto";
import { AppError } from "@/lib/errors";

/** JSON with object keys sorted and undefined left out, so equal meanings give equal text (JSON.stringify walks it, not our own recursion). */
export function canonicalJson(value: unknown): string {
  const sorted = (_key: string, v: unknown) =>
    v && typeof v === "object" && !Array.isArray(v)
      ? Object.fromEntries(Object.entries(v as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)))
      : v;
  return JSON.stringify(value, sorted) ?? "null";
}

/** The SHA-256 (hex) of a request's route and meaning. */
export function requestFingerprint(route: string, parts: Record<string, unknown>): string {
  return createHash("sha256").update(canonicalJson({ route, ...parts })).digest("hex");
}

/** A key as stored: what it produced and the fingerprint of the request that spent it. */
export interface SpentKey {
  testId: string;
  analysisId: string | null;
  requestFingerprint: string | null;
}

/** 422 idempotency_mismatch unless a spent key came with this same request (keys stored before fingerprints pass). */
export function assertSameRequest(spent: SpentKey, fingerprint: string): void {
  if (spent.requestFingerprint !== null && spent.requestFingerprint !== fingerprint)
    throw new AppError(
      "idempotency_mismatch",
      "Idempotency-Key: you already used this key for a different request (another file, other fields or another address). Nothing was saved; send a new key for a new request.",
      { field: "Idempotency-Key" },
    );
}
