"use client";

/**
 * The pull-down planner: the system (a line set and coils, a volume, or a system from the shop's
 * records), the pump and hoses (or a rig from the register), the system's condition (the water and
 * outgassing assumed, which the technician can change), then the plan as a range with what-ifs,
 * and for a recorded system its own pull-downs beside the plan.
 */
import { useState } from "react";
import { metresFromFeet } from "@/lib/units/convert";
import { toStored } from "@/lib/units/format";
import { useUnits } from "@/lib/units/context";
import { planWhatIfs, type PlannerInput, type WhatIf } from "@/analysis/calculators/planner";
import { CONDITION_WORDS, type SystemCondition } from "@/analysis/calculators/planner-load";
import { ACR_TUBE_ID_INCHES, systemVolumeLitres, tubeInsideDiameterIn } from "@/analysis/shared/volume";
import { Alert, Button, Card, Input, Select } from "@/components/ui";
import { PlanResult } from "@/components/planner/PlanResult";
import { RigPicker, type RigSetup } from "@/components/planner/RigPicker";
import { SystemHistory } from "@/components/planner/SystemHistory";

const SIZES = Object.keys(ACR_TUBE_ID_INCHES).map((s) => ({ value: s, label: `${s} in` }));
const HOSE_IDS = [
  { value: "0.25", label: "1/4 in" },
  { value: "0.375", label: "3/8 in" },
  { value: "0.5", label: "1/2 in" },
];

export interface PlannerSystem {
  id: string;
  label: string;
  lineSetFeet: number | null;
  liquidOd: string | null;
  suctionOd: string | null;
  indoorCoilLitres: number | null;
  outdoorUnitLitres: number | null;
}

function num(s: string): number {
  return s.trim() === "" ? NaN : Number(s.replace(",", "."));
}

