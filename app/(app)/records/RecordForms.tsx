"use client";

import { useRouter } from "next/navigation";
import { useState, type ReactNode } from "react";
import { Alert, Button, Card, Input, Select } from "@/components/ui";
import { apiFetch } from "@/lib/client/api";
import { useUnits } from "@/lib/units/context";
import { toStored } from "@/lib/units/format";
import { NameWithSimilar } from "./NameWithSimilar";

const TUBE_ODS = ["1/4", "5/16", "3/8", "1/2", "5/8", "3/4", "7/8", "1-1/8", "1-3/8", "1-5/8", "2-1/8"];

/** A small create form: posts JSON built from its fields, then refreshes the server page. */
function CreateForm({ title, url, build, children, submitLabel }: { title: string; url: string; build: (f: FormData) => unknown; children: ReactNode; submitLabel: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <Card title={title} headingLevel={3}>
      <form
        className="grid gap-3 sm:grid-cols-2"
        onSubmit={async (e) => {
          e.preventDefault();
          const form = e.currentTarget;
          setBusy(true);
          setError(null);
          try {
            await apiFetch(url, { method: "POST", body: JSON.stringify(build(new FormData(form))) });
            form.reset();
            router.refresh();
          } catch (err) {
            setError((err as Error).message);
          } finally {
            setBusy(false);
          }
        }}
      >
        {children}
        <div className="sm:col-span-2">
          <Button type="submit" busy={busy}>{submitLabel}</Button>
        </div>
        {error && <Alert tone="error" className="sm:col-span-2">{error}</Alert>}
      </form>
    </Card>
  );
}

const str = (f: FormData, k: string) => {
  const v = String(f.get(k) ?? "").trim();
  return v === "" ? null : v;
};
const num = (f: FormData, k: string) => {
  const v = str(f, k);
  return v == null ? null : Number(v.replace(",", "."));
};

export function NewCustomerForm() {
  return (
    <CreateForm title="New customer" url="/api/customers" submitLabel="Add customer" build={(f) => ({ name: str(f, "name"), email: str(f, "email"), phone: str(f, "phone") })}>
      <NameWithSimilar kind="customer" label="Name" className="sm:col-span-2" />
      <Input label="E-mail" name="email" type="email" />
      <Input label="Phone" name="phone" type="tel" />
    </CreateForm>
  );
}

export function NewSiteForm({ customers }: { customers: { id: string; name: string }[] }) {
  return (
    <CreateForm title="New site" url="/api/sites" submitLabel="Add site" build={(f) => ({ name: str(f, "name"), address: str(f, "address"), ...(str(f, "customerId") ? { customerId: str(f, "customerId") } : {}) })}>
      <NameWithSimilar kind="site" label="Site name" />
      <Select label="Customer" name="customerId" options={[{ value: "", label: "None" }, ...customers.map((c) => ({ value: c.id, label: c.name }))]} />
      <Input label="Address" name="address" className="sm:col-span-2" />
    </CreateForm>
  );
}

export function NewSystemForm({ siteId }: { siteId: string }) {
  const units = useUnits();
  const metric = units === "metric";
  /** Typed in the reader's units, stored in kg and feet. */
  const stored = (v: number | null, kind: "charge" | "length") => (v == null ? v : toStored[kind](v, units));
  const od = [{ value: "", label: "—" }, ...TUBE_ODS.map((o) => ({ value: o, label: `${o} in.` }))];
  return (
    <CreateForm
      title="New system at this site"
      url="/api/systems"
      submitLabel="Add system"
      build={(f) => ({
        siteId, name: str(f, "name"), kind: str(f, "kind"), refrigerant: str(f, "refrigerant"), factoryChargeKg: stored(num(f, "factoryChargeKg"), "charge"),
        lineSetFeet: stored(num(f, "lineSetFeet"), "length"), liquidOd: str(f, "liquidOd"), suctionOd: str(f, "suctionOd"),
        indoorCoilLitres: num(f, "indoorCoilLitres"), outdoorUnitLitres: num(f, "outdoorUnitLitres"), installedOn: str(f, "installedOn"),
      })}
    >
      <NameWithSimilar kind="system" label="Name" siteId={siteId} />
      <Input label="Kind (split, packaged, walk-in…)" name="kind" />
      <Input label="Refrigerant" name="refrigerant" />
      <Input label={metric ? "Factory charge (kg)" : "Factory charge (lb)"} name="factoryChargeKg" inputMode="decimal" />
      <Input label={metric ? "Line set length (m)" : "Line set length (ft)"} name="lineSetFeet" inputMode="decimal" />
      <Input label="Installed on" name="installedOn" type="date" />
      <Select label="Liquid line OD" name="liquidOd" options={od} />
      <Select label="Suction line OD" name="suctionOd" options={od} />
      <Input label="Indoor coil volume (L)" name="indoorCoilLitres" inputMode="decimal" />
      <Input label="Outdoor unit volume (L)" name="outdoorUnitLitres" inputMode="decimal" />
    </CreateForm>
  );
}

export function NewJobForm({ sites, technicians }: { sites: { id: string; name: string }[]; technicians: { id: string; name: string }[] }) {
  return (
    <CreateForm
      title="New job"
      url="/api/jobs"
      submitLabel="Add job"
      build={(f) => ({ visitedOn: str(f, "visitedOn"), siteId: str(f, "siteId"), technicianId: str(f, "technicianId"), reason: str(f, "reason"), reference: str(f, "reference") })}
    >
      <Input label="Date" name="visitedOn" type="date" required defaultValue={new Date().toISOString().slice(0, 10)} />
      <Select label="Site" name="siteId" options={[{ value: "", label: "—" }, ...sites.map((s) => ({ value: s.id, label: s.name }))]} />
      <Select label="Technician" name="technicianId" options={[{ value: "", label: "—" }, ...technicians.map((t) => ({ value: t.id, label: t.name }))]} />
      <Input label="Reference" name="reference" />
      <Input label="Reason (install, compressor change, leak repair…)" name="reason" className="sm:col-span-2" />
    </CreateForm>
  );
}
