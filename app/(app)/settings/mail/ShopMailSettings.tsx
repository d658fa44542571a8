"use client";

import { useState } from "react";
import { Alert, Button, Card, Input } from "@/components/ui";
import { apiFetch } from "@/lib/client/api";

export interface MailMember {
  userId: string;
  name: string;
  roleLabel: string;
}

/** The owner's mail settings: the From name of every mail, and who receives review requests. */
export function ShopMailSettings(props: { senderName: string | null; reviewMailTo: string[]; members: MailMember[]; address: string }) {
  const [senderName, setSenderName] = useState(props.senderName ?? "");
  const [chosen, setChosen] = useState<Set<string>>(new Set(props.reviewMailTo));
  const [everyLead, setEveryLead] = useState(props.reviewMailTo.length === 0);
  const [busy, setBusy] = useState(false);
  const [note, setNote] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  return (
    <Card title="Mail settings" data-testid="shop-mail-settings">
      <form
        className="flex flex-col gap-4"
        onSubmit={async (e) => {
          e.preventDefault();
          setBusy(true);
          setNote(null);
          try {
            const reviewMailTo = everyLead ? "leads" : [...chosen];
            await apiFetch("/api/settings/mail", { method: "PUT", body: JSON.stringify({ senderName: senderName.trim() || null, reviewMailTo }) });
            setNote({ tone: "success", text: "Saved." });
          } catch (err) {
            setNote({ tone: "error", text: (err as Error).message });
          } finally {
            setBusy(false);
          }
        }}
      >
        <Input
          label="Sender name"
          value={senderName}
          maxLength={60}
          onChange={(e) => setSenderName(e.target.value)}
          hint={`Shown as the sender of every e-mail; the address stays ${props.address}. Empty: "Riseline".`}
        />
        <fieldset className="flex flex-col gap-2">
          <legend className="text-body font-medium text-fg">Review requests go to</legend>
          <label className="flex items-center gap-3 text-body">
            <input type="radio" name="review-to" className="h-5 w-5 accent-tide-600" checked={everyLead} onChange={() => setEveryLead(true)} />
            Every lead technician (the owners when there is no lead)
          </label>
          <label className="flex items-center gap-3 text-body">
            <input type="radio" name="review-to" className="h-5 w-5 accent-tide-600" checked={!everyLead} onChange={() => setEveryLead(false)} />
            The people chosen below
          </label>
          {!everyLead && (
            <ul className="ml-8 flex flex-col gap-1">
              {props.members.map((m) => (
                <li key={m.userId}>
                  <label className="flex items-center gap-3 text-body">
                    <input
                      type="checkbox"
                      className="h-5 w-5 accent-tide-600"
                      checked={chosen.has(m.userId)}
                      onChange={(e) => {
                        const next = new Set(chosen);
                        if (e.target.checked) next.add(m.userId);
                        else next.delete(m.userId);
                        setChosen(next);
                      }}
                    />
                    {m.name} <span className="text-fg-soft">({m.roleLabel})</span>
                  </label>
                </li>
              ))}
            </ul>
          )}
          <p className="text-caption text-fg-soft">Comments go to whoever should answer them, sign-off notices to the test’s technician. Each person can turn kinds of mail off for themselves under My mail.</p>
        </fieldset>
        <div>
          <Button type="submit" busy={busy} disabled={!everyLead && chosen.size === 0}>Save mail settings</Button>
        </div>
        {note && <Alert tone={note.tone}>{note.text}</Alert>}
      </form>
    </Card>
  );
}
