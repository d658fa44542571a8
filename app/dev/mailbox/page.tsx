import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Wordmark } from "@/components/shell/Mark";
import { Badge, Card, EmptyState, ThemeToggle } from "@/components/ui";
import { env, isLocalMode } from "@/lib/env";
import { readCaughtMessages, splitLinks } from "./read-mailbox";

export const metadata: Metadata = { title: "Dev mailbox" };
export const dynamic = "force-dynamic";

const when = new Intl.DateTimeFormat("en", { dateStyle: "medium", timeStyle: "medium" });

/** The local SMTP catcher's messages, for trying invitations and resets without real e-mail. */
export default async function MailboxPage({ searchParams }: { searchParams: Promise<{ id?: string }> }) {
  if (!isLocalMode()) notFound();
  const { id } = await searchParams;
  const messages = readCaughtMessages(env().MAILBOX_DIR);
  const open = messages.find((m) => m.id === id) ?? null;

  return (
    <div className="min-h-dvh">
      <header className="flex items-center justify-between gap-3 border-b border-surface-line bg-surface-raised px-4 py-2">
        <span className="flex items-center gap-3">
          <Wordmark size={28} />
          <Badge tone="attention">Dev mailbox</Badge>
        </span>
        <ThemeToggle showLabel={false} />
      </header>
      <main className="mx-auto grid w-full max-w-6xl gap-5 px-4 py-5 lg:grid-cols-[22rem_1fr]">
        <div className="flex flex-col gap-3">
          <h1 className="text-title text-fg">Caught e-mail ({messages.length})</h1>
          <p className="text-caption text-fg-soft">Only on local and demo installs. Nothing here left this machine.</p>
          {messages.length === 0 ? (
            <EmptyState title="No mail yet">Invite someone or ask for a password reset, then reload.</EmptyState>
          ) : (
            <ul data-testid="mail-list" className="flex flex-col gap-2">
              {messages.map((m) => (
                <li key={m.id}>
                  <Link
                    href={`/dev/mailbox?id=${encodeURIComponent(m.id)}`}
                    aria-current={m.id === open?.id ? "true" : undefined}
                    className={"block min-h-tap rounded-xl border px-3 py-2 " + (m.id === open?.id ? "border-tide-600 bg-tide-50 dark:bg-tide-900" : "border-surface-line bg-surface-raised hover:border-tide-400")}
                  >
                    <span className="block truncate font-medium text-fg">{m.subject}</span>
                    <span className="block truncate text-caption text-fg-soft">
                      to {m.to.join(", ")} · {m.receivedAt ? when.format(new Date(m.receivedAt)) : "time unknown"}
                    </span>
                  </Link>
                </li>
              ))}
            </ul>
          )}
        </div>
        <div className="order-first lg:order-none">
          {open ? (
            <Card title={open.subject} data-testid="mail-message">
              <dl className="grid grid-cols-[4rem_1fr] gap-x-2 gap-y-1 text-caption">
                <dt className="text-fg-soft">From</dt>
                <dd className="break-all text-fg">{open.from}</dd>
                <dt className="text-fg-soft">To</dt>
                <dd className="break-all text-fg">{open.to.join(", ")}</dd>
                <dt className="text-fg-soft">Received</dt>
                <dd className="text-fg">{open.receivedAt ? when.format(new Date(open.receivedAt)) : "unknown"}</dd>
              </dl>
              <div className="mt-4 whitespace-pre-wrap break-words text-body text-fg">
                {splitLinks(open.text).map((p, i) =>
                  p.href ? (
                    <a key={i} href={p.href} className="font-medium text-tide-700 underline underline-offset-4 dark:text-tide-300">
                      {p.text}
                    </a>
                  ) : (
                    <span key={i}>{p.text}</span>
                  ),
                )}
              </div>
              {open.html && (
                <details className="mt-4">
                  <summary className="min-h-tap cursor-pointer py-3 text-body font-medium text-fg">As the HTML version looks</summary>
                  <iframe title="HTML version" sandbox="allow-popups allow-popups-to-escape-sandbox" srcDoc={`<base target="_blank">${open.html}`} className="h-96 w-full rounded-xl border border-surface-line bg-white" />
                </details>
              )}
            </Card>
          ) : (
            messages.length > 0 && <p className="hidden text-body text-fg-soft lg:block">Choose a message to read it.</p>
          )}
        </div>
      </main>
    </div>
  );
}
