/**
 * Unsubscribe links (RFC 8058 one-click, RFC 2369 List-Unsubscribe). The token names the person,
 * the shop and the kind of mail, signed with HMAC-SHA256 under BETTER_AUTH_SECRET; it needs no
 * session, and a forged or altered one is refused. It never expires (a link in an old mail still
 * works) and grants nothing but turning that one kind of mail off.
 */
import { createHmac, timingSafeEqual } from "node:crypto";
import { MAIL_KINDS, type MailKind } from "@/db/schema";
import { env } from "@/lib/env";

export { MAIL_KIND_WORDS } from "./kind-words";

export interface UnsubscribeClaim {
  userId: string;
  organizationId: string;
  kind: MailKind;
}

const sign = (payload: string) => createHmac("sha256", `riseline-unsubscribe:${env().BETTER_AUTH_SECRET}`).update(payload).digest("base64url");

export function unsubscribeToken(c: UnsubscribeClaim): string {
  const payload = Buffer.from(JSON.stringify([c.userId, c.organizationId, c.kind])).toString("base64url");
  return `${payload}.${sign(payload)}`;
}

/** The claim of a well-signed token, or null (malformed, forged or altered). */
export function readUnsubscribeToken(token: string | null | undefined): UnsubscribeClaim | null {
  const [payload, mac, extra] = (token ?? "").split(".");
  if (!payload || !mac || extra !== undefined) return null;
  const want = Buffer.from(sign(payload));
  const got = Buffer.from(mac);
  if (got.length !== want.length || !timingSafeEqual(got, want)) return null;
  try {
    const [userId, organizationId, kind] = JSON.parse(Buffer.from(payload, "base64url").toString("utf8")) as unknown[];
    if (typeof userId !== "string" || typeof organizationId !== "string" || !MAIL_KINDS.includes(kind as MailKind)) return null;
    return { userId, organizationId, kind: kind as MailKind };
  } catch {
    return null;
  }
}

export function unsubscribeUrl(c: UnsubscribeClaim): string {
  const url = new URL("/api/mail/unsubscribe", env().BETTER_AUTH_URL);
  url.searchParams.set("token", unsubscribeToken(c));
  return url.toString();
}

/** The two headers of a non-essential mail: RFC 2369 §3.2 List-Unsubscribe, RFC 8058 §3.1 List-Unsubscribe-Post. */
export function unsubscribeHeaders(c: UnsubscribeClaim): Record<string, string> {
  return { "List-Unsubscribe": `<${unsubscribeUrl(c)}>`, "List-Unsubscribe-Post": "List-Unsubscribe=One-Click" };
}

/** "Name <address>": the shop's sender name in front of MAIL_FROM's address (quoted by the caller's library). */
export function fromWithSenderName(senderName: string | null): string | { name: string; address: string } {
  const from = env().MAIL_FROM;
  if (!senderName) return from;
  const address = /<([^>]+)>/.exec(from)?.[1] ?? from.trim();
  return { name: senderName, address };
}
