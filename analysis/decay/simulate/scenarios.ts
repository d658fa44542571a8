/**
 * Named scenarios: each draws physically shaped parameters from the seed and knows which
 * verdict and findings the log should give. All data invented.
 */
import type { PressureUnit } from "../types";
import { holdMicrons, makePulldownCurve, type HoldSpec, type PulldownSpec } from "./curve";
import type { AttemptSpec, SimulationParams } from "./params";
import { makeRng, type Rng } from "./prng";
import type { FieldArtifact } from "./artifacts";
import { FIELD_LAYOUT_UNITS, LAYOUTS, UNITS, type Layout } from "./render";

export const SCENARIOS = [
  "tight_dry",
  "moisture",
  "leak",
  "leak_and_moisture",
  "gross_leak",
  "target_not_reached",
  "slow_pulldown",
  "oil_oscillation",
  "frozen_moisture",
  "sensor_fault",
  "short_hold",
  "sparse",
  "multi_attempt",
] as const;
export type BaseScenario = (typeof SCENARIOS)[number];

/**
 * Scenarios of field logs, drawn only when asked (the named ones above keep their seeds' logs):
 * readings typed by hand once a minute from the start of the hold, and a gross leak that climbs out of
 * the gauge's range within a minute or two of isolation, leaving three or a few readings in range.
 */
export const FIELD_SCENARIOS = ["typed_minutes", "gross_out_of_range"] as const;
export type FieldScenario = (typeof FIELD_SCENARIOS)[number];
export type Scenario = BaseScenario | FieldScenario;

export interface ScenarioOptions {
  scenario: Scenario;
  seed: number;
  layout?: Layout;
  unit?: PressureUnit;
  /** Mean seconds between readings (default drawn from 1–60 s, log-uniform). */
  sampleSeconds?: number;
  noiseFraction?: number;
  /** Start the log in the hold (no pull-down); not for scenarios about the pull-down. */
  startInHold?: boolean;
  /** End with the vacuum broken (reading leaves the gauge range). */
  breakAtEnd?: boolean;
  /** Length of the (last) hold in minutes. */
  holdMinutes?: number;
  /** What field logs carry on top (artifacts.ts). */
  artifacts?: FieldArtifact[];
}

interface Drawn {
  attempts: AttemptSpec[];
  findings: string[];
  sampleSeconds?: number;
  startInHoldAllowed: boolean;
  sensorFault?: SimulationParams["sensorFault"];
}

/** Pull-down that ends when the noise-free curve first reaches `isolateAtMicrons` (or after maxSeconds). */
function pulldownTo(rng: Rng, base: Omit<PulldownSpec, "durationSeconds">, isolateAtMicrons: number, maxSeconds = 4 * 3600): PulldownSpec {
  const probe = makePulldownCurve({ ...base, oilOscillation: false, durationSeconds: maxSeconds }, rng);
  let t = 0;
  while (t < maxSeconds && probe.at(t) > isolateAtMicrons) t += 2;
  return { ...base, durationSeconds: Math.max(t, 120) };
}

function basePulldown(rng: Rng): Omit<PulldownSpec, "durationSeconds"> {
  return {
    startMicrons: rng.logUniform(30000, 760000),
    ultimateMicrons: rng.uniform(15, 120),
    fastTauSeconds: rng.uniform(30, 120),
    speedKneeMicrons: rng.uniform(200, 1200),
    moistureMicrons: rng.uniform(200, 2500),
    moistureTauSeconds: rng.uniform(300, 1200),
  };
}

const tightHold = (rng: Rng, iso: number, minutes: number): HoldSpec => ({
  holdSeconds: minutes * 60,
  plateauRiseMicrons: rng.uniform(40, Math.max(60, 780 - iso)),
  tauSeconds: rng.uniform(30, 300),
  leakMicronsPerMinute: 0,
});

const moistureHold = (rng: Rng, iso: number, minutes: number, leak = 0): HoldSpec => ({
  holdSeconds: minutes * 60,
  plateauRiseMicrons: rng.uniform(1400, 4000) - iso,
  tauSeconds: rng.uniform(45, Math.min(400, (minutes * 60) / 3)),
  leakMicronsPerMinute: leak,
});

const leakHold = (rng: Rng, minutes: number, lo = 40, hi = 600): HoldSpec => ({
  holdSeconds: minutes * 60,
  plateauRiseMicrons: 0,
  tauSeconds: 60,
  leakMicronsPerMinute: rng.logUniform(lo, hi),
});

