"use client";

import { useState } from "react";
import { useRouter } from "next/navigation";
import { Alert, Button, Input, Select, Textarea } from "@/components/ui";
import { sendJson } from "../send";

export interface RecentTest {
  id: string;
  title: string;
  verdict: string | null;
  testedAt: string;
}

/** A trainer adds one of the shop's tests with a title and notes. */
export function AddEntryForm({ collectionId, recentTests }: { collectionId: string; recentTests: RecentTest[] }) {
  const router = useRouter();
  const [testId, setTestId] = useState(recentTests[0]?.id ?? "");
  const [title, setTitle] = useState("");
  const [notes, setNotes] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (recentTests.length === 0) return <p className="text-body text-fg-soft">The shop has no tests yet.</p>;
  return (
    <form
      className="space-y-3"
      onSubmit={async (e) => {
        e.preventDefault();
        setBusy(true);
        setError(null);
        try {
          await sendJson("POST", `/api/casebook/${collectionId}/entries`, { testId, title, notes });
          setTitle("");
          setNotes("");
          router.refresh();
        } catch (err) {
          setError((err as Error).message);
        } finally {
          setBusy(false);
        }
      }}
    >
      <Select label="Test" value={testId} onChange={(e) => setTestId(e.target.value)} options={recentTests.map((t) => ({ value: t.id, label: `${t.title} — ${new Date(t.testedAt).toLocaleDateString("en-US")}${t.verdict ? ` (${t.verdict.replace(/_/g, " ")})` : ""}` }))} />
      <Input label="Title for the casebook" value={title} onChange={(e) => setTitle(e.target.value)} required maxLength={200} hint="Say what it teaches, not whose job it was." />
      <Textarea label="Notes" value={notes} onChange={(e) => setNotes(e.target.value)} rows={3} maxLength={4000} />
      <Button type="submit" busy={busy}>Add to collection</Button>
      {error && <Alert tone="error">{error}</Alert>}
    </form>
  );
}
