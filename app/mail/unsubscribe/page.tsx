import type { Metadata } from "next";
import { MAIL_KIND_WORDS, readUnsubscribeToken } from "@/lib/notify/unsubscribe";
import { UnsubscribeButton } from "./UnsubscribeButton";

export const metadata: Metadata = { title: "Stop this mail", robots: { index: false, follow: false } };
export const dynamic = "force-dynamic";

/**
 * The page an unsubscribe link opens (no sign-in: the signed token is the proof). Showing it
 * changes nothing (RFC 8058 §3.1); the button sends the one-click POST.
 */
export default async function UnsubscribePage({ searchParams }: { searchParams: Promise<{ token?: string | string[] }> }) {
  const { token } = await searchParams;
  const value = typeof token === "string" ? token : "";
  const claim = readUnsubscribeToken(value);
  if (!claim) {
    return (
      <main className="mx-auto max-w-xl px-4 py-16">
        <h1 className="text-headline">This link is not valid</h1>
        <p className="mt-2 text-body text-fg-soft">It was changed or is incomplete. Use the link in the mail, or sign in and turn mail off under Settings, My mail.</p>
      </main>
    );
  }
  const words = MAIL_KIND_WORDS[claim.kind];
  return (
    <main className="mx-auto max-w-xl px-4 py-16">
      <h1 className="text-headline">Stop “{words.label}” mail?</h1>
      <p className="mt-2 text-body text-fg-soft">{words.hint}</p>
      <p className="mt-2 text-body text-fg-soft">
        Riseline will no longer send you this kind of mail from this shop. Password resets and invitations are always sent. You can turn it back on under Settings, My mail.
      </p>
      <UnsubscribeButton action={`/api/mail/unsubscribe?token=${encodeURIComponent(value)}`} label={words.label} />
    </main>
  );
}
