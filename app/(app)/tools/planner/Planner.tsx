"use client";

import { useMemo, useState } from "react";
import { planWhatIfs, type PlannerInput, type WhatIf } from "@/analysis/planner";
import { ACR_TUBE_ID_INCHES, systemVolumeLitres } from "@/analysis/volume";
import { Alert, Button, Card, Input, Select } from "@/components/ui";
import { LazyPlanChart } from "@/components/planner/LazyPlanChart";
import { durationWords } from "@/components/planner/format";
import { RigPicker, type RigSetup } from "@/components/planner/RigPicker";

const SIZES = Object.keys(ACR_TUBE_ID_INCHES).map((s) => ({ value: s, label: `${s} in` }));
const HOSE_IDS = [
  { value: "0.25", label: "1/4 in" },
  { value: "0.375", label: "3/8 in" },
  { value: "0.5", label: "1/2 in" },
];

function num(s: string): number {
  return Number(s.replace(",", "."));
}

export function Planner() {
  const [volumeMode, setVolumeMode] = useState<"lineset" | "direct">("lineset");
  const [lineFt, setLineFt] = useState("25");
  const [liquidOd, setLiquidOd] = useState("3/8");
  const [suctionOd, setSuctionOd] = useState("3/4");
  const [coilL, setCoilL] = useState("3");
  const [litres, setLitres] = useState("5");
  const [displacement, setDisplacement] = useState("6");
  const [dispUnit, setDispUnit] = useState<"cfm" | "m3h">("cfm");
  const [blankOff, setBlankOff] = useState("20");
  const [hoseCount, setHoseCount] = useState("2");
  const [hoseId, setHoseId] = useState("0.25");
  const [hoseFt, setHoseFt] = useState("6");
  const [coresRemoved, setCoresRemoved] = useState(false);
  const [manifold, setManifold] = useState(true);
  const [target, setTarget] = useState("500");
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
    if (r.hoseLengthFt) setHoseFt(String(r.hoseLengthFt));
  }

  function plan() {
    setError(null);
    setBusy(true);
    setTimeout(() => {
      try {
        const volume =
          volumeMode === "direct"
            ? systemVolumeLitres({ litres: num(litres) })
            : systemVolumeLitres({ lineSet: [{ lengthFeet: num(lineFt), liquidOd, suctionOd }], coilLitres: num(coilL) || 0 });
        if (!volume) throw new RangeError("enter the line set or the system volume");
        const input: PlannerInput = {
          volumeLitres: volume,
          pump: { displacement: num(displacement), displacementUnit: dispUnit, blankOffMicrons: num(blankOff) },
          hoses: { count: num(hoseCount), insideDiameterIn: num(hoseId), lengthFt: num(hoseFt) },
          coresRemoved,
          manifold,
          targetMicrons: num(target),
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

  const series = useMemo(
    () => result?.whatIfs.map((w) => ({ label: w.label, tSeconds: w.plan.curve.tSeconds, microns: w.plan.curve.microns, kind: "plan" as const })) ?? [],
    [result],
  );
  const main = result?.whatIfs[0];

  return (
    <div className="space-y-4">
      <Card title="System">
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
            <Input label="Line-set length (ft)" inputMode="decimal" value={lineFt} onChange={(e) => setLineFt(e.target.value)} />
            <Input label="Coil and unit volume (L)" inputMode="decimal" value={coilL} onChange={(e) => setCoilL(e.target.value)} hint="Indoor coil plus outdoor unit, from the data sheet" />
            <Select label="Liquid line OD" value={liquidOd} onChange={(e) => setLiquidOd(e.target.value)} options={SIZES} />
            <Select label="Suction line OD" value={suctionOd} onChange={(e) => setSuctionOd(e.target.value)} options={SIZES} />
          </div>
        ) : (
          <Input label="System volume (L)" inputMode="decimal" value={litres} onChange={(e) => setLitres(e.target.value)} />
        )}
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
          <Input label="Hose length (ft)" inputMode="decimal" value={hoseFt} onChange={(e) => setHoseFt(e.target.value)} />
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
      {main && result && (
        <Card title="Plan" data-testid="plan-result">
          <p className="text-body text-fg-soft">{result.volume.toFixed(2)} L system, pump {main.plan.pumpSpeedLps.toFixed(2)} L/s.</p>
          <p className="text-figure" data-testid="time-to-target">{durationWords(main.plan.timeToTargetSeconds)}</p>
          <p className="text-body">to {main.plan.input.targetMicrons.toLocaleString("en-US")} microns (gas only). Slowest part: {main.plan.bottleneck}.</p>
          <table className="mt-3 w-full text-left text-body" aria-label="What-ifs side by side">
            <thead>
              <tr className="border-b border-surface-line text-caption text-fg-soft">
                <th className="py-2 font-medium">Setup</th>
                <th className="py-2 font-medium">Time to target</th>
                <th className="py-2 font-medium">Saves</th>
              </tr>
            </thead>
            <tbody>
              {result.whatIfs.map((w) => {
                const t = w.plan.timeToTargetSeconds;
                const base = main.plan.timeToTargetSeconds;
                return (
                  <tr key={w.key} className="border-b border-surface-line">
                    <td className="py-2">{w.label}</td>
                    <td className="py-2">{durationWords(t)}</td>
                    <td className="py-2">{w.key === "as_planned" || t === null || base === null ? "—" : `${Math.round((1 - t / base) * 100)} %`}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          <div className="mt-4">
            <LazyPlanChart series={series} targetMicrons={main.plan.input.targetMicrons} summary={`Predicted pull-down curves; as planned reaches the target in ${durationWords(main.plan.timeToTargetSeconds)}.`} />
          </div>
          <Alert tone="info" className="mt-3" title="Gas only">
            {main.plan.caveat}
          </Alert>
          <details className="mt-3 text-body">
            <summary className="min-h-tap cursor-pointer py-2 font-medium">How this was worked out</summary>
            <ul className="list-disc pl-5 text-fg-soft">
              {main.plan.assumptions.map((a) => (
                <li key={a}>{a}</li>
              ))}
            </ul>
          </details>
        </Card>
      )}
    </div>
  );
}
