"use client";

import { useState } from "react";
import { useRouter } from "next/navigation";
import { Alert, Button, Card, Select } from "@/components/ui";
import { apiFetch } from "@/lib/client/api";

/** "This site is a duplicate of…": its tests, jobs and systems move to the site kept, then it is removed. */
export function MergeSite({ siteId, siteName, others }: { siteId: string; siteName: string; others: { id: string; name: string; detail: string | null }[] }) {
  const router = useRouter();
  const [intoId, setIntoId] = useState("");
  const [sure, setSure] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (others.length === 0) return null;
  const into = others.find((o) => o.id === intoId);
  return (
    <Card title="Duplicate of another site?" headingLevel={3} data-testid="merge-site">
      <form
        className="space-y-3"
        onSubmit={async (e) => {
          e.preventDefault();
          if (!intoId) return setError("Choose the site to keep.");
          setBusy(true);
          setError(null);
          try {
            await apiFetch("/api/records/merge", { method: "POST", body: JSON.stringify({ kind: "site", fromId: siteId, intoId }) });
            router.push(`/records/sites/${intoId}`);
          } catch (err) {
            setError((err as Error).message);
            setBusy(false);
          }
        }}
      >
        <Select
          label="Keep this site instead"
          value={intoId}
          onChange={(e) => {
            setIntoId(e.target.value);
            setSure(false);
          }}
          options={[{ value: "", label: "Choose…" }, ...others.map((o) => ({ value: o.id, label: o.detail ? `${o.name} · ${o.detail}` : o.name }))]}
        />
        {into && (
          <label className="flex min-h-tap items-start gap-2 text-body">
            <input type="checkbox" className="mt-1 h-5 w-5" checked={sure} onChange={(e) => setSure(e.target.checked)} />
            Move every test, job and system of “{siteName}” to “{into.name}” and remove “{siteName}”.
          </label>
        )}
        <Button type="submit" variant="attention" busy={busy} disabled={!into || !sure}>
          Merge into the site kept
        </Button>
        {error && <Alert tone="error">{error}</Alert>}
      </form>
    </Card>
  );
}
