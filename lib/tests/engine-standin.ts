/**
 * STAND-IN — remove when analysis/index.ts (analyzeLog) and analysis/downsample.ts land.
 * The smallest private substitute so the upload pipeline can run end to end: it imports the log
 * with the real importer, takes the lowest reading as isolation and a straight-line slope after it.
 * Its verdicts are NOT the engine's; tests that check verdicts wait for the real engine.
 */
import { importLog } from "@/analysis/import/index";
import { checkOptions } from "@/analysis/profile";
import type { AnalysisResult, AnalyzeOptions, Verdict } from "@/analysis/types";

export function analyzeLog(text: string, raw: AnalyzeOptions = {}): AnalysisResult {
  const { options, profile } = checkOptions(raw);
  const log = importLog(text, options.import ?? {});
  const { tSeconds: t, microns: p } = log;
  let iso = 0;
  for (let i = 1; i < p.length; i++) if (p[i] < p[iso]) iso = i;
  if (options.isolationAtSeconds !== undefined) iso = Math.max(0, t.findIndex((x) => x >= options.isolationAtSeconds!));
  const n = t.length - iso;
  const holdSeconds = t[t.length - 1] - t[iso];
  let verdict: Verdict = "inconclusive";
  let slope = 0;
  if (n >= 6 && holdSeconds > 0) {
    const mt = t.slice(iso).reduce((a, b) => a + b, 0) / n;
    const mp = p.slice(iso).reduce((a, b) => a + b, 0) / n;
    let sxy = 0, sxx = 0;
    for (let i = iso; i < t.length; i++) { sxy += (t[i] - mt) * (p[i] - mp); sxx += (t[i] - mt) ** 2; }
    slope = (sxy / sxx) * 60;
    const end = p[p.length - 1];
    verdict = slope >= profile.leakRateMicronsPerMinute ? "leak" : end > profile.limitMicrons ? "moisture" : "pass";
  }
  return {
    engineVersion: "standin-0",
    verdict,
    confidence: 0.5,
    reasons: ["stand-in analysis"],
    isolationAt: t[iso],
    decay: { startMicrons: p[iso], endMicrons: p[p.length - 1], riseMicrons: p[p.length - 1] - p[iso], holdSeconds, leakRateMicronsPerMinute: Math.max(0, slope), plateauMicrons: null, timeConstantSeconds: null },
    meetsProfile: verdict === "pass",
    profile,
    profileRules: [],
    forecast: null,
    holds: [{ isolatedAtSeconds: t[iso], endSeconds: t[t.length - 1], startMicrons: p[iso], endMicrons: p[p.length - 1], complete: true, endedBy: "end_of_log", fit: null }],
    phases: { pulldown: null, holds: [], primary: 0, breakAtSeconds: null },
    leakRate: null,
    findings: log.findings,
    import: log.summary,
  };
}

/** Bucketed min/max thinning that keeps the given times. */
export function downsampleForChart(tSeconds: number[], microns: number[], maxPoints: number, keepTimes: number[]) {
  if (tSeconds.length <= maxPoints) return { tSeconds: [...tSeconds], microns: [...microns] };
  const keep = new Set<number>([0, tSeconds.length - 1]);
  for (const k of keepTimes) { const i = tSeconds.findIndex((x) => x >= k); if (i >= 0) keep.add(i); }
  const buckets = Math.max(1, Math.floor((maxPoints - keep.size) / 2));
  const size = tSeconds.length / buckets;
  for (let b = 0; b < buckets; b++) {
    let lo = Math.floor(b * size), hi = lo;
    for (let i = Math.floor(b * size); i < Math.min(tSeconds.length, Math.floor((b + 1) * size)); i++) {
      if (microns[i] < microns[lo]) lo = i;
      if (microns[i] > microns[hi]) hi = i;
    }
    keep.add(lo); keep.add(hi);
  }
  const idx = [...keep].sort((a, b) => a - b).slice(0, maxPoints);
  return { tSeconds: idx.map((i) => tSeconds[i]), microns: idx.map((i) => microns[i]) };
}
