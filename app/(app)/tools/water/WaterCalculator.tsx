"use client";

import { useState } from "react";
import { PA_PER_MICRON } from "@/analysis/shared/units";
import { waterVapourPressurePa } from "@/analysis/calculators/water";
import { cToF, TRIPLE_POINT_MICRONS, WaterAtVacuum } from "@/components/planner/WaterAtVacuum";
import { Card, Input, Select } from "@/components/ui";
import { useUnits } from "@/lib/units/context";

const num = (s: string) => Number(s.replace(",", "."));

export function WaterCalculator() {
  const [microns, setMicrons] = useState("500");
  // Opens in the reader's units: 50 °F or 10 °C (the same temperature).
  const metric = useUnits() === "metric";
  const [temp, setTemp] = useState(metric ? "10" : "50");
  const [tUnit, setTUnit] = useState<"C" | "F">(metric ? "C" : "F");
  const m = num(microns);
  const tC = tUnit === "C" ? num(temp) : ((num(temp) - 32) * 5) / 9;
  const pa = Number.isFinite(tC) ? waterVapourPressurePa(tC) : NaN;
  const needMicrons = pa / PA_PER_MICRON;
  return (
    <div className="space-y-4">
      <Card title="At this vacuum">
        <Input label="Vacuum (microns)" inputMode="decimal" value={microns} onChange={(e) => setMicrons(e.target.value)} />
        <div className="mt-3">{m > 0 ? <WaterAtVacuum microns={m} /> : <p className="text-fg-soft">Enter a vacuum above 0.</p>}</div>
      </Card>
      <Card title="To boil water at this temperature">
        <div className="grid gap-3 sm:grid-cols-2">
          <Input label="Temperature" inputMode="decimal" value={temp} onChange={(e) => setTemp(e.target.value)} />
          <Select label="Unit" value={tUnit} onChange={(e) => setTUnit(e.target.value as "C" | "F")} options={[{ value: "F", label: "°F" }, { value: "C", label: "°C" }]} />
        </div>
        <p className="mt-3 text-body" data-testid="vacuum-needed">
          {Number.isFinite(needMicrons) ? (
            <>
              Below <strong>{Math.round(needMicrons).toLocaleString("en-US")} microns</strong> ({pa.toFixed(1)} Pa) water at {cToF(tC).toFixed(1)} °F ({tC.toFixed(1)} °C){" "}
              {needMicrons < TRIPLE_POINT_MICRONS ? "as ice sublimes (it is below the triple point)." : "boils."}
            </>
          ) : (
            "Outside the range of the water tables (−148 to 392 °F, −100 to 200 °C)."
          )}
        </p>
      </Card>
      <p className="text-caption text-fg-soft">Saturation pressure of water and ice from the ASHRAE Hyland–Wexler equations (PsychroLib).</p>
    </div>
  );
}
