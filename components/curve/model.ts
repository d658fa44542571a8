/**
 * What the decay chart draws, computed from the server's analysis and the stored series.
 * Pure functions, no chart library: x is minutes from the first data row, y is microns.
 */
import { durationWords } from "@/analysis/shared/format";
import type { AnalysisResult, Hold, ModelFit } from "@/analysis/decay/types";
import { storyOf } from "@/lib/verdict/story";
import { bucketExtremes } from "@/analysis/shared/downsample";

export interface XY {
  x: number;
  y: number;
}

export interface CurveModel {
  measured: XY[];
  fitted: XY[];
  band: { low: XY[]; high: XY[]; mid: XY[] };
  pulldown: [number, number] | null;
  hold: [number, number] | null;
  /** Other holds of the log (a re-pull: abandoned before the judged one, or too short after it), minutes. */
  otherHolds: { range: [number, number]; earlier: boolean }[];
  /** Minutes from the first data row, or null when the log has no isolation (it starts in the hold). */
  isolationMinutes: number | null;
  limitMicrons: number;
  targetMicrons: number;
  xMaxMinutes: number;
  yMinMicrons: number;
  yMaxMicrons: number;
}

/** Log axes cannot show 0 or below: readings under 1 micron are drawn at 1. */
const FLOOR_MICRONS = 1;

/**
 * The chosen hold model evaluated at t seconds after isolation:
 * p(t) = p0 + a·(1 − e^(−t/τ)) + l·t, microns (absent terms are zero). Same model family the
 * engine fits (flat, plateau, climb, plateau_climb).
 */
export function fitMicronsAt(fit: ModelFit, tSeconds: number): number {
  const { p0, a, tauSeconds, l } = fit.params;
  let p = p0;
  if (a !== undefined && tauSeconds !== undefined && tauSeconds > 0) p += a * (1 - Math.exp(-tSeconds / tauSeconds));
  if (l !== undefined) p += l * tSeconds;
  return p;
}

/** The primary hold (the one the verdict is about), or the last hold when none is primary. */
export function primaryHold(analysis: AnalysisResult): Hold | null {
  const holds = analysis.phases?.holds ?? analysis.holds ?? [];
  if (holds.length === 0) return null;
  const i = analysis.phases?.primary;
  return i != null && holds[i] ? holds[i] : holds[holds.length - 1];
}

export function chosenFit(hold: Hold | null): ModelFit | null {
  if (!hold?.fit) return null;
  return hold.fit.fits[hold.fit.chosen] ?? null;
}

/**
 * Min/max decimation: at most ~2·buckets points, keeping each bucket's lowest and highest
 * reading in time order, so spikes and the lowest point survive on long logs.
 */
export function decimateMinMax(t: number[], p: number[], buckets = 700): XY[] {
  const n = Math.min(t.length, p.length);
  const out: XY[] = [];
  if (n <= buckets * 2) {
    for (let i = 0; i < n; i++) out.push({ x: t[i] / 60, y: Math.max(FLOOR_MICRONS, p[i]) });
    return out;
  }
  bucketExtremes(p, n, buckets, (lo, hi) => {
    for (const i of lo <= hi ? [lo, hi] : [hi, lo]) {
      if (out.length && out[out.length - 1].x === t[i] / 60) continue;
      out.push({ x: t[i] / 60, y: Math.max(FLOOR_MICRONS, p[i]) });
    }
  });
  return out;
}

