"use client";

import { useState } from "react";
import { Alert, Button, Card, Input, Select } from "@/components/ui";
import { apiFetch, ApiError } from "@/lib/client/api";
import type { RigItem } from "./RigDetail";

const num = (s: string) => (s.trim() === "" ? null : Number(s.replace(",", ".")));

export function AddItemForm({ rigId, onSaved }: { rigId: string; onSaved: () => void }) {
  const [kind, setKind] = useState<RigItem["kind"]>("pump");
  const [label, setLabel] = useState("");
  const [cfm, setCfm] = useState("");
  const [rating, setRating] = useState("");
  const [oilDays, setOilDays] = useState("30");
  const [oilHours, setOilHours] = useState("");
  const [checkDays, setCheckDays] = useState("90");
  const [idIn, setIdIn] = useState("0.375");
  const [lenFt, setLenFt] = useState("3");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function add() {
    setBusy(true);
    setError(null);
    const body: Record<string, unknown> = { kind, label };
    if (kind === "pump") Object.assign(body, { freeAirCfm: num(cfm), blankOffRatingMicrons: num(rating), oilEveryDays: num(oilDays), oilEveryHours: num(oilHours) });
    if (kind === "gauge") body.checkEveryDays = num(checkDays);
    if (kind === "hose") Object.assign(body, { insideDiameterIn: num(idIn), lengthFt: num(lenFt) });
    try {
      await apiFetch(`/api/rigs/${rigId}/items`, { method: "POST", body: JSON.stringify(body) });
      setLabel("");
      onSaved();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  }
  return (
    <Card title="Add equipment">
      <div className="grid gap-3 sm:grid-cols-2">
        <Select label="Kind" value={kind} onChange={(e) => setKind(e.target.value as RigItem["kind"])} options={[{ value: "pump", label: "Vacuum pump" }, { value: "gauge", label: "Micron gauge" }, { value: "hose", label: "Hose" }, { value: "core_tool", label: "Core-removal tool" }]} />
        <Input label="Name or label" value={label} onChange={(e) => setLabel(e.target.value)} />
        {kind === "pump" && (
          <>
            <Input label="Free-air displacement (CFM)" inputMode="decimal" value={cfm} onChange={(e) => setCfm(e.target.value)} />
            <Input label="Blank-off rating (microns)" inputMode="decimal" value={rating} onChange={(e) => setRating(e.target.value)} />
            <Input label="Change oil every (days)" inputMode="numeric" value={oilDays} onChange={(e) => setOilDays(e.target.value)} />
            <Input label="…or every (pumping hours)" inputMode="decimal" value={oilHours} onChange={(e) => setOilHours(e.target.value)} />
          </>
        )}
        {kind === "gauge" && <Input label="Check against a reference every (days)" inputMode="numeric" value={checkDays} onChange={(e) => setCheckDays(e.target.value)} />}
        {kind === "hose" && (
          <>
            <Input label="Inside diameter (in)" inputMode="decimal" value={idIn} onChange={(e) => setIdIn(e.target.value)} />
            <Input label="Length (ft)" inputMode="decimal" value={lenFt} onChange={(e) => setLenFt(e.target.value)} />
          </>
        )}
      </div>
      {error && <Alert tone="error" className="mt-3">{error}</Alert>}
      <Button className="mt-3" variant="secondary" block busy={busy} disabled={!label.trim()} onClick={add}>
        Add equipment
      </Button>
    </Card>
  );
}
