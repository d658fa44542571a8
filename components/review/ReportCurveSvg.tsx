import type { ReportCurve } from "@/lib/reports/model";
import { logAxisOf } from "@/lib/reports/axis";

/** The report's curve as SVG (prints sharp): log microns against minutes, hold shaded, isolation and limit dashed. */
export function ReportCurveSvg({ curve }: { curve: ReportCurve }) {
  const W = 720;
  const H = 300;
  const L = 64;
  const B = 40;
  const w = W - L - 12;
  const h = H - B - 10;
  const { minLog, maxLog } = logAxisOf(curve);
  const xMax = Math.max(1, ...curve.xMinutes);
  const px = (m: number) => L + (Math.min(Math.max(m, 0), xMax) / xMax) * w;
  const py = (v: number) => 10 + h - ((Math.min(Math.log10(Math.max(v, 10 ** minLog)), maxLog) - minLog) / (maxLog - minLog)) * h;
  const d = curve.xMinutes.map((m, i) => `${i ? "L" : "M"}${px(m).toFixed(1)},${py(curve.microns[i]).toFixed(1)}`).join("");
  const decades = Array.from({ length: maxLog - minLog + 1 }, (_, i) => 10 ** (minLog + i));
  const step = xMax > 120 ? 30 : xMax > 60 ? 15 : xMax > 20 ? 5 : 2;
  const ticks = Array.from({ length: Math.floor(xMax / step) + 1 }, (_, i) => i * step);
  const summary = `Curve: ${curve.xMinutes.length} readings over ${xMax.toFixed(0)} minutes${curve.isolationMinutes != null ? `, isolated at ${curve.isolationMinutes.toFixed(1)} min` : ""}; limit ${curve.limitMicrons} microns.`;
  return (
    <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full text-fg" role="img" aria-label={summary} data-testid="report-curve">
      {curve.hold && <rect x={px(curve.hold.startMinutes)} y={10} width={px(curve.hold.endMinutes) - px(curve.hold.startMinutes)} height={h} fill="#0b6e69" fillOpacity={0.12} />}
      {decades.map((v) => (
        <g key={v}>
          <line x1={L} x2={L + w} y1={py(v)} y2={py(v)} stroke="currentColor" strokeOpacity={0.15} />
          <text x={L - 6} y={py(v) + 4} textAnchor="end" fontSize={11} fill="currentColor">{v.toLocaleString("en-US")}</text>
        </g>
      ))}
      {ticks.map((m) => (
        <text key={m} x={px(m)} y={10 + h + 16} textAnchor="middle" fontSize={11} fill="currentColor">{m}</text>
      ))}
      <text x={L + w / 2} y={H - 4} textAnchor="middle" fontSize={11} fill="currentColor">minutes from the start of the log</text>
      <text x={14} y={10 + h / 2} textAnchor="middle" fontSize={11} fill="currentColor" transform={`rotate(-90 14 ${10 + h / 2})`}>microns (log)</text>
      <rect x={L} y={10} width={w} height={h} fill="none" stroke="currentColor" strokeOpacity={0.6} />
      <line x1={L} x2={L + w} y1={py(curve.limitMicrons)} y2={py(curve.limitMicrons)} stroke="#b3261e" strokeWidth={1.5} strokeDasharray="6 4" />
      <text x={L + 6} y={py(curve.limitMicrons) - 5} fontSize={11} fill="#b3261e">limit {curve.limitMicrons.toLocaleString("en-US")}</text>
      {curve.isolationMinutes != null && (
        <>
          <line x1={px(curve.isolationMinutes)} x2={px(curve.isolationMinutes)} y1={10} y2={10 + h} stroke="#0b6e69" strokeWidth={1.5} strokeDasharray="3 3" />
          <text x={px(curve.isolationMinutes) + 4} y={24} fontSize={11} fill="#0b6e69">isolated</text>
        </>
      )}
      <path d={d} fill="none" stroke="currentColor" strokeWidth={2} strokeLinejoin="round" />
    </svg>
  );
}