function draw(o: ScenarioOptions, rng: Rng): Drawn {
  const minutes = o.holdMinutes ?? rng.uniform(11, 25);
  const iso = rng.uniform(200, 460);
  const normal = (hold: HoldSpec, findings: string[], pd = basePulldown(rng)): Drawn => ({
    attempts: [{ pulldown: pulldownTo(rng, pd, iso), hold, isolationMicrons: iso }],
    findings,
    startInHoldAllowed: true,
  });
  switch (o.scenario) {
    case "tight_dry":
      return normal(tightHold(rng, iso, minutes), []);
    case "moisture":
      return normal(moistureHold(rng, iso, Math.max(minutes, 14)), ["moisture"]);
    case "leak":
      return normal(leakHold(rng, minutes), ["leak"]);
    case "leak_and_moisture":
      return normal(moistureHold(rng, iso, Math.max(minutes, 15), rng.logUniform(60, 300)), ["leak", "moisture"]);
    case "gross_leak": {
      const d = normal({ ...leakHold(rng, 60, 2000, 9000) }, ["gross_leak", "leak"]);
      // the hold runs until the reading has left the gauge range for a minute or two
      const h = d.attempts[0].hold;
      h.holdSeconds = ((25000 - iso) / h.leakMicronsPerMinute) * 60 + rng.uniform(60, 180);
      return d;
    }
    case "target_not_reached": {
      const pd = { ...basePulldown(rng), ultimateMicrons: rng.uniform(600, 760), moistureMicrons: rng.uniform(100, 600) };
      const isoHigh = pd.ultimateMicrons * 1.06;
      return {
        attempts: [{ pulldown: pulldownTo(rng, pd, isoHigh, 2 * 3600), hold: { ...tightHold(rng, isoHigh, minutes), plateauRiseMicrons: rng.uniform(30, 900 - isoHigh) } }],
        findings: ["target_not_reached"],
        startInHoldAllowed: false,
      };
    }
    case "slow_pulldown": {
      const pd = { ...basePulldown(rng), fastTauSeconds: rng.uniform(420, 900), startMicrons: rng.logUniform(20000, 60000) };
      return { ...normal(tightHold(rng, iso, minutes), ["slow_pulldown"], pd), startInHoldAllowed: false, sampleSeconds: rng.uniform(10, 60) };
    }
    case "oil_oscillation": {
      const pd = { ...basePulldown(rng), ultimateMicrons: rng.uniform(10, 30), moistureMicrons: rng.uniform(300, 800) };
      const isoLow = rng.uniform(60, 80);
      return {
        attempts: [{ pulldown: { ...pulldownTo(rng, pd, isoLow), oilOscillation: true }, hold: tightHold(rng, isoLow, minutes) }],
        findings: ["oil_oscillation"],
        startInHoldAllowed: false,
        sampleSeconds: rng.uniform(2, 15),
      };
    }
    case "frozen_moisture": {
      const pd = { ...basePulldown(rng), freezeStall: { atMicrons: rng.uniform(1500, 3500), seconds: rng.uniform(600, 1200) } };
      const spec = pulldownTo(rng, pd, iso);
      return { attempts: [{ pulldown: spec, hold: moistureHold(rng, iso, Math.max(minutes, 14)) }], findings: ["freeze_risk", "moisture"], startInHoldAllowed: false, sampleSeconds: rng.uniform(5, 30) };
    }
    case "sensor_fault": {
      const which = rng.int(0, 2);
      const d = normal(tightHold(rng, iso, minutes), ["suspect_sensor"]);
      return { ...d, startInHoldAllowed: false, sensorFault: { flatRun: which === 0, zeros: which === 1, jumps: which === 2 }, sampleSeconds: rng.uniform(2, 20) };
    }
    case "short_hold":
      return normal(tightHold(rng, iso, rng.uniform(2.5, 5)), ["hold_too_short"]);
    case "sparse": {
      const d = normal(rng.chance(0.5) ? tightHold(rng, iso, rng.uniform(15, 30)) : leakHold(rng, rng.uniform(15, 30), 40, 200), ["sparse_readings"]);
      return { ...d, sampleSeconds: rng.uniform(150, 300), startInHoldAllowed: false };
    }
    case "typed_minutes": {
      // one reading a minute, typed from the gauge from the moment of isolation: 11–20 readings
      const kind = rng.int(0, 2);
      const typedMinutes = o.holdMinutes ?? rng.int(10, 19);
      const hold = kind === 0 ? tightHold(rng, iso, typedMinutes) : kind === 1 ? leakHold(rng, typedMinutes, 30, 400) : moistureHold(rng, iso, Math.max(typedMinutes, 12));
      return { attempts: [{ pulldown: null, hold, isolationMicrons: iso }], findings: kind === 1 ? ["leak"] : kind === 2 ? ["moisture"] : [], sampleSeconds: 60, startInHoldAllowed: true };
    }
    case "gross_out_of_range": {
      // an open valve: out of the gauge's range within one to three minutes of isolation
      const d = normal(leakHold(rng, 10, 8000, 30000), ["gross_leak", "leak"]);
      const h = d.attempts[0].hold;
      h.holdSeconds = ((25000 - iso) / h.leakMicronsPerMinute) * 60 + rng.uniform(60, 240);
      return { ...d, sampleSeconds: rng.uniform(5, 20), startInHoldAllowed: false };
    }
    case "multi_attempt": {
      // each re-pull starts where the last hold ended and isolates at a drawn pressure
      const firstSpec = pulldownTo(rng, basePulldown(rng), iso);
      const first: AttemptSpec = {
        pulldown: firstSpec,
        hold: rng.chance(0.5) ? leakHold(rng, rng.uniform(5, 10), 60, 300) : moistureHold(rng, iso, rng.uniform(8, 12)),
      };
      const attempts = [first];
      let endMicrons = holdMicrons(first.hold, makePulldownCurve(firstSpec, rng).endMicrons, first.hold.holdSeconds);
      const extra = rng.int(1, 2);
      for (let k = 0; k < extra; k++) {
        const iso2 = rng.uniform(150, 400);
        const last = k === extra - 1;
        const spec = pulldownTo(rng, { ...basePulldown(rng), moistureMicrons: rng.uniform(50, 300), startMicrons: endMicrons }, iso2);
        const isoReached = makePulldownCurve(spec, rng).endMicrons;
        const hold = last ? (rng.chance(0.6) ? tightHold(rng, isoReached, minutes) : leakHold(rng, minutes)) : leakHold(rng, rng.uniform(5, 9), 60, 300);
        attempts.push({ pulldown: spec, hold });
        endMicrons = holdMicrons(hold, isoReached, hold.holdSeconds);
      }
      const lastHold = attempts[attempts.length - 1].hold;
      return { attempts, findings: lastHold.leakMicronsPerMinute > 0 ? ["leak"] : [], startInHoldAllowed: false };
    }
  }
}

