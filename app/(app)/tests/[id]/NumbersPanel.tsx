import type { AnalysisResult } from "@/analysis/types";
import { Card } from "@/components/ui";
import { shapeWords, primaryHold } from "@/components/curve/model";
import { atWords, microns, minutesShort, pascals, scientific, sig3 } from "./format";

function Item({ label, value, si, testId }: { label: string; value: string; si?: string; testId?: string }) {
  return (
    <div className="rounded-lg bg-surface-sunken px-3 py-2">
      <dt className="text-caption text-fg-soft">{label}</dt>
      <dd className="text-title tabular-nums" data-testid={testId}>{value}</dd>
      {si && <dd className="text-caption text-fg-soft tabular-nums">{si}</dd>}
    </div>
  );
}

/** The hold in numbers: microns first, SI beside; the leak rate when the volume is known. */
export function NumbersPanel({ analysis }: { analysis: AnalysisResult }) {
  const d = analysis.decay;
  const pd = analysis.phases?.pulldown;
  const hold = primaryHold(analysis);
  const lr = analysis.leakRate;
  return (
    <Card title="The numbers">
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-3">
        <Item label="Isolated at" value={analysis.isolationAt != null ? minutesShort(analysis.isolationAt) : "Not found"} si={analysis.isolationAt != null ? "from the first reading" : "log may start in the hold"} testId="isolation-at" />
        {pd && <Item label="Lowest before isolating" value={`${microns(pd.lowestMicrons)} µ`} si={pascals(pd.lowestMicrons)} />}
        {d && (
          <>
            <Item label="Hold start" value={`${microns(d.startMicrons)} µ`} si={pascals(d.startMicrons)} />
            <Item label="Hold end" value={`${microns(d.endMicrons)} µ`} si={pascals(d.endMicrons)} />
            <Item label="Rise" value={`${microns(d.riseMicrons)} µ`} si={pascals(d.riseMicrons)} />
            <Item label="Hold time" value={minutesShort(d.holdSeconds)} si={hold && !hold.complete ? "cut short by the end of the log" : undefined} />
            <Item label="Steady climb" value={`${sig3(d.leakRateMicronsPerMinute)} µ/min`} si={`${sig3(d.leakRateMicronsPerMinute * 0.133322)} Pa/min`} />
            <Item label="Plateau" value={d.plateauMicrons != null ? `${microns(d.plateauMicrons)} µ` : "None"} si={d.plateauMicrons != null ? pascals(d.plateauMicrons) : undefined} />
            <Item label="Time constant" value={d.timeConstantSeconds != null ? minutesShort(d.timeConstantSeconds) : "—"} si={d.timeConstantSeconds != null ? "to ~63 % of the plateau" : undefined} />
          </>
        )}
        {hold?.fit && <Item label="Curve shape" value={shapeWords(hold.fit.chosen)} />}
        {analysis.phases?.breakAtSeconds != null && <Item label="Vacuum broken" value={atWords(analysis.phases.breakAtSeconds)} />}
      </dl>
      <p className="mt-2 text-caption text-fg-soft">µ = microns of mercury (mTorr). 1 micron = 0.133322 Pa.</p>
      {lr && (
        <div className="mt-4">
          <h3 className="text-lead font-semibold">Leak rate for {sig3(lr.volumeLitres)} L</h3>
          <dl className="mt-2 grid grid-cols-1 gap-2 sm:grid-cols-3" data-testid="leak-rate">
            <Item label="micron·L/min" value={sig3(lr.micronLitresPerMinute)} />
            <Item label="mbar·L/s" value={scientific(lr.mbarLitresPerSecond)} />
            <Item label="Pa·m³/s" value={scientific(lr.paM3PerSecond)} />
          </dl>
        </div>
      )}
    </Card>
  );
}
