"use client";

import { useId } from "react";
import { SimilarNames } from "@/components/records/SimilarNames";
import { useQuery } from "@tanstack/react-query";
import { Input, Select, Textarea } from "@/components/ui";
import { listJobs, listSites, listSystems, type JobItem } from "@/lib/client/api";
import { REFRIGERANTS, TUBE_SIZES, type TestContext } from "./context";

interface Props {
  value: TestContext;
  onChange: (next: TestContext) => void;
  canCreateJob: boolean;
}

/** The Job select's value for "make a new visit with this test". */
const NEW_VISIT = "new";

function jobLabel(j: JobItem): string {
  const what = [j.reference, j.visitedOn, j.reason].filter(Boolean).join(" · ") || "Job";
  const whose = [j.customerName, j.siteName && j.siteName !== j.customerName ? j.siteName : null].filter(Boolean).join(", ");
  return whose ? `${what} — ${whose}` : what;
}

function match(list: { id: string; name: string }[] | undefined, name: string): string {
  const n = name.trim().toLowerCase();
  return list?.find((x) => x.name.trim().toLowerCase() === n)?.id ?? "";
}

/**
 * The optional context fields (never required). Sites and systems are picked from the shop's
 * list or created by typing a new name.
 */
export function ContextForm({ value, onChange, canCreateJob }: Props) {
  const ids = useId();
  const set = <K extends keyof TestContext>(k: K, v: TestContext[K]) => onChange({ ...value, [k]: v });
  const sites = useQuery({ queryKey: ["sites"], queryFn: listSites, retry: 1 });
  const jobs = useQuery({ queryKey: ["jobs"], queryFn: listJobs, retry: 1 });
  const systems = useQuery({
    queryKey: ["systems", value.siteId],
    queryFn: () => listSystems(value.siteId),
    enabled: !!value.siteId,
    retry: 1,
  });
  const isNewSite = value.siteName.trim() !== "" && !value.siteId;
  const isNewSystem = value.systemName.trim() !== "" && !value.systemId;

  return (
    <div className="grid gap-4 border-t border-surface-line px-4 py-4 sm:grid-cols-2">
      <Input label="Title" placeholder="e.g. Heat pump, new line set" value={value.title} onChange={(e) => set("title", e.target.value)} className="sm:col-span-2" />
      <Select
        label="Job"
        value={value.newJob && !value.isPractice ? NEW_VISIT : value.jobId}
        onChange={(e) =>
          onChange(e.target.value === NEW_VISIT ? { ...value, newJob: true, jobId: "" } : { ...value, jobId: e.target.value, newJob: false, newJobReason: "" })
        }
        hint={jobs.isError ? "Jobs could not be loaded; you can add one later." : undefined}
      >
        <option value="">No job</option>
        {canCreateJob && !value.isPractice && <option value={NEW_VISIT}>New visit today{value.newJobReason ? ` — ${value.newJobReason}` : ""}</option>}
        {jobs.data?.map((j) => (
          <option key={j.id} value={j.id}>{jobLabel(j)}</option>
        ))}
      </Select>
      <div>
        <Input
          label="Site"
          list={`${ids}-sites`}
          autoComplete="off"
          placeholder="Pick or type a new site"
          value={value.siteName}
          onChange={(e) => {
            const siteId = match(sites.data, e.target.value);
            onChange({ ...value, siteName: e.target.value, siteId, systemId: siteId === value.siteId ? value.systemId : "" });
          }}
          hint={isNewSite ? `A new site “${value.siteName.trim()}” will be created.` : undefined}
        />
        {isNewSite && canCreateJob && (
          <SimilarNames kind="site" name={value.siteName} onUse={(m) => onChange({ ...value, siteName: m.name, siteId: m.id, systemId: "" })} />
        )}
        <datalist id={`${ids}-sites`}>
          {sites.data?.map((s) => <option key={s.id} value={s.name} />)}
        </datalist>
      </div>
      <div>
        <Input
          label="System"
          list={`${ids}-systems`}
          autoComplete="off"
          placeholder="e.g. Upstairs heat pump"
          value={value.systemName}
          disabled={!value.siteName.trim()}
          onChange={(e) => onChange({ ...value, systemName: e.target.value, systemId: match(systems.data, e.target.value) })}
          hint={!value.siteName.trim() ? "Choose a site first." : isNewSystem ? `A new system “${value.systemName.trim()}” will be created.` : undefined}
        />
        {isNewSystem && canCreateJob && value.siteId && (
          <SimilarNames kind="system" name={value.systemName} siteId={value.siteId} onUse={(m) => onChange({ ...value, systemName: m.name, systemId: m.id })} />
        )}
        <datalist id={`${ids}-systems`}>
          {systems.data?.map((s) => <option key={s.id} value={s.name} />)}
        </datalist>
      </div>
      <Select label="Refrigerant" value={value.refrigerant} onChange={(e) => set("refrigerant", e.target.value)}>
        <option value="">Not set</option>
        {REFRIGERANTS.map((r) => <option key={r} value={r}>{r}</option>)}
      </Select>
      <Input label={value.lengthUnit === "m" ? "Line-set length (metres)" : "Line-set length (feet)"} inputMode="decimal" value={value.lineSetFeet} onChange={(e) => set("lineSetFeet", e.target.value)} hint="With the tube sizes, gives the volume for a leak rate." />
      <Select label="Liquid line (OD, inch)" value={value.liquidOd} onChange={(e) => set("liquidOd", e.target.value)}>
        <option value="">Not set</option>
        {TUBE_SIZES.map((s) => <option key={s} value={s}>{s}″</option>)}
      </Select>
      <Select label="Suction line (OD, inch)" value={value.suctionOd} onChange={(e) => set("suctionOd", e.target.value)}>
        <option value="">Not set</option>
        {TUBE_SIZES.map((s) => <option key={s} value={s}>{s}″</option>)}
      </Select>
      <Input label="System volume (litres), if known" inputMode="decimal" value={value.volumeLitres} onChange={(e) => set("volumeLitres", e.target.value)} />
      <div className="flex items-end gap-2">
        <Input label="Ambient temperature" inputMode="decimal" value={value.ambient} onChange={(e) => set("ambient", e.target.value)} className="flex-1" />
        <Select label="Unit" value={value.ambientUnit} onChange={(e) => set("ambientUnit", e.target.value as "C" | "F")} className="w-24">
          <option value="F">°F</option>
          <option value="C">°C</option>
        </Select>
      </div>
      <Textarea label="Notes (internal, never on the customer’s report)" rows={3} value={value.notes} onChange={(e) => set("notes", e.target.value)} className="sm:col-span-2" />
      <Textarea label="Note for the customer (printed on the report)" rows={2} value={value.customerNote} onChange={(e) => set("customerNote", e.target.value)} className="sm:col-span-2" />
      <Input label="Rig note" placeholder="e.g. core tools both sides, 3/8″ hoses, no manifold" value={value.rigNote} onChange={(e) => set("rigNote", e.target.value)} className="sm:col-span-2" />
      <label className="flex min-h-tap items-center gap-3 text-body sm:col-span-2">
        <input type="checkbox" className="h-6 w-6 accent-tide-600" checked={value.isPractice} onChange={(e) => set("isPractice", e.target.checked)} />
        Practice run (kept out of job records)
      </label>
    </div>
  );
}
