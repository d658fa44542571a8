/**
 * The key in an invitation link. An invitation is accepted only from a verified address; the
 * link was mailed to that address alone, so opening it with its key proves the person reads that
 * mailbox — the same proof a verification e-mail gives, without a second message. The key is an
 * HMAC-SHA-256 (RFC 2104) of the invitation id and the invited address under the app's secret:
 * the invitation id on its own (which better-auth lists to anyone signed in under that address)
 * is not enough. OWASP ASVS 4.0.3 V2.5 (credential recovery and verification by a secret sent
 * to the registered channel).
 */
import { createHmac, timingSafeEqual } from "node:crypto";
import { env } from "@/lib/env";

export function invitationKey(invitationId: string, email: string): string {
  return createHmac("sha256", env().BETTER_AUTH_SECRET).update(`riseline-invitation:${invitationId}:${email.trim().toLowerCase()}`).digest("base64url");
}

export function isInvitationKey(invitationId: string, email: string, key: string): boolean {
  const want = Buffer.from(invitationKey(invitationId, email));
  const got = Buffer.from(key);
  return got.length === want.length && timingSafeEqual(got, want);
}

/** The link the invitation e-mail carries. */
export function invitationLink(invitationId: string, email: string): string {
  return `${env().BETTER_AUTH_URL}/invite/${encodeURIComponent(invitationId)}?key=${invitationKey(invitationId, email)}`;
}
