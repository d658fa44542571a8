"use client";

import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Alert, Button, Card, LinkButton, Select } from "@/components/ui";
import { apiFetch } from "@/lib/client/api";

interface CollectionItem {
  id: string;
  title?: string;
  name?: string;
}

/** On every test page for a trainer: add this curve to a casebook collection, or compare it with others. */
export function TrainerShortcuts({ testId, title }: { testId: string; title: string }) {
  const q = useQuery({ queryKey: ["casebook-collections"], queryFn: ({ signal }) => apiFetch<{ collections: CollectionItem[] }>("/api/casebook", {}, { signal }) });
  const [collectionId, setCollectionId] = useState("");
  const [state, setState] = useState<"idle" | "busy" | "done">("idle");
  const [error, setError] = useState<string | null>(null);
  const collections = q.data?.collections ?? [];
  const chosen = collectionId || collections[0]?.id || "";
  return (
    <Card title="For the casebook" data-testid="trainer-shortcuts">
      <div className="flex flex-wrap items-end gap-2">
        {collections.length > 0 ? (
          <>
            <Select label="Collection" value={chosen} onChange={(e) => setCollectionId(e.target.value)} options={collections.map((c) => ({ value: c.id, label: c.title ?? c.name ?? "Collection" }))} />
            <Button
              busy={state === "busy"}
              onClick={async () => {
                setState("busy");
                setError(null);
                try {
                  await apiFetch(`/api/casebook/${chosen}/entries`, { method: "POST", body: JSON.stringify({ testId, title, notes: null }) });
                  setState("done");
                } catch (err) {
                  setError((err as Error).message);
                  setState("idle");
                }
              }}
            >
              Add to casebook
            </Button>
          </>
        ) : (
          <LinkButton href="/casebook" variant="secondary">Start a casebook collection</LinkButton>
        )}
        <LinkButton href={`/compare?tests=${testId}`} variant="secondary">Compare with…</LinkButton>
      </div>
      {state === "done" && <p role="status" className="mt-2 text-body">Added to the collection.</p>}
      {error && <Alert tone="error" className="mt-2">{error}</Alert>}
    </Card>
  );
}
