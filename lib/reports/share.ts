/**
 * Read-only share links to one test's report. The token is 32 random bytes (256 bits) in
 * base64url; only its SHA-256 is stored, so a database reader cannot rebuild a link.
 */
import { createHash, randomBytes } from "node:crypto";
import type { Db } from "@/db/client";
import { getShareLinkByTokenHash, insertShareLink } from "@/db/queries/share-links";
import { insertTestEvent } from "@/db/queries/review";
import { env } from "@/lib/env";

export function hashShareToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

export function shareUrl(token: string): string {
  return new URL(`/share/${token}`, env().BETTER_AUTH_URL).toString();
}

/** Create a link (in the caller's transaction) and record it in the audit trail. The token is returned once. */
export async function createShareLink(
  db: Db,
  params: { organizationId: string; testId: string; actorId: string; expiresInDays: number; now?: Date },
) {
  const now = params.now ?? new Date();
  const token = randomBytes(32).toString("base64url");
  const expiresAt = new Date(now.getTime() + params.expiresInDays * 86_400_000);
  const link = await insertShareLink(db, { organizationId: params.organizationId, testId: params.testId, tokenHash: hashShareToken(token), expiresAt, createdById: params.actorId });
  await insertTestEvent(db, {
    organizationId: params.organizationId, testId: params.testId, actorId: params.actorId, kind: "share_link_created",
    note: `Read-only link, expires ${expiresAt.toISOString().slice(0, 10)}.`,
  });
  return { ...link, token, url: shareUrl(token) };
}

export type ShareResolution =
  | { status: "ok"; organizationId: string; testId: string; expiresAt: Date }
  | { status: "expired"; expiresAt: Date }
  | { status: "revoked"; revokedAt: Date }
  | { status: "unknown" };

/** What a token opens at `now`. A malformed token is simply unknown. */
export async function resolveShareToken(db: Db, params: { token: string; now?: Date }): Promise<ShareResolution> {
  if (!/^[A-Za-z0-9_-]{43}$/.test(params.token)) return { status: "unknown" };
  const link = await getShareLinkByTokenHash(db, { tokenHash: hashShareToken(params.token) });
  if (!link) return { status: "unknown" };
  if (link.revokedAt) return { status: "revoked", revokedAt: link.revokedAt };
  const now = params.now ?? new Date();
  if (link.expiresAt.getTime() <= now.getTime()) return { status: "expired", expiresAt: link.expiresAt };
  return { status: "ok", organizationId: link.organizationId, testId: link.testId, expiresAt: link.expiresAt };
}
