/**
 * Pull-down planner: how long a pump takes to bring a system from atmosphere to the target, as
 * crews see it — given the system volume, the pump, the hoses, the valve cores, the manifold, and
 * the water and outgassing the system gives up. The answer is a range (fast end, likely, slow end).
 *
 * Model: V dp/dt = −Q_pumped(p) + Q_water(t) (planner-integrate.ts), where
 *  - Q_pumped is what the pump (free-air speed S0, speed falling near blank-off as S0·(1 − pu/p))
 *    draws through the path, each element a round tube with the whole-range Knudsen conductance,
 *    Dushman's short-tube correction, and the isentropic choked-flow limit through its bore at
 *    high pressure (conductance.ts, choked-flow.ts);
 *  - Q_water is the water and outgassing load of the system's condition (planner-load.ts).
 *
 * Equivalent openings for fittings (our estimates, common practice, no published source; the
 * range scales them by 1.2 at the fast end and 0.8 at the slow end, marked in the output):
 *  - Schrader core left in, opened by a depressor: a 1.5 mm effective opening, 1.5 cm long, per port.
 *  - Core depressor in the hose end: 3 mm, 1.5 cm long, per hose.
 *  - Core removed, path through the valve body and the core-removal tool: 5 mm, 6 cm long.
 *  - Manifold passages and valves: 5 mm, 15 cm long, plus one more hose to the pump.
 * Pump: delivers 100 % (fast), 90 % (likely) or 75 % (slow) of its free-air displacement (worn
 * vanes and used oil; our estimate, common practice, no published source).
 */
import {
  CM_PER_FOOT,
  CM_PER_INCH,
  LPS_PER_CFM,
  LPS_PER_M3H,
  MBAR_PER_MICRON,
  pathEffectiveSpeedLps,
  pathThroughputCurve,
  shortTubeConductanceLps,
  type FlowElement,
} from "./conductance";
import { integratePullDown, integrateWithLoad, tabulateThroughput } from "./planner-integrate";
import { CONDITION_WORDS, loadForVolume, WATER_LOAD_PRESETS, waterLoadMbarLps, type SystemCondition, type WaterLoad } from "./planner-load";
import { durationWords } from "../shared/format";

export { integratePullDown } from "./planner-integrate";
export { planWhatIfs, HOSE_ID_1_4_IN, HOSE_ID_3_8_IN, type WhatIf } from "./planner-whatifs";

export const ATMOSPHERE_MICRONS = 760_000;
export const DEFAULT_TARGET_MICRONS = 500;
/** A plan that does not reach the target in this long says "more than 12 h". */
export const PLAN_HORIZON_SECONDS = 12 * 3600;

export const PLAN_CAVEAT =
  "The range covers the fitting sizes, the pump's condition and the water load listed beside it. A real pull-down slower than the slow end points to more water than assumed (or ice), a leak, or a restriction; one faster than the fast end to a drier system than assumed.";

export interface PlannerInput {
  volumeLitres: number;
  pump: { displacement: number; displacementUnit: "cfm" | "m3h"; blankOffMicrons: number };
  hoses: { count: number; insideDiameterIn: number; lengthFt: number };
  /** Schrader cores removed with core tools (true) or left in and opened by depressors (false). */
  coresRemoved: boolean;
  manifold: boolean;
  targetMicrons?: number;
  startMicrons?: number;
  /** The system's water and outgassing (default "typical"). */
  condition?: SystemCondition;
  /** The technician's own figure for the water to remove (g): the likely case, with half and twice it at the ends. */
  waterGrams?: number | null;
  /**
   * The line set, when known: the gas from the far end of the system (the indoor coil) reaches the
   * service valves through the suction line, taken at half its length because the gas is spread along it.
   */
  lineSet?: { lengthFt: number; suctionInsideDiameterIn: number } | null;
}

export type PlanCaseKey = "fast" | "likely" | "slow";

export interface PlanCase {
  key: PlanCaseKey;
  /** Null when not reached within PLAN_HORIZON_SECONDS (or never: target at or below blank-off). */
  timeToTargetSeconds: number | null;
  curve: { tSeconds: number[]; microns: number[] };
  load: WaterLoad;
  pumpFraction: number;
  openingScale: number;
}

