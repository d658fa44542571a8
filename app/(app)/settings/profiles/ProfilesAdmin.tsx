"use client";

import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { Alert, Badge, Button, Card, Input, Spinner } from "@/components/ui";
import { apiFetch } from "@/lib/client/api";
import { ProfileRecheck } from "./ProfileRecheck";

interface Profile {
  id: string | null;
  name: string;
  targetMicrons: number;
  holdMinutes: number;
  limitMicrons: number;
  leakRateMicronsPerMinute: number;
  isDefault: boolean;
}
type Draft = { name: string; targetMicrons: string; holdMinutes: string; limitMicrons: string; leakRateMicronsPerMinute: string; makeDefault: boolean };

const EMPTY: Draft = { name: "", targetMicrons: "500", holdMinutes: "10", limitMicrons: "1000", leakRateMicronsPerMinute: "20", makeDefault: false };
const toDraft = (p: Profile): Draft => ({ name: p.name, targetMicrons: String(p.targetMicrons), holdMinutes: String(p.holdMinutes), limitMicrons: String(p.limitMicrons), leakRateMicronsPerMinute: String(p.leakRateMicronsPerMinute), makeDefault: p.isDefault });
const toBody = (d: Draft) => JSON.stringify({ name: d.name, targetMicrons: Number(d.targetMicrons), holdMinutes: Number(d.holdMinutes), limitMicrons: Number(d.limitMicrons), leakRateMicronsPerMinute: Number(d.leakRateMicronsPerMinute), makeDefault: d.makeDefault });

function ProfileForm({ initial, submitLabel, onSubmit, busy, error, onCancel }: { initial: Draft; submitLabel: string; onSubmit: (d: Draft) => void; busy: boolean; error: Error | null; onCancel?: () => void }) {
  const [d, setD] = useState(initial);
  const set = (k: keyof Draft) => (e: React.ChangeEvent<HTMLInputElement>) => setD({ ...d, [k]: k === "makeDefault" ? e.target.checked : e.target.value });
  return (
    <form className="grid gap-3 sm:grid-cols-2" onSubmit={(e) => { e.preventDefault(); onSubmit(d); }}>
      <Input label="Name" value={d.name} onChange={set("name")} required maxLength={120} className="sm:col-span-2" />
      <Input label="Isolate at or below (microns)" inputMode="decimal" value={d.targetMicrons} onChange={set("targetMicrons")} required />
      <Input label="Hold at least (minutes)" inputMode="decimal" value={d.holdMinutes} onChange={set("holdMinutes")} required />
      <Input label="Stay at or below (microns)" inputMode="decimal" value={d.limitMicrons} onChange={set("limitMicrons")} required />
      <Input label="Leak if climbing at (microns/min)" inputMode="decimal" value={d.leakRateMicronsPerMinute} onChange={set("leakRateMicronsPerMinute")} required />
      <label className="flex min-h-tap items-center gap-2 text-body sm:col-span-2">
        <input type="checkbox" className="h-5 w-5" checked={d.makeDefault} onChange={set("makeDefault")} /> The shop&apos;s default
      </label>
      <div className="flex gap-2 sm:col-span-2">
        <Button type="submit" busy={busy}>{submitLabel}</Button>
        {onCancel && <Button variant="quiet" onClick={onCancel}>Cancel</Button>}
      </div>
      {error && <Alert tone="error" className="sm:col-span-2">{error.message}</Alert>}
    </form>
  );
}

export function ProfilesAdmin() {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ["settings-profiles"], queryFn: ({ signal }) => apiFetch<{ items: Profile[] }>("/api/settings/profiles", {}, { signal }) });
  const [editing, setEditing] = useState<string | null>(null);
  /** A profile's name before this page renamed it, so its re-check still finds the tests judged by the old name. */
  const [renamedFrom, setRenamedFrom] = useState<Record<string, string>>({});
  const refresh = () => void qc.invalidateQueries({ queryKey: ["settings-profiles"] });
  const create = useMutation({ mutationFn: (d: Draft) => apiFetch("/api/settings/profiles", { method: "POST", body: toBody(d) }), onSuccess: refresh });
  const update = useMutation({
    mutationFn: ({ id, d }: { id: string; d: Draft; before: string }) => apiFetch(`/api/settings/profiles/${id}`, { method: "PUT", body: toBody(d) }),
    onSuccess: (_r, { id, d, before }) => {
      if (d.name !== before) setRenamedFrom((m) => ({ ...m, [id]: m[id] ?? before }));
      setEditing(null);
      refresh();
    },
  });
  const makeDefault = useMutation({ mutationFn: (id: string) => apiFetch(`/api/settings/profiles/${id}/default`, { method: "POST" }), onSuccess: refresh });
  const remove = useMutation({ mutationFn: (id: string) => apiFetch(`/api/settings/profiles/${id}`, { method: "DELETE" }), onSuccess: refresh });

  if (q.isPending) return <Spinner label="Loading profiles" />;
  if (q.isError) return <Alert tone="error">{(q.error as Error).message}</Alert>;
  // A new profile starts from the shop's standard (its default profile), not from fixed numbers.
  const standard = q.data.items.find((p) => p.isDefault);
  const shopStandard: Draft = standard ? { ...toDraft(standard), name: "", makeDefault: false } : EMPTY;
  return (
    <div className="space-y-4">
      <ul className="space-y-3">
        {q.data.items.map((p) => (
          <li key={p.id ?? "built-in"}>
            <Card title={p.name} headingLevel={3} actions={p.isDefault ? <Badge tone="brand">Default</Badge> : undefined}>
              {editing === p.id && p.id ? (
                <ProfileForm initial={toDraft(p)} submitLabel="Save" busy={update.isPending} error={update.error as Error | null} onSubmit={(d) => update.mutate({ id: p.id!, d, before: p.name })} onCancel={() => setEditing(null)} />
              ) : (
                <>
                  <p className="text-body">
                    Isolate at or below {p.targetMicrons} microns, hold {p.holdMinutes} min, stay at or below {p.limitMicrons} microns; a steady climb of {p.leakRateMicronsPerMinute} microns/min or more is a leak.
                  </p>
                  {p.id ? (
                    <div className="mt-3 flex flex-wrap gap-2">
                      <Button variant="secondary" onClick={() => setEditing(p.id)}>Edit</Button>
                      {!p.isDefault && <Button variant="quiet" onClick={() => makeDefault.mutate(p.id!)} busy={makeDefault.isPending && makeDefault.variables === p.id}>Make default</Button>}
                      {!p.isDefault && <Button variant="quiet" onClick={() => remove.mutate(p.id!)} busy={remove.isPending && remove.variables === p.id}>Delete</Button>}
                    </div>
                  ) : null}
                  {p.id ? (
                    <ProfileRecheck profileId={p.id} previousName={renamedFrom[p.id]} />
                  ) : (
                    <p className="mt-2 text-caption text-fg-soft">Built in (common practice, no published source). Add a profile below to set your own.</p>
                  )}
                </>
              )}
            </Card>
          </li>
        ))}
      </ul>
      {(makeDefault.isError || remove.isError) && <Alert tone="error">{((makeDefault.error ?? remove.error) as Error).message}</Alert>}
      <Card title="New profile" headingLevel={3}>
        <ProfileForm key={`${create.isSuccess ? `done-${create.submittedAt}` : "new"}-${standard?.id ?? "built-in"}`} initial={shopStandard} submitLabel="Add profile" busy={create.isPending} error={create.error as Error | null} onSubmit={(d) => create.mutate(d)} />
      </Card>
    </div>
  );
}
