import type { AnalysisResult } from "@/analysis/decay/types";
import { PA_PER_MICRON } from "@/analysis/shared/units";
import { Card } from "@/components/ui";
import { shapeWords, primaryHold } from "@/components/curve/model";
import { storyOf, type StoryNumber } from "@/lib/verdict/story";
import { atWords, microns, minutesShort, pascals, scientific, sig3 } from "./format";

function Item({ label, value, si, testId, title }: { label: string; value: string; si?: string; testId?: string; title?: string }) {
  return (
    <div className="rounded-lg bg-surface-sunken px-3 py-2" title={title}>
      <dt className="text-caption text-fg-soft">{label}</dt>
      <dd className="text-title tabular-nums" data-testid={testId}>{value}</dd>
      {si && <dd className="text-caption text-fg-soft tabular-nums">{si}</dd>}
    </div>
  );
}

/** The SI line under a number: pascals for microns, Pa/min for a rate, the raw reading beside a smoothed one. */
function siOf(n: StoryNumber, holdCut: boolean): string | undefined {
  if (n.beside && n.beside.value !== n.value) return `smoothed; single highest reading ${n.beside.value}`;
  if (n.key === "rate") return `${sig3(n.raw * PA_PER_MICRON)} Pa/min`;
  if (n.key === "hold") return holdCut ? "cut short by the end of the log" : undefined;
  return pascals(n.raw);
}

/**
 * The hold in numbers, each once and from the engine's figures (lib/verdict/story.ts): microns first,
 * SI beside, the raw reading beside a smoothed one, what each number is on hover and in the list below.
 */
export function NumbersPanel({ analysis }: { analysis: AnalysisResult }) {
  const story = storyOf(analysis);
  const pd = analysis.phases?.pulldown;
  const hold = primaryHold(analysis);
  const lr = analysis.leakRate;
  const d = analysis.decay;
  return (
    <Card title="The numbers">
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-3" data-testid="numbers">
        <Item label="Isolated at" value={analysis.isolationAt != null ? minutesShort(analysis.isolationAt) : "Not found"} si={analysis.isolationAt != null ? "from the first reading" : "log may start in the hold"} testId="isolation-at" />
        {pd && <Item label="Lowest before isolating" value={`${microns(pd.lowestMicrons)} µ`} si={`3-reading median · ${pascals(pd.lowestMicrons)}`} title="the lowest reading of the pull-down, as a median of 3 readings so one wild reading does not count" />}
        {story.numbers.map((n) => (
          <Item key={n.key} label={n.label} value={n.value} si={siOf(n, !!hold && !hold.complete)} testId={`number-${n.key}`} title={n.definition} />
        ))}
        {d && d.timeConstantSeconds != null && <Item label="Time constant" value={minutesShort(d.timeConstantSeconds)} si="to ~63 % of the plateau" />}
        {hold?.fit && <Item label="Curve shape" value={shapeWords(hold.fit.chosen)} />}
        {analysis.phases?.breakAtSeconds != null && <Item label="Vacuum broken" value={atWords(analysis.phases.breakAtSeconds)} />}
      </dl>
      <p className="mt-2 text-caption text-fg-soft">µ = microns of mercury (mTorr). 1 micron = 0.133322 Pa.</p>
      {story.numbers.length > 0 && (
        <details className="mt-2">
          <summary className="inline-flex min-h-tap cursor-pointer items-center text-body text-tide-700 underline dark:text-tide-300">What each number is</summary>
          <dl className="mt-1 space-y-1 text-caption" data-testid="number-definitions">
            {story.numbers.map((n) => (
              <div key={n.key}>
                <dt className="inline font-semibold">{n.label}: </dt>
                <dd className="inline text-fg-soft">
                  {n.definition}
                  {n.beside ? `; beside it, ${n.beside.definition}` : ""}.
                </dd>
              </div>
            ))}
          </dl>
        </details>
      )}
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