export interface PlanElement {
  name: string;
  diameterMm: number;
  lengthCm: number;
  parallel: number;
  assumed: boolean;
  /** Conductance of all parallel copies at the target pressure, L/s (likely sizes). */
  conductanceAtTargetLps: number;
}

export interface Plan {
  input: Required<Omit<PlannerInput, "waterGrams" | "lineSet">> & { waterGrams: number | null; lineSet: PlannerInput["lineSet"] | null };
  pumpSpeedLps: number;
  /** The likely case's curve and time (seconds from the start, microns). */
  curve: { tSeconds: number[]; microns: number[] };
  timeToTargetSeconds: number | null;
  range: { fastSeconds: number | null; likelySeconds: number | null; slowSeconds: number | null };
  cases: PlanCase[];
  /** The likely case with no water load: what the gas alone would take. */
  gasOnlySeconds: number | null;
  effectiveSpeedAtTargetLps: number | null;
  elements: PlanElement[];
  /** The element with the lowest conductance at the target: where the time goes. */
  bottleneck: string | null;
  assumptions: string[];
  caveat: string;
}

const CASES: readonly { key: PlanCaseKey; pumpFraction: number; openingScale: number }[] = [
  { key: "fast", pumpFraction: 1, openingScale: 1.2 },
  { key: "likely", pumpFraction: 0.9, openingScale: 1 },
  { key: "slow", pumpFraction: 0.75, openingScale: 0.8 },
];

/** The flow path from the system to the pump as equivalent round tubes; assumed openings scaled by `openingScale`. */
export function flowPathOf(input: PlannerInput, openingScale = 1): FlowElement[] {
  const n = Math.max(1, Math.round(input.hoses.count));
  const hose: FlowElement = {
    name: `Hose ${input.hoses.insideDiameterIn} in ID × ${input.hoses.lengthFt} ft`,
    diameterCm: input.hoses.insideDiameterIn * CM_PER_INCH,
    lengthCm: input.hoses.lengthFt * CM_PER_FOOT,
    parallel: n,
    assumed: false,
  };
  const s = openingScale;
  const line: FlowElement[] =
    input.lineSet && input.lineSet.lengthFt > 0
      ? [{ name: `Suction line ${input.lineSet.suctionInsideDiameterIn} in ID, half of ${input.lineSet.lengthFt} ft`, diameterCm: input.lineSet.suctionInsideDiameterIn * CM_PER_INCH, lengthCm: (input.lineSet.lengthFt / 2) * CM_PER_FOOT, parallel: 1, assumed: false }]
      : [];
  const path: FlowElement[] = input.coresRemoved
    ? [{ name: "Valve body and core tool, core removed", diameterCm: 0.5 * s, lengthCm: 6, parallel: n, assumed: true }]
    : [
        { name: "Schrader core left in (depressed)", diameterCm: 0.15 * s, lengthCm: 1.5, parallel: n, assumed: true },
        { name: "Core depressor in hose end", diameterCm: 0.3 * s, lengthCm: 1.5, parallel: n, assumed: true },
      ];
  for (let i = line.length - 1; i >= 0; i--) path.unshift(line[i]);
  path.push(hose);
  if (input.manifold) {
    path.push({ name: "Manifold passages and valves", diameterCm: 0.5 * s, lengthCm: 15, parallel: 1, assumed: true });
    path.push({ ...hose, name: `Centre hose ${input.hoses.insideDiameterIn} in ID × ${input.hoses.lengthFt} ft`, parallel: 1 });
  }
  return path;
}

