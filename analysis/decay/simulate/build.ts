/**
 * Turns a SimulationParams into readings (sampling, noise, display resolution, over-range, faults)
 * and the truth, then renders the text.
 */
import type { Verdict } from "../types";
import { DEFAULT_PROFILE, MIN_HOLD_READINGS } from "../profile";
import { holdMicrons, makePulldownCurve, type PulldownCurve } from "./curve";
import type { HoldSpec, SimulatedHoldTruth, SimulatedLog, SimulationParams, SimulationTruth } from "./params";
import { makeRng } from "./prng";
import { applyFieldArtifacts } from "./artifacts";
import { renderLog, type RenderRow } from "./render";

interface Segment {
  kind: "pulldown" | "hold" | "break";
  startSeconds: number;
  endSeconds: number;
  attempt: number;
  curve?: PulldownCurve;
  isolationMicrons?: number;
}

/** Display resolution of a typical digital gauge: 1 micron below 1,000, 10 below 10,000, then 100. */
function displayRound(microns: number): number {
  const step = microns < 1000 ? 1 : microns < 10000 ? 10 : 100;
  return Math.round(microns / step) * step;
}

/**
 * Verdict the analysis should reach for a hold with these true numbers under the default profile.
 * Out of the gauge's range within the hold time (with three readings) → a gross leak. Too few
 * readings → inconclusive; shorter than the profile's hold and not yet over the limit →
 * inconclusive; otherwise a climb at or above the leak threshold is a leak, a level-off above the
 * limit is moisture, both is leak_and_moisture.
 */
export function truthVerdict(v: {
  holdSeconds: number;
  holdReadings: number;
  leakMicronsPerMinute: number;
  plateauMicrons: number | null;
  maxMicrons: number;
  /** Seconds after isolation at which the reading left the gauge's range, or null. */
  leftRangeSeconds?: number | null;
}): Verdict {
  const p = DEFAULT_PROFILE;
  // climbing out of the gauge's range within the hold time is a gross leak, on three readings already
  const outOfRange = v.leftRangeSeconds != null && v.leftRangeSeconds <= p.holdMinutes * 60 && v.holdReadings >= 3;
  if (outOfRange) return v.plateauMicrons !== null && v.plateauMicrons > p.limitMicrons ? "leak_and_moisture" : "leak";
  if (v.holdReadings < MIN_HOLD_READINGS) return "inconclusive";
  if (v.holdSeconds < p.holdMinutes * 60 && v.maxMicrons <= p.limitMicrons) return "inconclusive";
  const leak = v.leakMicronsPerMinute >= p.leakRateMicronsPerMinute;
  const moisture = v.plateauMicrons !== null && v.plateauMicrons > p.limitMicrons;
  if (leak && moisture) return "leak_and_moisture";
  if (leak) return "leak";
  if (moisture) return "moisture";
  return "pass";
}