/** Draw the full parameter set of a named scenario from its seed. */
export function scenarioParams(o: ScenarioOptions): { params: SimulationParams; findings: string[] } {
  const rng = makeRng(o.seed);
  const d = draw(o, rng);
  const typed = o.scenario === "typed_minutes";
  const startInHold = typed || ((o.startInHold ?? false) && d.startInHoldAllowed);
  if (startInHold) d.attempts[0] = { ...d.attempts[0], pulldown: null };
  const markers = [">25000", "OR", "---"];
  const params: SimulationParams = {
    seed: o.seed,
    attempts: d.attempts,
    breakSeconds: o.breakAtEnd && o.scenario !== "gross_leak" ? rng.uniform(60, 240) : undefined,
    startOffsetSeconds: typed ? 0 : startInHold ? rng.uniform(0, 20) : undefined,
    sampleSeconds: typed ? 60 : (o.sampleSeconds ?? d.sampleSeconds ?? rng.logUniform(1, 60)),
    jitterFraction: typed ? (rng.next(), 0) : rng.uniform(0, 0.2),
    noiseFraction: o.noiseFraction ?? rng.uniform(0.005, 0.03),
    spikeRate: rng.chance(0.5) ? rng.uniform(0, 0.003) : 0,
    gaugeMaxMicrons: 25000,
    overRangeMarker: rng.pick(markers),
    sensorFault: d.sensorFault,
    layout: typed ? (rng.next(), o.layout ?? "typed_minutes") : (o.layout ?? rng.pick(LAYOUTS)),
    unit: o.unit ?? rng.pick(UNITS),
    // (a field layout writes the units its exports use; see below)
    ambientC: rng.uniform(8, 32),
    startIso: new Date(Date.UTC(2026, 5, 14, 8 + rng.int(0, 8), rng.int(0, 59), 0)).toISOString(),
    artifacts: o.artifacts,
  };
  const fieldUnits = (FIELD_LAYOUT_UNITS as Record<string, readonly PressureUnit[]>)[params.layout];
  if (fieldUnits && (o.unit === undefined || !fieldUnits.includes(o.unit))) params.unit = fieldUnits[Math.floor(makeRng(o.seed + 7).next() * fieldUnits.length)];
  // a long, fast-sampled log would be huge: keep the row count reasonable
  const total = d.attempts.reduce((s, a) => s + (a.pulldown?.durationSeconds ?? 0) + a.hold.holdSeconds, 0);
  if (total / params.sampleSeconds > 20000) params.sampleSeconds = total / 20000;
  return { params, findings: d.findings };
}
