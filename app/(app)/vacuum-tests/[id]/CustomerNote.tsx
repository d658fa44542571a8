"use client";

import { useState } from "react";
import { Alert, Button, Card, Textarea } from "@/components/ui";
import { apiFetch } from "@/lib/client/api";

/**
 * The note printed on the customer's copy of the report, kept apart from the internal notes (which
 * never leave the shop). The test's technician, the lead and the owner write it.
 */
export function CustomerNote({ testId, note, canWrite, onSaved }: { testId: string; note: string | null; canWrite: boolean; onSaved?: () => void }) {
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState(note ?? "");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (!canWrite && !note) return null;
  return (
    <Card title="Note for the customer" data-testid="customer-note">
      <p className="text-caption text-fg-soft">Printed on the report the customer and the warranty desk get. Internal notes never are.</p>
      {editing ? (
        <form
          className="mt-2 space-y-2"
          onSubmit={async (e) => {
            e.preventDefault();
            setBusy(true);
            setError(null);
            try {
              await apiFetch(`/api/vacuum-tests/${testId}`, { method: "PATCH", body: JSON.stringify({ customerNote: text }) });
              setEditing(false);
              onSaved?.();
            } catch (err) {
              setError((err as Error).message);
            } finally {
              setBusy(false);
            }
          }}
        >
          <Textarea label="Note for the customer" rows={3} maxLength={2000} value={text} onChange={(e) => setText(e.target.value)} />
          <div className="flex gap-2">
            <Button type="submit" busy={busy}>Save the note</Button>
            <Button variant="quiet" onClick={() => setEditing(false)}>Cancel</Button>
          </div>
        </form>
      ) : (
        <>
          <p className="mt-2 whitespace-pre-line text-body" data-testid="customer-note-text">{note || "No note for the customer yet."}</p>
          {canWrite && (
            <Button variant="secondary" className="mt-2" onClick={() => { setText(note ?? ""); setEditing(true); }}>
              {note ? "Edit the note" : "Write a note for the customer"}
            </Button>
          )}
        </>
      )}
      {error && <Alert tone="error">{error}</Alert>}
    </Card>
  );
}
