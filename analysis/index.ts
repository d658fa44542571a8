/**
 * The analysis engine's one entry: a gauge log in, a verdict with its reasons, numbers, forecast and
 * findings out. Pure: no I/O. Throws only LogError on bad input or options.
 *
 *   analyzeLog(text, options)      — CSV text as exported by a gauge
 *   analyzeReadings(log, options)  — readings already in hand (typed in, or imported earlier)
 */
import { chosenFit, classifyHold, type HoldEvidence } from "./decay/classify";
import { diagnose } from "./decay/diagnose";
import { fitHoldModels } from "./decay/fit";
import { holdFigures, judgedHighest } from "./decay/figures";
import { earlyCallWithVerdict, forecastHold } from "./decay/forecast";
import { importLog } from "./decay/import";
import { judgeFieldHolds, spikeMask, spikeSecondsOf } from "./decay/holds";
import { findPhases } from "./decay/phases";
import { checkOptions } from "./decay/profile";
import type { AcceptanceProfile, AnalysisResult, AnalyzeOptions, Forecast, HoldFigures, HoldFitResult, ImportedLog, LeakRate } from "./decay/types";
import { leakRateFromRise, systemVolumeLitres } from "./shared/volume";
import { LogError } from "./shared/errors";

export const ENGINE_VERSION = "0.2.0";

export { DEFAULT_PROFILE } from "./decay/profile";
export { downsampleForChart } from "./shared/downsample";

/** Analyse a gauge log given as text (CSV, semicolon or tab separated, as exported). */
export function analyzeLog(text: string, options: AnalyzeOptions = {}): AnalysisResult {
  const checked = checkOptions(options);
  const log = importLog(text, checked.options.import ?? {});
  return analyzeChecked(log, checked.options, checked.profile);
}

/** Analyse readings already in hand (seconds from the first row, microns). */
export function analyzeReadings(log: ImportedLog, options: AnalyzeOptions = {}): AnalysisResult {
  const checked = checkOptions(options);
  if (!log || !Array.isArray(log.tSeconds) || !Array.isArray(log.microns) || log.tSeconds.length !== log.microns.length) {
    throw new LogError("invalid_option", "readings: tSeconds and microns must be arrays of the same length");
  }
  return analyzeChecked(log, checked.options, checked.profile);
}

/** The reading a full sort puts at ⌊n/2⌋ (a reading of the log, not the mean of two as simple-statistics' median gives; kept so the ambient figure stays as it was). */
function median(values: number[]): number | null {
  const v = values.filter(Number.isFinite).sort((a, b) => a - b);
  return v.length ? v[v.length >> 1] : null;
}

/**
 * Ordinary least-squares slope of the last half of p[from..to] against t, microns per minute (null under 3
 * readings), `skip` left out. Summed in place rather than by simple-statistics' linearRegression, which
 * takes an array of [x, y] pairs: one allocation per reading over a hold of up to a million.
 */
function lateSlopePerMinute(t: number[], p: number[], from: number, to: number, skip: Uint8Array): number | null {
  const mid = t[from] + (t[to] - t[from]) / 2;
  let n = 0;
  let sx = 0;
  let sy = 0;
  let sxx = 0;
  let sxy = 0;
  for (let i = to; i >= from && t[i] >= mid; i--) {
    if (skip[i - from]) continue;
    const x = t[i] - mid;
    n++;
    sx += x;
    sy += p[i];
    sxx += x * x;
    sxy += x * p[i];
  }
  const cxx = sxx - (sx * sx) / n;
  if (n < 3 || cxx <= 0) return null;
  return ((sxy - (sx * sy) / n) / cxx) * 60;
}

/**
 * How many readings from the first on have a finite time and a finite reading above zero. A small
 * function of its own, so that its loop is compiled with the arrays' types alone (analyzeChecked is
 * called once per log and would run a long loop in the interpreter).
 */
function leadingUsableCount(tSeconds: number[], microns: number[]): number {
  const n = tSeconds.length;
  let i = 0;
  while (i < n && microns[i] > 0 && Number.isFinite(microns[i]) && Number.isFinite(tSeconds[i])) i++;
  return i;
}

/** The hold's readings as the fit saw them: seconds after isolation, spikes it left out removed. */
function holdDataOf(t: number[], p: number[], start: number, end: number, excluded: number[]): { tSeconds: Float64Array; microns: Float64Array } {
  const skip = new Set(excluded);
  const n = end - start + 1 - skip.size;
  const tSeconds = new Float64Array(Math.max(n, 0));
  const microns = new Float64Array(Math.max(n, 0));
  let k = 0;
  for (let i = start; i <= end; i++) {
    if (skip.has(i - start)) continue;
    tSeconds[k] = t[i] - t[start];
    microns[k++] = p[i];
  }
  return { tSeconds, microns };
}

function fitHold(t: number[], p: number[], start: number, end: number): HoldFitResult | null {
  if (end - start + 1 < 3) return null;
  const tRel = new Float64Array(end - start + 1);
  const pHold = new Float64Array(end - start + 1);
  for (let i = start; i <= end; i++) {
    tRel[i - start] = t[i] - t[start];
    pHold[i - start] = p[i];
  }
  try {
    return fitHoldModels(tRel, pHold, { robust: true });
  } catch (e) {
    if (e instanceof LogError) return null;
    throw e;
  }
}

