"use client";

import { useState } from "react";
import { useRouter } from "next/navigation";
import { Alert, Button, Input, Select, Textarea } from "@/components/ui";
import { sendJson } from "../send";
import { pickerLabel, type RecentTest } from "./picker";

export type { RecentTest } from "./picker";

/** A trainer adds one of the shop's tests with a title and notes. */
export function AddEntryForm({ collectionId, recentTests }: { collectionId: string; recentTests: RecentTest[] }) {
  const router = useRouter();
  const [testId, setTestId] = useState(recentTests[0]?.id ?? "");
  const [title, setTitle] = useState("");
  const [notes, setNotes] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [search, setSearch] = useState("");
  const words = search.trim().toLowerCase().split(/\s+/).filter(Boolean);
  const shown = recentTests.filter((t) => words.every((w) => pickerLabel(t).toLowerCase().includes(w)));
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
      <Input
        label="Find by site, technician, date or verdict"
        type="search"
        value={search}
        onChange={(e) => {
          setSearch(e.target.value);
          const w = e.target.value.trim().toLowerCase().split(/\s+/).filter(Boolean);
          const first = recentTests.find((t) => w.every((x) => pickerLabel(t).toLowerCase().includes(x)));
          if (first) setTestId(first.id);
        }}
        hint="Words from the line below; newest first."
      />
      <Select label="Test" value={testId} onChange={(e) => setTestId(e.target.value)} options={(shown.length ? shown : recentTests).map((t) => ({ value: t.id, label: pickerLabel(t) }))} />
      <Input label="Title for the casebook" value={title} onChange={(e) => setTitle(e.target.value)} required maxLength={200} hint="Say what it teaches, not whose job it was." />
      <Textarea label="Notes" value={notes} onChange={(e) => setNotes(e.target.value)} rows={3} maxLength={4000} />
      <Button type="submit" busy={busy}>Add to collection</Button>
      {error && <Alert tone="error">{error}</Alert>}
    </form>
  );
}