export function simulateFromParams(params: SimulationParams, scenario: string | null = null, findings: string[] = []): SimulatedLog {
  const rng = makeRng(params.seed * 7919 + 17);
  // lay out the segments on the true time axis (t = 0 at the first reading)
  const segments: Segment[] = [];
  let clock = 0;
  let pressure = 0;
  params.attempts.forEach((attempt, k) => {
    if (attempt.pulldown) {
      const spec = k === 0 ? attempt.pulldown : { ...attempt.pulldown, startMicrons: pressure };
      const curve = makePulldownCurve(spec, rng);
      segments.push({ kind: "pulldown", startSeconds: clock, endSeconds: clock + spec.durationSeconds, attempt: k, curve });
      clock += spec.durationSeconds;
      pressure = curve.endMicrons;
    } else {
      pressure = attempt.isolationMicrons ?? 300;
      clock = -(params.startOffsetSeconds ?? 0);
    }
    segments.push({ kind: "hold", startSeconds: clock, endSeconds: clock + attempt.hold.holdSeconds, attempt: k, isolationMicrons: pressure });
    clock += attempt.hold.holdSeconds;
    pressure = holdMicrons(attempt.hold, pressure, attempt.hold.holdSeconds);
  });
  if (params.breakSeconds) {
    segments.push({ kind: "break", startSeconds: clock, endSeconds: clock + params.breakSeconds, attempt: -1 });
    clock += params.breakSeconds;
  }
  const endSeconds = clock;

  const trueAt = (t: number): { microns: number; seg: Segment } => {
    let seg = segments[segments.length - 1];
    for (const s of segments) if (t <= s.endSeconds) { seg = s; break; }
    if (seg.kind === "pulldown") return { microns: seg.curve!.at(t - seg.startSeconds), seg };
    if (seg.kind === "hold") {
      const attempt = params.attempts[seg.attempt];
      return { microns: holdMicrons(attempt.hold, seg.isolationMicrons!, t - seg.startSeconds), seg };
    }
    // vacuum broken with refrigerant or air: the reading shoots past the gauge range in seconds
    const since = t - seg.startSeconds;
    return { microns: since < 2 ? pressure + 6000 * since : 760000, seg };
  };

  // sampling with jitter; the first row is at t = 0
  const times: number[] = [];
  for (let t = 0; t <= endSeconds; ) {
    times.push(t);
    t += params.sampleSeconds * (1 + params.jitterFraction * (rng.next() - 0.5));
  }
  const rows: RenderRow[] = [];
  const holdCounts = new Map<number, number>();
  const holdMax = new Map<number, number>();
  for (const t of times) {
    const { microns, seg } = trueAt(t);
    if (seg.kind === "hold") {
      holdCounts.set(seg.attempt, (holdCounts.get(seg.attempt) ?? 0) + (microns <= params.gaugeMaxMicrons ? 1 : 0));
      holdMax.set(seg.attempt, Math.max(holdMax.get(seg.attempt) ?? 0, microns));
    }
    let reading = microns * (1 + params.noiseFraction * rng.normal());
    if (rng.chance(params.spikeRate)) reading *= rng.chance(0.5) ? rng.uniform(0.4, 0.7) : rng.uniform(1.5, 2.5);
    reading = displayRound(Math.max(reading, 1));
    if (reading > params.gaugeMaxMicrons) rows.push({ tSeconds: t, microns: null, marker: params.overRangeMarker, temperatureC: params.ambientC });
    else rows.push({ tSeconds: t, microns: reading, temperatureC: params.ambientC });
  }

  applySensorFaults(rows, params, segments, rng);

  // field artifacts on the readings (their own generator); a long over-range start moves every time by `sh`
  const lastHoldSeg = segments.filter((s) => s.kind === "hold").at(-1)!;
  let sh = 0;
  let written = rows;
  if (params.artifacts && params.artifacts.length > 0) {
    const applied = applyFieldArtifacts(rows, params.artifacts, { startSeconds: Math.max(lastHoldSeg.startSeconds, 0), endSeconds: lastHoldSeg.endSeconds }, params.seed, params.sampleSeconds, params.gaugeMaxMicrons);
    written = applied.rows;
    sh = applied.shiftSeconds;
  }

  // truth of every hold and of the primary (the last complete one; complete = ran its planned time)
  const holds: SimulatedHoldTruth[] = [];
  segments.forEach((s, i) => {
    if (s.kind !== "hold") return;
    const next = segments[i + 1];
    const inRangeEnd = lastInRangeBefore(rows, s.startSeconds, s.endSeconds);
    holds.push({
      isolationAtSeconds: s.startSeconds < 0 || params.attempts[s.attempt].pulldown === null ? null : s.startSeconds + sh,
      endSeconds: inRangeEnd + sh,
      endedBy: next ? (next.kind === "break" ? "break" : "pulldown") : inRangeEnd < s.endSeconds - params.sampleSeconds * 1.5 ? "break" : "end_of_log",
    });
  });
  const primary = holds.length - 1;
  const lastAttempt = params.attempts.length - 1;
  const last = params.attempts[lastAttempt];
  const holdSeg = segments.filter((s) => s.kind === "hold")[lastAttempt];
  const isolationMicrons = holdSeg.isolationMicrons!;
  const holdStart = Math.max(holdSeg.startSeconds, 0) + sh;
  const holdSeconds = holds[primary].endSeconds - holdStart;
  const plateauMicrons = last.hold.plateauRiseMicrons > 0 ? isolationMicrons + last.hold.plateauRiseMicrons : null;
  // the analysis counts the lowest reading before the rise as the hold's first
  const holdReadings = (holdCounts.get(lastAttempt) ?? 0) + (holds[primary].isolationAtSeconds !== null ? 1 : 0);
  const truth: SimulationTruth = {
    scenario,
    seed: params.seed,
    verdict: truthVerdict({
      holdSeconds,
      holdReadings,
      leakMicronsPerMinute: last.hold.leakMicronsPerMinute,
      plateauMicrons,
      maxMicrons: holdMax.get(lastAttempt) ?? isolationMicrons,
      leftRangeSeconds: leftRangeAfter(last.hold, isolationMicrons, params.gaugeMaxMicrons),
    }),
    isolationAtSeconds: holds[primary].isolationAtSeconds,
    isolationMicrons,
    leakRateMicronsPerMinute: last.hold.leakMicronsPerMinute,
    plateauMicrons,
    tauSeconds: last.hold.plateauRiseMicrons > 0 ? last.hold.tauSeconds : null,
    holdSeconds,
    holdReadings,
    holds,
    primary,
    findings,
    sampleSeconds: params.sampleSeconds,
    layout: params.layout,
    unit: params.unit,
    artifacts: params.artifacts ?? [],
  };
  const text = renderLog(written, { layout: params.layout, unit: params.unit, startIso: params.startIso });
  return { text, truth, tSeconds: written.map((r) => r.tSeconds), microns: written.map((r) => r.microns) };
}

