"use client";

/**
 * The test page's "was the pull-down as fast as it should be?": the technician or lead enters the
 * rig (pump, hoses, cores, manifold) and the gas-only plan is drawn over the real pull-down, with
 * findings when the real one is much slower (restrictions, a leak or moisture).
 */
import { useMemo, useState } from "react";
import type { AnalysisResult } from "@/analysis/decay/types";
import type { PlannerInput } from "@/analysis/calculators/planner";
import { PlanOverlay } from "@/components/planner/PlanOverlay";
import { Button, Card, Input, Select } from "@/components/ui";

/** The same hose sizes as the planner in Tools. */
const HOSE_IDS = [
  { value: "0.25", label: "1/4 in" },
  { value: "0.375", label: "3/8 in" },
  { value: "0.5", label: "1/2 in" },
];

const num = (s: string) => Number(s.replace(",", "."));

export function PlanCompare({ analysis, series, volumeLitres }: { analysis: AnalysisResult; series: { t: number[]; p: number[] }; volumeLitres: number | null }) {
  const end = analysis.phases.pulldown?.endSeconds ?? null;
  const real = useMemo(() => {
    if (end == null) return null;
    const tSeconds: number[] = [];
    const microns: number[] = [];
    for (let i = 0; i < series.t.length && series.t[i] <= end; i++) {
      tSeconds.push(series.t[i]);
      microns.push(series.p[i]);
    }
    return tSeconds.length >= 5 ? { tSeconds, microns } : null;
  }, [series, end]);
  const [volume, setVolume] = useState(volumeLitres ? String(Math.round(volumeLitres * 10) / 10) : "5");
  const [cfm, setCfm] = useState("6");
  const [blankOff, setBlankOff] = useState("50");
  const [hoseCount, setHoseCount] = useState("2");
  const [hoseId, setHoseId] = useState("0.25");
  const [hoseFt, setHoseFt] = useState("6");
  const [coresRemoved, setCoresRemoved] = useState(false);
  const [manifold, setManifold] = useState(true);
  const [input, setInput] = useState<PlannerInput | null>(null);
  if (!real) return null;

  const valid = [volume, cfm, blankOff, hoseCount, hoseId, hoseFt].every((v) => Number.isFinite(num(v)) && num(v) > 0);
  return (
    <Card title="Pull-down against a plan">
      <details data-testid="plan-compare">
        <summary className="min-h-tap cursor-pointer py-2 font-medium">Enter the rig to see how fast this pull-down should have been</summary>
        <form
          className="mt-3 grid gap-3 sm:grid-cols-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (!valid) return;
            setInput({
              volumeLitres: num(volume),
              pump: { displacement: num(cfm), displacementUnit: "cfm", blankOffMicrons: num(blankOff) },
              hoses: { count: Math.round(num(hoseCount)), insideDiameterIn: num(hoseId), lengthFt: num(hoseFt) },
              coresRemoved,
              manifold,
              targetMicrons: analysis.profile.targetMicrons,
              startMicrons: real.microns[0],
            });
          }}
        >
          <Input label="System volume (L)" inputMode="decimal" value={volume} onChange={(e) => setVolume(e.target.value)} />
          <Input label="Pump free-air displacement (CFM)" inputMode="decimal" value={cfm} onChange={(e) => setCfm(e.target.value)} />
          <Input label="Pump blank-off (microns)" inputMode="decimal" value={blankOff} onChange={(e) => setBlankOff(e.target.value)} />
          <Input label="Number of hoses" inputMode="numeric" value={hoseCount} onChange={(e) => setHoseCount(e.target.value)} />
          <Select label="Hose inside diameter" value={hoseId} onChange={(e) => setHoseId(e.target.value)} options={HOSE_IDS} />
          <Input label="Hose length (ft)" inputMode="decimal" value={hoseFt} onChange={(e) => setHoseFt(e.target.value)} />
          <label className="flex min-h-tap items-center gap-3">
            <input type="checkbox" className="h-6 w-6" checked={coresRemoved} onChange={(e) => setCoresRemoved(e.target.checked)} /> Cores removed
          </label>
          <label className="flex min-h-tap items-center gap-3">
            <input type="checkbox" className="h-6 w-6" checked={manifold} onChange={(e) => setManifold(e.target.checked)} /> Manifold in the path
          </label>
          <div className="sm:col-span-2">
            <Button type="submit" disabled={!valid}>Compare with the plan</Button>
          </div>
        </form>
        {input && (
          <div className="mt-4">
            <PlanOverlay plannerInput={input} real={real} />
          </div>
        )}
      </details>
    </Card>
  );
}
