/**
 * The unsubscribe link of every non-essential mail (RFC 8058 one-click, RFC 2369 List-Unsubscribe).
 * No session: the signed token (lib/notify/unsubscribe.ts) is the only proof, and it only turns
 * one kind of mail off for one person in one shop. GET shows a confirmation page and changes
 * nothing; POST (a mail client's one-click, or the page's button) records the preference.
 */
import { z } from "zod";
import { db } from "@/db/client";
import { addMailOptOut } from "@/db/queries/mail-settings";
import { publicRoute } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { MAIL_KIND_WORDS, readUnsubscribeToken, type UnsubscribeClaim } from "@/lib/notify/unsubscribe";

export const dynamic = "force-dynamic";

const query = z.object({ token: z.string().max(2000).optional() });

function claimOf(token: string | undefined): UnsubscribeClaim {
  const claim = readUnsubscribeToken(token);
  if (!claim) throw new AppError("forbidden", "This unsubscribe link is not valid: it was changed or is incomplete. Use the link in the mail, or turn mail off under Settings → My mail.");
  return claim;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

function page(title: string, body: string): Response {
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><meta name="robots" content="noindex"><title>${escapeHtml(title)}</title></head>
<body style="font-family:'IBM Plex Sans',Arial,sans-serif;max-width:32rem;margin:3rem auto;padding:0 1rem;color:#14232b;line-height:1.5"><h1 style="font-size:1.4rem">${escapeHtml(title)}</h1>${body}</body></html>`;
  return new Response(html, { status: 200, headers: { "content-type": "text/html; charset=utf-8", "cache-control": "no-store", "referrer-policy": "no-referrer" } });
}

/** GET: what the link would turn off, and a button; nothing changes. */
export const GET = publicRoute({ query }, async ({ query }) => {
  const { kind } = claimOf(query.token);
  const words = MAIL_KIND_WORDS[kind];
  return page(
    `Stop "${words.label}" mail?`,
    `<p>${escapeHtml(words.hint)}</p><p>Riseline will no longer send you this kind of mail from this shop. Password resets and invitations are always sent. You can turn it back on under Settings → My mail.</p>
<form method="post"><input type="hidden" name="List-Unsubscribe" value="One-Click"><button type="submit" style="padding:12px 18px;background:#0b6e69;color:#fff;border:0;border-radius:8px;font-size:1rem">Stop this mail</button></form>`,
  );
});

/** POST: the one-click unsubscribe (RFC 8058 §3.1: body "List-Unsubscribe=One-Click"); 200 and the preference recorded. */
export const POST = publicRoute({ query, accepts: ["form", "multipart"] }, async ({ query }) => {
  const claim = claimOf(query.token);
  const member = await addMailOptOut(db(), claim);
  const words = MAIL_KIND_WORDS[claim.kind];
  return page(
    "Unsubscribed",
    member
      ? `<p>You will no longer receive "${escapeHtml(words.label)}" mail from this shop. Turn it back on under Settings → My mail.</p>`
      : `<p>You are no longer a member of this shop, so Riseline sends you none of its mail.</p>`,
  );
});
