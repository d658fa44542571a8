import type { Sparkline as SparklineData } from "@/lib/review/sparkline";

/**
 * A tiny log-scale curve (SVG, no chart library): readings, the isolation tick, the limit dashed.
 * Decorative beside a verdict in words, so it is hidden from screen readers unless labelled.
 */
export function Sparkline({ data, width = 120, height = 36, label, className }: { data: SparklineData | null; width?: number; height?: number; label?: string; className?: string }) {
  if (!data || data.microns.length < 2) return <span className="inline-block text-caption text-fg-faint" style={{ width }}>no curve</span>;
  const ys = data.microns.map((m) => Math.log10(Math.max(1, m)));
  const limitLog = data.limitMicrons ? Math.log10(data.limitMicrons) : null;
  const lo = Math.min(...ys, limitLog ?? Infinity);
  const hi = Math.max(...ys, limitLog ?? -Infinity);
  const span = hi - lo || 1;
  const x0 = data.xMinutes[0];
  const xSpan = data.xMinutes[data.xMinutes.length - 1] - x0 || 1;
  const px = (m: number) => ((m - x0) / xSpan) * (width - 2) + 1;
  const py = (l: number) => height - 2 - ((l - lo) / span) * (height - 4);
  const d = ys.map((l, i) => `${i ? "L" : "M"}${px(data.xMinutes[i]).toFixed(1)},${py(l).toFixed(1)}`).join("");
  return (
    <svg width={width} height={height} viewBox={`0 0 ${width} ${height}`} className={className} role={label ? "img" : undefined} aria-label={label} aria-hidden={label ? undefined : true}>
      {data.isolationMinutes != null && (
        <line x1={px(data.isolationMinutes)} x2={px(data.isolationMinutes)} y1={0} y2={height} stroke="currentColor" strokeOpacity={0.35} strokeDasharray="2 2" />
      )}
      {limitLog != null && <line x1={0} x2={width} y1={py(limitLog)} y2={py(limitLog)} stroke="#b3261e" strokeDasharray="3 2" strokeWidth={1} />}
      <path d={d} fill="none" stroke="currentColor" strokeWidth={1.5} strokeLinejoin="round" />
    </svg>
  );
}
