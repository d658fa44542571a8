"use client";

/** What one tap on the test page's chart does: exactly one named thing, chosen by the member. */
export type ChartTapMode = "comment" | "isolation";

const CHOICES: { mode: ChartTapMode; label: string; help: string }[] = [
  { mode: "comment", label: "Comment at a minute", help: "A tap fills the comment's minute below; the analysis is not touched." },
  { mode: "isolation", label: "Move the isolation", help: "A tap sets a new isolation time for “Analyse again” below; nothing changes until you analyse again." },
];

/**
 * The chart's tap mode as a radio group above the chart. Without re-analysis (`canMoveIsolation`
 * false) a tap only ever picks a comment's minute, and that is said instead.
 */
export function ChartTapModePicker({ mode, onMode, canMoveIsolation }: { mode: ChartTapMode; onMode: (m: ChartTapMode) => void; canMoveIsolation: boolean }) {
  if (!canMoveIsolation) return <p className="mt-1 text-caption text-fg-soft">A tap on the chart picks the minute for a comment below.</p>;
  const help = CHOICES.find((c) => c.mode === mode)?.help;
  return (
    <fieldset className="mt-2" data-testid="chart-tap-mode">
      <legend className="text-caption font-semibold text-fg-soft">A tap on the chart will</legend>
      <div className="mt-1 flex flex-wrap gap-2">
        {CHOICES.map((c) => (
          <label key={c.mode} className={`inline-flex min-h-tap cursor-pointer items-center gap-2 rounded-lg border px-3 text-body ${mode === c.mode ? "border-tide-600 bg-tide-50 dark:bg-tide-900" : "border-surface-line"}`}>
            <input type="radio" name="chart-tap-mode" value={c.mode} checked={mode === c.mode} onChange={() => onMode(c.mode)} className="h-4 w-4" />
            {c.label}
          </label>
        ))}
      </div>
      {help && <p className="mt-1 text-caption text-fg-soft">{help}</p>}
    </fieldset>
  );
}