function checkInput(input: PlannerInput): Plan["input"] {
  const positive = (v: number, name: string) => {
    if (!(typeof v === "number" && Number.isFinite(v) && v > 0)) throw new RangeError(`${name} must be a positive number`);
  };
  positive(input.volumeLitres, "system volume");
  positive(input.pump.displacement, "pump displacement");
  positive(input.pump.blankOffMicrons, "pump blank-off");
  positive(input.hoses.count, "hose count");
  positive(input.hoses.insideDiameterIn, "hose inside diameter");
  positive(input.hoses.lengthFt, "hose length");
  const targetMicrons = input.targetMicrons ?? DEFAULT_TARGET_MICRONS;
  const startMicrons = input.startMicrons ?? ATMOSPHERE_MICRONS;
  positive(targetMicrons, "target");
  if (!(startMicrons > targetMicrons)) throw new RangeError("the start pressure must be above the target");
  const condition = input.condition ?? "typical";
  if (!(condition in WATER_LOAD_PRESETS)) throw new RangeError(`condition '${String(condition)}' is not dry, typical or wet`);
  const waterGrams = input.waterGrams ?? null;
  const lineSet = input.lineSet ?? null;
  if (lineSet) {
    positive(lineSet.lengthFt, "line-set length");
    positive(lineSet.suctionInsideDiameterIn, "suction line inside diameter");
  }
  if (waterGrams !== null && !(Number.isFinite(waterGrams) && waterGrams >= 0 && waterGrams <= 100)) throw new RangeError("water to remove must be 0 to 100 g");
  return { ...input, targetMicrons, startMicrons, condition, waterGrams, lineSet };
}

/** Free-air displacement in L/s. */
export function pumpSpeedLpsOf(pump: PlannerInput["pump"]): number {
  return pump.displacement * (pump.displacementUnit === "cfm" ? LPS_PER_CFM : LPS_PER_M3H);
}

/** The water load of each case: the condition's preset for this volume, or the technician's grams (½×, 1×, 2×) with the preset's release times. */
export function loadOf(input: Plan["input"], key: PlanCaseKey): WaterLoad {
  const preset = loadForVolume(WATER_LOAD_PRESETS[input.condition][key], input.volumeLitres);
  if (input.waterGrams === null) return preset;
  return { ...preset, waterGrams: input.waterGrams * (key === "fast" ? 0.5 : key === "slow" ? 2 : 1) };
}

/** One case of the plan: the path at its opening scale, the pump at its fraction, its water load. */
function runCase(input: Plan["input"], c: (typeof CASES)[number], withLoad = true) {
  const s0 = pumpSpeedLpsOf(input.pump) * c.pumpFraction;
  const pu = input.pump.blankOffMicrons;
  const path = flowPathOf(input, c.openingScale);
  const puMbar = pu * MBAR_PER_MICRON;
  // Throughput in micron·L/s at a system pressure in microns.
  const curve = pathThroughputCurve(path, s0, puMbar, input.startMicrons * MBAR_PER_MICRON);
  const table = tabulateThroughput({ microns: curve.systemMbar.map((m) => m / MBAR_PER_MICRON), throughput: curve.throughputMbarLps.map((q) => q / MBAR_PER_MICRON) }, pu);
  const reachable = input.targetMicrons > pu;
  const endMicrons = reachable ? Math.max(pu + (input.targetMicrons - pu) * 0.5, pu * 1.02) : pu * 1.05;
  const load = loadOf(input, c.key);
  const run = integrateWithLoad({
    volumeLitres: input.volumeLitres,
    startMicrons: input.startMicrons,
    endMicrons,
    ultimateMicrons: pu,
    targetMicrons: reachable ? input.targetMicrons : null,
    throughputAt: table,
    loadAt: withLoad ? (t) => waterLoadMbarLps(load, t) / MBAR_PER_MICRON : () => 0,
    loadTimeScaleSeconds: load.releaseMinSeconds,
    maxSeconds: PLAN_HORIZON_SECONDS,
  });
  return { ...run, load, path, s0, table };
}

const pct = (x: number) => `${Math.round(x * 100)} %`;

/**
 * Predicted pull-down for one setup: the range of times to the target (fast, likely, slow), the
 * likely curve, what the gas alone would take, the effective speed at the target and the element
 * that limits it, and every assumption in words. See the file comment for the model.
 */
