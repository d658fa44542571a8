/**
 * The unsubscribe link of every non-essential mail (RFC 8058 one-click, RFC 2369 List-Unsubscribe).
 * No session: the signed token (lib/notify/unsubscribe.ts) is the only proof, and it only turns
 * one kind of mail off for one person in one shop. GET leads to the confirmation page
 * (app/mail/unsubscribe/page.tsx) and changes nothing; POST (a mail client's one-click, or the page's button) records the preference.
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

/** POST's answer: a few plain words (a mail client ignores them; a browser without script shows them). */
function answerPage(title: string, words: string): Response {
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${escapeHtml(title)}</title></head><body><h1>${escapeHtml(title)}</h1><p>${escapeHtml(words)}</p></body></html>`;
  return new Response(html, { status: 200, headers: { "content-type": "text/html; charset=utf-8", "cache-control": "no-store" } });
}

/** GET: to the confirmation page (app/mail/unsubscribe), which has the button; nothing changes. */
export const GET = publicRoute({ query }, async ({ req, query }) => {
  claimOf(query.token);
  const page = new URL("/mail/unsubscribe", req.url);
  page.searchParams.set("token", query.token!);
  return new Response(null, { status: 303, headers: { location: page.pathname + page.search, "cache-control": "no-store" } });
});

/** POST: the one-click unsubscribe (RFC 8058 §3.1: body "List-Unsubscribe=One-Click"); 200 and the preference recorded. */
export const POST = publicRoute({ query, accepts: ["form", "multipart"] }, async ({ query }) => {
  const claim = claimOf(query.token);
  const member = await addMailOptOut(db(), claim);
  const label = MAIL_KIND_WORDS[claim.kind].label;
  return member
    ? answerPage("Unsubscribed", `You will no longer receive "${label}" mail from this shop. Turn it back on under Settings, My mail.`)
    : answerPage("Unsubscribed", "You are no longer a member of this shop, so Riseline sends you none of its mail.");
});
