"use client";

import { useQuery } from "@tanstack/react-query";
import { Button, Input, Select } from "@/components/ui";
import { VERDICT_TEXT } from "@/components/verdict/words";
import { listMembers, listSites } from "@/lib/client/api";
import { activeCount, NO_FILTERS, type ListFilters } from "./filters";

interface Props {
  value: ListFilters;
  onChange: (next: ListFilters) => void;
  /** Leads, owners and trainers see everyone's tests and may filter by technician. */
  canSeeAll: boolean;
}

/** Verdict, technician, site, date range, practice — collapsed on a phone, open on a desktop. */
export function FilterBar({ value, onChange, canSeeAll }: Props) {
  const set = <K extends keyof ListFilters>(k: K, v: ListFilters[K]) => onChange({ ...value, [k]: v });
  const sites = useQuery({ queryKey: ["sites"], queryFn: listSites, retry: 1 });
  const members = useQuery({ queryKey: ["members"], queryFn: listMembers, enabled: canSeeAll, retry: 1 });
  const n = activeCount(value);
  return (
    <details className="group rounded-card border border-surface-line bg-surface-raised" open={n > 0 || undefined}>
      <summary className="flex min-h-tap cursor-pointer list-none items-center justify-between gap-3 px-4 py-2 text-body font-semibold">
        <span>Filters{n > 0 ? ` (${n} on)` : ""}</span>
        <span aria-hidden="true" className="text-title transition-transform group-open:rotate-180">⌄</span>
      </summary>
      <div className="grid gap-3 border-t border-surface-line px-4 py-4 sm:grid-cols-2 lg:grid-cols-3">
        <Select label="Verdict" value={value.verdict} onChange={(e) => set("verdict", e.target.value)}>
          <option value="">Any verdict</option>
          {Object.entries(VERDICT_TEXT).map(([k, t]) => <option key={k} value={k}>{t.label}</option>)}
        </Select>
        {canSeeAll && (
          <Select label="Technician" value={value.technicianId} onChange={(e) => set("technicianId", e.target.value)}>
            <option value="">Everyone</option>
            {members.data?.map((m) => <option key={m.id} value={m.id}>{m.name}</option>)}
          </Select>
        )}
        <Select label="Site" value={value.siteId} onChange={(e) => set("siteId", e.target.value)}>
          <option value="">Any site</option>
          {sites.data?.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
        </Select>
        <Input label="From" type="date" value={value.from} onChange={(e) => set("from", e.target.value)} />
        <Input label="To" type="date" value={value.to} onChange={(e) => set("to", e.target.value)} />
        <Select label="Practice runs" value={value.isPractice} onChange={(e) => set("isPractice", e.target.value as ListFilters["isPractice"])}>
          <option value="">Include</option>
          <option value="false">Leave out</option>
          <option value="true">Only practice</option>
        </Select>
        {n > 0 && (
          <div className="flex items-end">
            <Button variant="quiet" onClick={() => onChange(NO_FILTERS)}>Clear filters</Button>
          </div>
        )}
      </div>
    </details>
  );
}