export function planPullDown(raw: PlannerInput): Plan {
  const input = checkInput(raw);
  const runs = CASES.map((c) => ({ c, run: runCase(input, c) }));
  const likely = runs[1].run;
  const pu = input.pump.blankOffMicrons;
  const reachable = input.targetMicrons > pu;
  const gas = integratePullDown({
    volumeLitres: input.volumeLitres,
    startMicrons: input.startMicrons,
    endMicrons: reachable ? Math.max(pu + (input.targetMicrons - pu) * 0.5, pu * 1.02) : pu * 1.05,
    ultimateMicrons: pu,
    targetMicrons: reachable ? input.targetMicrons : null,
    speedLpsAt: (m) => Math.max(likely.table(m).q / (m - pu), 1e-12),
    steps: 160,
  });
  const targetMbar = input.targetMicrons * MBAR_PER_MICRON;
  const elements: PlanElement[] = likely.path.map((el) => ({
    name: el.name,
    diameterMm: el.diameterCm * 10,
    lengthCm: el.lengthCm,
    parallel: el.parallel,
    assumed: el.assumed,
    conductanceAtTargetLps: el.parallel * shortTubeConductanceLps(el.diameterCm, el.lengthCm, targetMbar),
  }));
  const bottleneck = elements.reduce<PlanElement | null>((b, e) => (!b || e.conductanceAtTargetLps < b.conductanceAtTargetLps ? e : b), null);
  const s0 = pumpSpeedLpsOf(input.pump);
  const loads = runs.map((r) => r.run.load);
  const assumptions = [
    "Air at about 20 °C. The path is round tubes: Knudsen whole-range conductance with Dushman's short-tube correction, and isentropic choked flow through each opening at high pressure.",
    `Pump: ${s0.toFixed(2)} L/s free-air displacement, delivering ${pct(CASES[2].pumpFraction)}–${pct(CASES[0].pumpFraction)} of it (likely ${pct(CASES[1].pumpFraction)}), falling near its ${pu} micron blank-off.`,
    ...elements
      .filter((e) => e.assumed)
      .map((e) => `Assumption: ${e.name.toLowerCase()} taken as a ${(e.diameterMm * CASES[2].openingScale).toFixed(1)}–${(e.diameterMm * CASES[0].openingScale).toFixed(1)} mm opening (likely ${e.diameterMm.toFixed(1)} mm), ${e.lengthCm} cm long.`),
    `Water and outgassing: ${input.waterGrams !== null ? `${input.waterGrams} g, as entered` : CONDITION_WORDS[input.condition]}; ${loads[0].waterGrams}–${loads[2].waterGrams} g of water to remove (likely ${loads[1].waterGrams} g), its parts given up with time constants from ${durationWords(loads[1].releaseMinSeconds)} to ${durationWords(loads[1].releaseMaxSeconds)}.`,
    "Not modelled: leaks, ice (water can freeze below about 4,600 microns and then comes off far more slowly), hose friction in the first minute, the gauge's response.",
  ];
  if (!reachable) assumptions.push(`The target (${input.targetMicrons} microns) is at or below the pump's blank-off (${pu} microns): it is never reached.`);
  const cases: PlanCase[] = runs.map(({ c, run }) => ({ key: c.key, timeToTargetSeconds: run.timeToTargetSeconds, curve: run.curve, load: run.load, pumpFraction: c.pumpFraction, openingScale: c.openingScale }));
  return {
    input,
    pumpSpeedLps: s0,
    curve: likely.curve,
    timeToTargetSeconds: likely.timeToTargetSeconds,
    range: { fastSeconds: runs[0].run.timeToTargetSeconds, likelySeconds: likely.timeToTargetSeconds, slowSeconds: runs[2].run.timeToTargetSeconds },
    cases,
    gasOnlySeconds: gas.timeToTargetSeconds,
    effectiveSpeedAtTargetLps: reachable ? pathEffectiveSpeedLps(likely.path, likely.s0, pu * MBAR_PER_MICRON, targetMbar) : null,
    elements,
    bottleneck: bottleneck?.name ?? null,
    assumptions,
    caveat: PLAN_CAVEAT,
  };
}
