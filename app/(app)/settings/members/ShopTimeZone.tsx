"use client";

import { useState } from "react";
import { Alert, Button, Card, Select } from "@/components/ui";
import { apiFetch } from "@/lib/client/api";

/** Every IANA zone the browser knows, the current one first when it is missing from the list. */
function zones(current: string): string[] {
  const all = typeof Intl.supportedValuesOf === "function" ? Intl.supportedValuesOf("timeZone") : [];
  const list = all.includes("UTC") ? all : ["UTC", ...all];
  return list.includes(current) ? list : [current, ...list];
}

/** The shop's time zone: reports, the PDF and e-mails write every time in it (owner sets it). */
export function ShopTimeZone({ timeZone, canManage }: { timeZone: string; canManage: boolean }) {
  const [value, setValue] = useState(timeZone);
  const [saved, setSaved] = useState(timeZone);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const browser = typeof Intl !== "undefined" ? Intl.DateTimeFormat().resolvedOptions().timeZone : "UTC";
  return (
    <Card title="Time zone" data-testid="shop-time-zone">
      <p className="text-body text-fg-soft">Reports, the PDF and e-mails write every time in the shop’s time zone: now {saved}.</p>
      {canManage ? (
        <form
          className="mt-3 flex flex-wrap items-end gap-2"
          onSubmit={async (e) => {
            e.preventDefault();
            setBusy(true);
            setError(null);
            try {
              const r = await apiFetch<{ timeZone: string }>("/api/settings/shop", { method: "PUT", body: JSON.stringify({ timeZone: value }) });
              setSaved(r.timeZone);
            } catch (err) {
              setError((err as Error).message);
            } finally {
              setBusy(false);
            }
          }}
        >
          <Select label="Shop time zone" value={value} onChange={(e) => setValue(e.target.value)} className="min-w-64" hint={browser !== value ? `This device is set to ${browser}.` : undefined}>
            {zones(value).map((z) => (
              <option key={z} value={z}>{z}</option>
            ))}
          </Select>
          <Button type="submit" busy={busy} disabled={value === saved}>Save time zone</Button>
        </form>
      ) : null}
      {error && <Alert tone="error">{error}</Alert>}
    </Card>
  );
}