export function buildCurve(analysis: AnalysisResult, series: { t: number[]; p: number[] }): CurveModel {
  const measured = decimateMinMax(series.t, series.p);
  const hold = primaryHold(analysis);
  // The fit and the forecast count from the hold's start; the marker only shows a real isolation.
  const isolationSeconds = analysis.isolationAt ?? hold?.isolatedAtSeconds ?? null;
  const fit = chosenFit(hold);
  const fitted: XY[] = [];
  if (fit && hold && isolationSeconds != null) {
    const span = Math.max(0, hold.endSeconds - isolationSeconds);
    for (let k = 0; k <= 80; k++) {
      const tRel = (span * k) / 80;
      fitted.push({ x: (isolationSeconds + tRel) / 60, y: Math.max(FLOOR_MICRONS, fitMicronsAt(fit, tRel)) });
    }
  }
  const band = { low: [] as XY[], high: [] as XY[], mid: [] as XY[] };
  if (analysis.forecast && isolationSeconds != null) {
    for (const b of analysis.forecast.band) {
      const x = (isolationSeconds + b.tSeconds) / 60;
      band.low.push({ x, y: Math.max(FLOOR_MICRONS, b.low) });
      band.high.push({ x, y: Math.max(FLOOR_MICRONS, b.high) });
      band.mid.push({ x, y: Math.max(FLOOR_MICRONS, b.microns) });
    }
  }
  const pd = analysis.phases?.pulldown ?? null;
  const lastT = series.t.length ? series.t[series.t.length - 1] / 60 : 1;
  // loops, not Math.min(...points): a long log's points would all go onto the call stack
  let xMax = Math.max(lastT, 0.5);
  for (const b of band.high) if (b.x > xMax) xMax = b.x;
  let yLow = Infinity;
  let yHigh = -Infinity;
  for (const list of [measured, fitted, band.high, band.low])
    for (const v of list) {
      if (v.y < yLow) yLow = v.y;
      if (v.y > yHigh) yHigh = v.y;
    }
  const holds = analysis.phases?.holds ?? analysis.holds ?? [];
  const otherHolds = holds
    .filter((h) => h !== hold)
    .map((h) => ({ range: [h.isolatedAtSeconds / 60, h.endSeconds / 60] as [number, number], earlier: !hold || h.endSeconds <= hold.isolatedAtSeconds }));
  const limit = analysis.profile.limitMicrons;
  const target = analysis.profile.targetMicrons;
  return {
    measured,
    fitted,
    band,
    pulldown: pd ? [pd.startSeconds / 60, pd.endSeconds / 60] : null,
    hold: hold ? [hold.isolatedAtSeconds / 60, hold.endSeconds / 60] : null,
    otherHolds,
    isolationMinutes: analysis.isolationAt != null ? analysis.isolationAt / 60 : null,
    limitMicrons: limit,
    targetMicrons: target,
    xMaxMinutes: xMax,
    yMinMicrons: Math.max(FLOOR_MICRONS, Math.min(target, yLow) * 0.7),
    yMaxMicrons: Math.max(limit, yHigh) * 1.4,
  };
}

/** "1 h 05 min", "12 min 30 s", "45 s": the shared formatter (analysis/shared/format.ts). */
export { durationWords };

/** 1234.5 → "1,235". */
export function microns(value: number | null | undefined): string {
  if (value == null || !Number.isFinite(value)) return "—";
  return Math.round(value).toLocaleString("en-US");
}

/** A text version of the chart for screen readers. */
export function curveSummary(analysis: AnalysisResult, series: { t: number[]; p: number[] }): string {
  const parts: string[] = [];
  const n = series.p.length;
  if (n === 0) return "No readings.";
  const pd = analysis.phases?.pulldown;
  parts.push(`${n} readings over ${durationWords(series.t[n - 1] - series.t[0])}.`);
  if (pd) parts.push(`Pull-down from ${microns(pd.startMicrons)} to ${microns(pd.lowestMicrons)} microns.`);
  const hold = primaryHold(analysis);
  if (analysis.isolationAt != null) parts.push(`Isolated at ${durationWords(analysis.isolationAt)} from the start.`);
  else parts.push("No isolation point found; the log may start in the hold.");
  const said = storyOf(analysis).holdSentence;
  if (said) parts.push(`During the hold: ${said.charAt(0).toLowerCase()}${said.slice(1)}`);
  if (hold?.fit) parts.push(`Best-fitting shape: ${shapeWords(hold.fit.chosen)}.`);
  const others = (analysis.phases?.holds ?? analysis.holds ?? []).length - (hold ? 1 : 0);
  if (others > 0) parts.push(`${others === 1 ? "One other hold" : `${others} other holds`} (a re-pull) shown lighter; the verdict is on the hold above.`);
  parts.push(`Limit ${microns(analysis.profile.limitMicrons)} microns.`);
  if (analysis.forecast)
    parts.push(`Forecast at ${durationWords(analysis.forecast.atHoldSeconds)} of hold: ${microns(analysis.forecast.predictedMicrons)} microns (between ${microns(analysis.forecast.lowMicrons)} and ${microns(analysis.forecast.highMicrons)}).`);
  return parts.join(" ");
}

export function shapeWords(kind: string): string {
  switch (kind) {
    case "flat":
      return "flat (no real rise)";
    case "plateau":
      return "rises then levels off";
    case "climb":
      return "steady climb";
    case "plateau_climb":
      return "levels off and keeps climbing";
    default:
      return kind;
  }
}
