"use client";

import { useState } from "react";
import { Alert, Button, Card, Input, Select, Textarea } from "@/components/ui";
import { apiFetch, ApiError } from "@/lib/client/api";
import { EVENT_WORDS, KIND_WORDS, OIL_REASON_WORDS, type RigItem } from "./RigDetail";

const num = (s: string) => (s.trim() === "" ? null : Number(s.replace(",", ".")));

export function LogEventForm({ rigId, items, today, onSaved }: { rigId: string; items: RigItem[]; today: string; onSaved: () => void }) {
  const [kind, setKind] = useState("oil_changed");
  const [itemId, setItemId] = useState(items.find((i) => i.kind === "pump")?.id ?? "");
  const [occurredOn, setOccurredOn] = useState(today);
  const [oilReason, setOilReason] = useState("routine");
  const [lowest, setLowest] = useState("");
  const [logText, setLogText] = useState<string | null>(null);
  const [hours, setHours] = useState("");
  const [reference, setReference] = useState("");
  const [gauge, setGauge] = useState("");
  const [note, setNote] = useState("");
  const [done, setDone] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function save() {
    setBusy(true);
    setError(null);
    setDone(null);
    const body: Record<string, unknown> = { kind, occurredOn, itemId: itemId || null, note: note || null, pumpHours: num(hours) };
    if (kind === "oil_changed") body.oilReason = oilReason;
    if (kind === "blank_off") Object.assign(body, logText ? { logText } : { lowestMicrons: num(lowest) });
    if (kind === "gauge_checked") Object.assign(body, { referenceMicrons: num(reference), gaugeMicrons: num(gauge) });
    try {
      await apiFetch(`/api/rigs/${rigId}/events`, { method: "POST", body: JSON.stringify(body) });
      setDone(`${EVENT_WORDS[kind]} logged.`);
      setNote("");
      setLowest("");
      onSaved();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  }
  return (
    <Card title="Log upkeep">
      <div className="grid gap-3 sm:grid-cols-2">
        <Select label="What was done" value={kind} onChange={(e) => setKind(e.target.value)} options={Object.entries(EVENT_WORDS).map(([value, label]) => ({ value, label }))} />
        <Select label="Equipment" value={itemId} onChange={(e) => setItemId(e.target.value)} options={[{ value: "", label: "The rig as a whole" }, ...items.map((i) => ({ value: i.id, label: `${KIND_WORDS[i.kind]}: ${i.label}` }))]} />
        <Input label="Date" type="date" value={occurredOn} onChange={(e) => setOccurredOn(e.target.value)} />
        {kind === "oil_changed" && <Select label="Why" value={oilReason} onChange={(e) => setOilReason(e.target.value)} options={Object.entries(OIL_REASON_WORDS).map(([value, label]) => ({ value, label }))} />}
        {kind === "blank_off" && (
          <>
            <Input label="Lowest reading (microns)" inputMode="decimal" value={lowest} onChange={(e) => setLowest(e.target.value)} disabled={Boolean(logText)} />
            <div className="flex flex-col gap-1.5">
              <label htmlFor="blank-off-log" className="text-body font-medium">…or the gauge log</label>
              <input id="blank-off-log" type="file" accept=".csv,.txt,text/csv,text/plain" className="min-h-tap text-body" onChange={async (e) => setLogText((await e.target.files?.[0]?.text()) ?? null)} />
            </div>
          </>
        )}
        {(kind === "oil_changed" || kind === "pump_hours" || kind === "blank_off") && <Input label="Pump hour meter (h)" inputMode="decimal" value={hours} onChange={(e) => setHours(e.target.value)} />}
        {kind === "gauge_checked" && (
          <>
            <Input label="Reference read (microns)" inputMode="decimal" value={reference} onChange={(e) => setReference(e.target.value)} />
            <Input label="This gauge read (microns)" inputMode="decimal" value={gauge} onChange={(e) => setGauge(e.target.value)} />
          </>
        )}
        <Textarea label="Note (optional)" rows={2} value={note} onChange={(e) => setNote(e.target.value)} className="sm:col-span-2" />
      </div>
      {error && <Alert tone="error" className="mt-3">{error}</Alert>}
      {done && <Alert tone="success" className="mt-3">{done}</Alert>}
      <Button className="mt-3" block busy={busy} onClick={save}>
        Log it
      </Button>
    </Card>
  );
}
