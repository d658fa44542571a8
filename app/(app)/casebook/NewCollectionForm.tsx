"use client";

import { useState } from "react";
import { useRouter } from "next/navigation";
import { Alert, Button, Card, Input } from "@/components/ui";
import { sendJson } from "./send";

/** A trainer starts a collection; the page refreshes to show it. */
export function NewCollectionForm() {
  const router = useRouter();
  const [title, setTitle] = useState("");
  const [description, setDescription] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  return (
    <Card title="New collection" headingLevel={2}>
      <form
        className="grid gap-3 sm:grid-cols-[1fr_1fr_auto] sm:items-end"
        onSubmit={async (e) => {
          e.preventDefault();
          setBusy(true);
          setError(null);
          try {
            const { collection } = await sendJson<{ collection: { id: string } }>("POST", "/api/casebook", { title, description });
            router.push(`/casebook/${collection.id}`);
          } catch (err) {
            setError((err as Error).message);
            setBusy(false);
          }
        }}
      >
        <Input label="Title" name="title" required maxLength={200} value={title} onChange={(e) => setTitle(e.target.value)} />
        <Input label="What it teaches (optional)" name="description" maxLength={4000} value={description} onChange={(e) => setDescription(e.target.value)} />
        <Button type="submit" busy={busy}>Create collection</Button>
      </form>
      {error && <Alert tone="error" className="mt-3">{error}</Alert>}
    </Card>
  );
}
