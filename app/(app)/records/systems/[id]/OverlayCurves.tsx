import type { Sparkline } from "@/lib/review/sparkline";

/**
 * Every test's curve on one log-scale chart, aligned at isolation (t = 0), newest darkest, so a
 * system that used to hold and now climbs is plain to see. Server-rendered SVG.
 */
export function OverlayCurves({ curves }: { curves: { id: string; label: string; curve: Sparkline | null }[] }) {
  const usable = curves.filter((c) => c.curve && c.curve.isolationMinutes != null) as { id: string; label: string; curve: Sparkline & { isolationMinutes: number } }[];
  if (usable.length === 0) return <p className="text-body text-fg-soft">No curve with an isolation point yet.</p>;
  const W = 720, H = 260, L = 56, B = 34;
  const w = W - L - 10, h = H - B - 10;
  const rel = usable.map((c) => c.curve.xMinutes.map((x) => x - c.curve.isolationMinutes));
  const xMin = Math.max(-10, Math.min(...rel.flat()));
  const xMax = Math.max(1, ...rel.flat());
  const logs = usable.flatMap((c) => c.curve.microns.map((m) => Math.log10(Math.max(1, m))));
  const lo = Math.floor(Math.min(...logs)), hi = Math.max(lo + 1, Math.ceil(Math.max(...logs)));
  const px = (m: number) => L + ((Math.min(Math.max(m, xMin), xMax) - xMin) / (xMax - xMin)) * w;
  const py = (v: number) => 10 + h - ((Math.log10(Math.max(1, v)) - lo) / (hi - lo)) * h;
  return (
    <figure>
      <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full text-fg" role="img" aria-label={`${usable.length} curves overlaid, aligned at isolation`}>
        {Array.from({ length: hi - lo + 1 }, (_, i) => 10 ** (lo + i)).map((v) => (
          <g key={v}>
            <line x1={L} x2={L + w} y1={py(v)} y2={py(v)} stroke="currentColor" strokeOpacity={0.15} />
            <text x={L - 6} y={py(v) + 4} fontSize={11} textAnchor="end" fill="currentColor">{v.toLocaleString("en-US")}</text>
          </g>
        ))}
        <line x1={px(0)} x2={px(0)} y1={10} y2={10 + h} stroke="#0b6e69" strokeDasharray="3 3" />
        <text x={px(0) + 4} y={22} fontSize={11} fill="#0b6e69">isolated</text>
        {[xMin, 0, xMax].map((m) => (
          <text key={m} x={px(m)} y={10 + h + 14} fontSize={11} textAnchor="middle" fill="currentColor">{Math.round(m)}</text>
        ))}
        <text x={L + w / 2} y={H - 6} fontSize={11} textAnchor="middle" fill="currentColor">minutes from isolation</text>
        {usable.map((c, i) => (
          <path
            key={c.id}
            d={c.curve.microns
              .map((m, j) => [rel[i][j], m] as const)
              .filter(([x]) => x >= xMin) // the pull-down before the window is left out, not squashed onto its edge
              .map(([x, m], j) => `${j ? "L" : "M"}${px(x).toFixed(1)},${py(m).toFixed(1)}`)
              .join("")}
            fill="none"
            stroke="currentColor"
            strokeOpacity={i === 0 ? 1 : Math.max(0.2, 0.7 - i * 0.12)}
            strokeWidth={i === 0 ? 2.2 : 1.3}
          />
        ))}
      </svg>
      <figcaption className="text-caption text-fg-soft">Darkest: {usable[0].label}. Older tests are paler.</figcaption>
    </figure>
  );
}
