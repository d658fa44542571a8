"use client";

import { useState } from "react";
import { Alert, Button, Card } from "@/components/ui";
import type { MailKind } from "@/db/schema";
import { apiFetch } from "@/lib/client/api";
import { MAIL_KIND_WORDS } from "@/lib/notify/kind-words";

/** The person's own mail: one box per kind, ticked = sent. */
export function MyMail({ kinds, off }: { kinds: readonly MailKind[]; off: MailKind[] }) {
  const [wanted, setWanted] = useState<Set<MailKind>>(new Set(kinds.filter((k) => !off.includes(k))));
  const [busy, setBusy] = useState(false);
  const [note, setNote] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  return (
    <Card title="Mail you receive" data-testid="my-mail">
      <form
        className="flex flex-col gap-3"
        onSubmit={async (e) => {
          e.preventDefault();
          setBusy(true);
          setNote(null);
          try {
            await apiFetch("/api/settings/my-mail", { method: "PUT", body: JSON.stringify({ off: kinds.filter((k) => !wanted.has(k)) }) });
            setNote({ tone: "success", text: "Saved." });
          } catch (err) {
            setNote({ tone: "error", text: (err as Error).message });
          } finally {
            setBusy(false);
          }
        }}
      >
        {kinds.map((k) => (
          <label key={k} className="flex items-start gap-3 text-body">
            <input
              type="checkbox"
              className="mt-1 h-6 w-6 accent-tide-600"
              checked={wanted.has(k)}
              onChange={(e) => {
                const next = new Set(wanted);
                if (e.target.checked) next.add(k);
                else next.delete(k);
                setWanted(next);
              }}
            />
            <span>
              <span className="font-medium text-fg">{MAIL_KIND_WORDS[k].label}</span>
              <span className="block text-fg-soft">{MAIL_KIND_WORDS[k].hint}</span>
            </span>
          </label>
        ))}
        <p className="text-caption text-fg-soft">Password resets and invitations are always sent.</p>
        <div>
          <Button type="submit" busy={busy}>Save my mail settings</Button>
        </div>
        {note && <Alert tone={note.tone}>{note.text}</Alert>}
      </form>
    </Card>
  );
}