function analyzeChecked(log: ImportedLog, options: AnalyzeOptions, profile: AcceptanceProfile): AnalysisResult {
  // An absolute gauge cannot read zero or below: those readings are left out and reported. The
  // usual log has none (and no non-finite value), and is then used as it is, without a copy:
  // nothing below writes into the readings.
  const { tSeconds, microns } = log;
  const n = tSeconds.length;
  const clean = leadingUsableCount(tSeconds, microns);
  let t: number[] = tSeconds;
  let p: number[] = microns;
  const nonPositiveSeconds: number[] = [];
  if (clean < n) {
    t = tSeconds.slice(0, clean);
    p = microns.slice(0, clean);
    for (let i = clean; i < n; i++) {
      const v = microns[i];
      if (!Number.isFinite(v) || !Number.isFinite(tSeconds[i])) continue;
      if (v <= 0) nonPositiveSeconds.push(tSeconds[i]);
      else {
        t.push(tSeconds[i]);
        p.push(v);
      }
    }
  }
  if (t.length < 3) throw new LogError("too_few_readings", `only ${t.length} readings above zero; at least 3 are needed`);

  const holdSeconds = profile.holdMinutes * 60;
  const pa = findPhases(t, p, log.overRangeSeconds ?? [], {
    isolationAtSeconds: options.isolationAtSeconds,
    holdWindow: options.holdWindow,
    holdSeconds,
  });
  pa.ranges.forEach((r, k) => {
    const hold = pa.phases.holds[k];
    hold.fit = fitHold(t, p, r.startIndex, r.endIndex);
    hold.spikeSeconds = spikeSecondsOf(hold.fit, t, r.startIndex);
  });

  const primary = pa.phases.primary;
  let evidence: HoldEvidence | null = null;
  let fit: HoldFitResult | null = null;
  let forecast: Forecast | null = null;
  let highest: ReturnType<typeof judgedHighest> | null = null;
  if (primary !== null) {
    const r = pa.ranges[primary];
    const hold = pa.phases.holds[primary];
    fit = hold.fit;
    const observed = hold.endSeconds - hold.isolatedAtSeconds;
    const skip = spikeMask(fit, r.endIndex - r.startIndex + 1);
    // over the whole hold, not only its first `holdSeconds`: a hold that passes the limit later is not tight
    highest = judgedHighest(t, p, r.startIndex, r.endIndex, Infinity, skip);
    evidence = {
      holdSeconds: observed,
      readings: r.endIndex - r.startIndex + 1,
      startMicrons: hold.startMicrons,
      endMicrons: p[r.endIndex],
      maxMicrons: highest.smoothedMicrons,
      rawMaxMicrons: highest.rawMicrons,
      isolationSeen: r.isolationSeen,
      lateSlopeMicronsPerMinute: lateSlopePerMinute(t, p, r.startIndex, r.endIndex, skip),
    };
    // A forecast only looks ahead of the data: none once the hold reached the profile's hold time.
    if (fit && chosenFit(fit) && observed < holdSeconds) {
      try {
        forecast = forecastHold(fit, observed, profile, holdDataOf(t, p, r.startIndex, r.endIndex, chosenFit(fit)!.excluded));
      } catch (e) {
        if (!(e instanceof LogError)) throw e;
      }
    }
  }
  const c = judgeFieldHolds(classifyHold(fit, evidence, profile, forecast), pa, t, p, evidence, profile);
  if (forecast) forecast = earlyCallWithVerdict(forecast, c.verdict, c.profileRules.some((x) => x.rule === "leak_rate" && !x.met));
  let figures: HoldFigures | null = null;
  if (primary !== null && highest) {
    const r = pa.ranges[primary];
    figures = holdFigures({
      t, p, from: r.startIndex, to: r.endIndex, isolationSeen: r.isolationSeen, profileHoldSeconds: holdSeconds,
      model: chosenFit(fit), climbMicronsPerMinute: c.climbMicronsPerMinute, judged: highest,
      skip: spikeMask(fit, r.endIndex - r.startIndex + 1),
    });
  }
  // a reading that may be 1,000-fold off must be impossible to miss: the doubt goes with the verdict
  const doubt = log.summary.unsureReasons?.find((u) => u.code === "decimal_mark");
  const reasons = doubt ? [...c.reasons, `Check the readings before relying on this: ${doubt.message}`] : c.reasons;

  let leakRate: LeakRate | null = null;
  if (options.volume && c.decay && c.climbMicronsPerMinute > 0) {
    const litres = systemVolumeLitres(options.volume);
    if (litres !== null && litres > 0) leakRate = leakRateFromRise(c.climbMicronsPerMinute, litres);
  }

  const ambientC = options.ambientC ?? (log.temperatureC ? median(log.temperatureC) : null);
  const findings = [
    ...(log.findings ?? []),
    ...diagnose({
      tSeconds: t,
      microns: p,
      nonPositiveSeconds,
      phases: pa,
      profile,
      verdict: c.verdict,
      decay: c.decay,
      climbMicronsPerMinute: c.climbMicronsPerMinute,
      holdReadings: evidence?.readings ?? 0,
      ambientC,
    }),
  ];

  const isolationAt = primary !== null && pa.ranges[primary].isolationSeen ? pa.phases.holds[primary].isolatedAtSeconds : null;
  return {
    engineVersion: ENGINE_VERSION,
    verdict: c.verdict,
    confidence: c.confidence,
    reasons,
    isolationAt,
    decay: c.decay,
    meetsProfile: c.meetsProfile,
    profile,
    profileRules: c.profileRules,
    forecast,
    holds: pa.phases.holds,
    phases: pa.phases,
    leakRate,
    findings,
    import: log.summary,
    figures,
    certainty: c.certainty,
  };
}