export function Planner({ systems }: { systems: PlannerSystem[] }) {
  const [systemId, setSystemId] = useState("");
  const [volumeMode, setVolumeMode] = useState<"lineset" | "direct">("lineset");
  const units = useUnits();
  const metric = units === "metric";
  /** A length in feet as the person types it (metres for a metric reader). */
  const shownLength = (feet: number) => String(metric ? Math.round(metresFromFeet(feet) * 10) / 10 : feet);
  const feetOf = (typed: string) => toStored.length(num(typed), units);
  const [lineFt, setLineFt] = useState(() => shownLength(25));
  const [liquidOd, setLiquidOd] = useState("3/8");
  const [suctionOd, setSuctionOd] = useState("3/4");
  const [coilL, setCoilL] = useState("3");
  const [litres, setLitres] = useState("5");
  const [displacement, setDisplacement] = useState("6");
  const [dispUnit, setDispUnit] = useState<"cfm" | "m3h">("cfm");
  const [blankOff, setBlankOff] = useState("20");
  const [hoseCount, setHoseCount] = useState("2");
  const [hoseId, setHoseId] = useState("0.25");
  const [hoseFt, setHoseFt] = useState(() => shownLength(6));
  const [coresRemoved, setCoresRemoved] = useState(false);
  const [manifold, setManifold] = useState(true);
  const [target, setTarget] = useState("500");
  const [condition, setCondition] = useState<SystemCondition>("typical");
  const [waterGrams, setWaterGrams] = useState("");
  const [suggestion, setSuggestion] = useState<string | null>(null);
  const [result, setResult] = useState<{ whatIfs: WhatIf[]; volume: number } | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  function applyRig(r: RigSetup) {
    if (r.displacementCfm) {
      setDisplacement(String(r.displacementCfm));
      setDispUnit("cfm");
    }
    if (r.blankOffMicrons) setBlankOff(String(r.blankOffMicrons));
    if (r.hoseCount) setHoseCount(String(r.hoseCount));
    if (r.hoseInsideDiameterIn) setHoseId(String(r.hoseInsideDiameterIn));
    if (r.hoseLengthFt) setHoseFt(shownLength(r.hoseLengthFt));
  }

  function pickSystem(id: string) {
    setSystemId(id);
    setSuggestion(null);
    const s = systems.find((x) => x.id === id);
    if (!s) return;
    if (s.lineSetFeet && s.liquidOd && s.suctionOd) {
      setVolumeMode("lineset");
      setLineFt(shownLength(s.lineSetFeet));
      setLiquidOd(s.liquidOd);
      setSuctionOd(s.suctionOd);
    }
    const coil = (s.indoorCoilLitres ?? 0) + (s.outdoorUnitLitres ?? 0);
    if (coil > 0) setCoilL(String(Math.round(coil * 10) / 10));
  }

  function plan() {
    setError(null);
    setBusy(true);
    setTimeout(() => {
      try {
        const volume =
          volumeMode === "direct"
            ? systemVolumeLitres({ litres: num(litres) })
            : systemVolumeLitres({ lineSet: [{ lengthFeet: feetOf(lineFt), liquidOd, suctionOd }], coilLitres: num(coilL) || 0 });
        if (!volume) throw new RangeError("enter the line set or the system volume");
        const grams = num(waterGrams);
        const input: PlannerInput = {
          volumeLitres: volume,
          pump: { displacement: num(displacement), displacementUnit: dispUnit, blankOffMicrons: num(blankOff) },
          hoses: { count: num(hoseCount), insideDiameterIn: num(hoseId), lengthFt: feetOf(hoseFt) },
          coresRemoved,
          manifold,
          targetMicrons: num(target),
          condition,
          waterGrams: Number.isFinite(grams) ? grams : null,
          lineSet: volumeMode === "lineset" ? { lengthFt: feetOf(lineFt), suctionInsideDiameterIn: tubeInsideDiameterIn(suctionOd) } : null,
        };
        setResult({ whatIfs: planWhatIfs(input), volume });
      } catch (e) {
        setResult(null);
        setError(e instanceof Error ? e.message : String(e));
      } finally {
        setBusy(false);
      }
    }, 10);
  }

  return (
    <div className="space-y-4">
      <Card title="System">
        {systems.length > 0 && (
          <div className="mb-3">
            <Select
              label="A system from your records"
              value={systemId}
              onChange={(e) => pickSystem(e.target.value)}
              options={[{ value: "", label: "Type the system in" }, ...systems.map((s) => ({ value: s.id, label: s.label }))]}
              hint="Fills the line set and coils, and shows this system's own recorded pull-downs beside the plan."
            />
          </div>
        )}
        <div className="mb-3 flex gap-2" role="radiogroup" aria-label="How to give the volume">
          <Button variant={volumeMode === "lineset" ? "primary" : "secondary"} role="radio" aria-checked={volumeMode === "lineset"} onClick={() => setVolumeMode("lineset")}>
            Line set
          </Button>
          <Button variant={volumeMode === "direct" ? "primary" : "secondary"} role="radio" aria-checked={volumeMode === "direct"} onClick={() => setVolumeMode("direct")}>
            Volume
          </Button>
        </div>
        {volumeMode === "lineset" ? (
          <div className="grid gap-3 sm:grid-cols-2">
            <Input label={metric ? "Line-set length (m)" : "Line-set length (ft)"} inputMode="decimal" value={lineFt} onChange={(e) => setLineFt(e.target.value)} />
            <Input label="Coil and unit volume (L)" inputMode="decimal" value={coilL} onChange={(e) => setCoilL(e.target.value)} hint="Indoor coil, plus the outdoor unit when it is opened too" />
            <Select label="Liquid line OD" value={liquidOd} onChange={(e) => setLiquidOd(e.target.value)} options={SIZES} />
            <Select label="Suction line OD" value={suctionOd} onChange={(e) => setSuctionOd(e.target.value)} options={SIZES} />
          </div>
        ) : (
          <Input label="System volume (L)" inputMode="decimal" value={litres} onChange={(e) => setLitres(e.target.value)} />
        )}
        <div className="mt-3 grid gap-3 sm:grid-cols-2">
          <Select
            label="System's condition (water and outgassing)"
            value={condition}
            onChange={(e) => setCondition(e.target.value as SystemCondition)}
            options={(Object.keys(CONDITION_WORDS) as SystemCondition[]).map((c) => ({ value: c, label: CONDITION_WORDS[c] }))}
            hint={suggestion ?? "What keeps a real pull-down slow: water in the oil and on the copper, refrigerant in the oil."}
          />
          <Input label="Water to remove (g), if you know better" inputMode="decimal" value={waterGrams} onChange={(e) => setWaterGrams(e.target.value)} hint="Leave empty to use the condition's figure" />
        </div>
      </Card>
      <Card title="Pump and hoses">
        <div className="mb-3">
          <RigPicker onPick={applyRig} />
        </div>
        <div className="grid gap-3 sm:grid-cols-2">
          <Input label="Pump free-air displacement" inputMode="decimal" value={displacement} onChange={(e) => setDisplacement(e.target.value)} />
          <Select label="Displacement unit" value={dispUnit} onChange={(e) => setDispUnit(e.target.value as "cfm" | "m3h")} options={[{ value: "cfm", label: "CFM" }, { value: "m3h", label: "m³/h" }]} />
          <Input label="Pump blank-off (microns)" inputMode="decimal" value={blankOff} onChange={(e) => setBlankOff(e.target.value)} hint="Its lowest reading with the gauge on the pump alone" />
          <Input label="Target (microns)" inputMode="decimal" value={target} onChange={(e) => setTarget(e.target.value)} />
          <Input label="Number of hoses" inputMode="numeric" value={hoseCount} onChange={(e) => setHoseCount(e.target.value)} />
          <Select label="Hose inside diameter" value={hoseId} onChange={(e) => setHoseId(e.target.value)} options={HOSE_IDS.some((h) => h.value === hoseId) ? HOSE_IDS : [...HOSE_IDS, { value: hoseId, label: `${hoseId} in` }]} />
          <Input label={metric ? "Hose length (m)" : "Hose length (ft)"} inputMode="decimal" value={hoseFt} onChange={(e) => setHoseFt(e.target.value)} />
        </div>
        <div className="mt-3 space-y-2">
          <label className="flex min-h-tap items-center gap-3 text-body">
            <input type="checkbox" className="h-6 w-6" checked={coresRemoved} onChange={(e) => setCoresRemoved(e.target.checked)} />
            Cores removed (core-removal tools)
          </label>
          <label className="flex min-h-tap items-center gap-3 text-body">
            <input type="checkbox" className="h-6 w-6" checked={manifold} onChange={(e) => setManifold(e.target.checked)} />
            Manifold in the path
          </label>
        </div>
        <Button className="mt-3" block busy={busy} onClick={plan}>
          Plan the pull-down
        </Button>
      </Card>
      {error && <Alert tone="error" title="Cannot plan this">{error}</Alert>}
      {result && <PlanResult whatIfs={result.whatIfs} volumeLitres={result.volume} />}
      {systemId && (
        <SystemHistory
          key={systemId}
          systemId={systemId}
          onSuggestion={(s) => {
            if (!s) return;
            setCondition(s.condition);
            setSuggestion(`Set to ${s.condition} from this system's history: ${s.why}.`);
          }}
        />
      )}
    </div>
  );
}