/** Seconds after isolation at which the noise-free hold passes the gauge's top, or null within the hold. */
function leftRangeAfter(hold: HoldSpec, isolationMicrons: number, gaugeMaxMicrons: number): number | null {
  for (let s = 0; s <= hold.holdSeconds; s += 1) if (holdMicrons(hold, isolationMicrons, s) > gaugeMaxMicrons) return s;
  return null;
}

function lastInRangeBefore(rows: RenderRow[], fromSeconds: number, toSeconds: number): number {
  let last = Math.max(fromSeconds, 0);
  for (const r of rows) {
    if (r.tSeconds > toSeconds) break;
    if (r.tSeconds >= fromSeconds && r.microns !== null) last = r.tSeconds;
  }
  return last;
}

/** Sensor faults: a stuck display during the pull-down, a few zeros, a few impossible jumps. */
function applySensorFaults(rows: RenderRow[], params: SimulationParams, segments: Segment[], rng: ReturnType<typeof makeRng>): void {
  const fault = params.sensorFault;
  if (!fault) return;
  const pull = segments.find((s) => s.kind === "pulldown");
  const inPull = rows
    .map((r, i) => ({ r, i }))
    .filter(({ r }) => pull && r.tSeconds > pull.startSeconds + 0.2 * (pull.endSeconds - pull.startSeconds) && r.tSeconds < pull.endSeconds - 120 && r.microns !== null);
  if (fault.flatRun && inPull.length > 10) {
    const length = Math.max(30, Math.ceil(360 / params.sampleSeconds));
    const start = inPull[0].i;
    const value = rows[start].microns;
    for (let i = start; i < Math.min(rows.length, start + length) && i <= inPull[inPull.length - 1].i; i++) rows[i].microns = value;
  }
  const candidates = rows.map((r, i) => ({ r, i })).filter(({ r }) => r.microns !== null);
  if (fault.zeros) for (let k = 0; k < 4; k++) rng.pick(candidates).r.microns = 0;
  if (fault.jumps) {
    for (let k = 0; k < 6; k++) {
      const c = rng.pick(candidates);
      if (c.r.microns !== null && c.r.microns > 0) c.r.microns = Math.min(displayRound(c.r.microns * 10), params.gaugeMaxMicrons);
    }
  }
}
