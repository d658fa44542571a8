/**
 * Pull-down planner: how long a pump takes to bring a system from atmosphere to the target,
 * given the system volume, the pump, the hoses, the valve cores and the manifold.
 *
 * Model (gas only): dp/dt = −S_eff(p) · (p − pu) / V, where S_eff combines the pump's free-air
 * speed S0 and the conductance of each element of the path at its own mean pressure
 * (analysis/conductance.ts: Knudsen whole-range formula, Roth). The pump's speed falls near
 * blank-off as S(p) = S0·(1 − pu/p), which is the same as a throughput S0·(p − pu). Integrated
 * exactly in u = ln(p − pu): t = ∫ V / S_eff du (trapezoid on a fine grid), which for a constant
 * S_eff is t = (V/S) ln((p0 − pu)/(p − pu)).
 *
 * Equivalent-tube ASSUMPTIONS for fittings (our estimates, no published source; marked in the output):
 *  - Schrader core left in, opened by a depressor: a 1.5 mm bore, 1.5 cm long tube per port.
 *  - Core depressor in the hose end: a 3 mm bore, 1.5 cm long tube per hose.
 *  - Core removed, path through the valve body and the core-removal tool: 5 mm bore, 6 cm long.
 *  - Manifold passages and valves: 5 mm bore, 15 cm long, plus one more hose to the pump.
 */
import {
  CM_PER_FOOT,
  CM_PER_INCH,
  LPS_PER_CFM,
  LPS_PER_M3H,
  MBAR_PER_MICRON,
  knudsenConductanceLps,
  pathEffectiveSpeedLps,
  type FlowElement,
} from "./conductance";

export const ATMOSPHERE_MICRONS = 760_000;
export const DEFAULT_TARGET_MICRONS = 500;

export const GAS_ONLY_CAVEAT =
  "This is a gas-only estimate. Moisture boiling off and refrigerant or oil outgassing make real pull-downs slower, often much slower below a few thousand microns; a real curve that lags far behind this one points to water, a leak or a restriction.";

export interface PlannerInput {
  volumeLitres: number;
  pump: { displacement: number; displacementUnit: "cfm" | "m3h"; blankOffMicrons: number };
  hoses: { count: number; insideDiameterIn: number; lengthFt: number };
  /** Schrader cores removed with core tools (true) or left in and opened by depressors (false). */
  coresRemoved: boolean;
  manifold: boolean;
  targetMicrons?: number;
  startMicrons?: number;
}

export interface PlanElement {
  name: string;
  diameterMm: number;
  lengthCm: number;
  parallel: number;
  assumed: boolean;
  /** Conductance of all parallel copies at the target pressure, L/s. */
  conductanceAtTargetLps: number;
}

export interface Plan {
  input: Required<PlannerInput>;
  pumpSpeedLps: number;
  /** Predicted curve, seconds from the start and microns. */
  curve: { tSeconds: number[]; microns: number[] };
  /** Null when the target is at or below the pump's blank-off (never reached). */
  timeToTargetSeconds: number | null;
  effectiveSpeedAtTargetLps: number | null;
  elements: PlanElement[];
  /** The element with the lowest conductance at the target: where the time goes. */
  bottleneck: string | null;
  assumptions: string[];
  caveat: string;
}

const mm = (cm: number) => cm * 10;

/** The flow path from the system to the pump as equivalent round tubes. */
export function flowPathOf(input: PlannerInput): FlowElement[] {
  const n = Math.max(1, Math.round(input.hoses.count));
  const hose: FlowElement = {
    name: `Hose ${input.hoses.insideDiameterIn} in ID × ${input.hoses.lengthFt} ft`,
    diameterCm: input.hoses.insideDiameterIn * CM_PER_INCH,
    lengthCm: input.hoses.lengthFt * CM_PER_FOOT,
    parallel: n,
    assumed: false,
  };
  const path: FlowElement[] = input.coresRemoved
    ? [{ name: "Valve body and core tool, core removed", diameterCm: 0.5, lengthCm: 6, parallel: n, assumed: true }]
    : [
        { name: "Schrader core left in (depressed)", diameterCm: 0.15, lengthCm: 1.5, parallel: n, assumed: true },
        { name: "Core depressor in hose end", diameterCm: 0.3, lengthCm: 1.5, parallel: n, assumed: true },
      ];
  path.push(hose);
  if (input.manifold) {
    path.push({ name: "Manifold passages and valves", diameterCm: 0.5, lengthCm: 15, parallel: 1, assumed: true });
    path.push({ ...hose, name: `Centre hose ${input.hoses.insideDiameterIn} in ID × ${input.hoses.lengthFt} ft`, parallel: 1 });
  }
  return path;
}

function checkInput(input: PlannerInput): Required<PlannerInput> {
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
  return { ...input, targetMicrons, startMicrons };
}

/**
 * Integrates dp/dt = −S(p)·(p − pu)/V from startMicrons down to endMicrons (V in L, S in L/s).
 * In u = ln(p − pu) the equation is du/dt = −S/V, so t = ∫ V/S(p(u)) du, done by the trapezoid
 * rule on `steps` equal steps in u (exact for constant S: t = (V/S) ln((p0 − pu)/(p − pu))).
 * The time to `targetMicrons` is interpolated linearly in u inside its step.
 */
export function integratePullDown(args: {
  volumeLitres: number;
  startMicrons: number;
  endMicrons: number;
  ultimateMicrons: number;
  targetMicrons: number | null;
  speedLpsAt: (microns: number) => number;
  steps: number;
}): { curve: { tSeconds: number[]; microns: number[] }; timeToTargetSeconds: number | null } {
  const pu = args.ultimateMicrons;
  const u0 = Math.log(args.startMicrons - pu);
  const u1 = Math.log(args.endMicrons - pu);
  const uTarget = args.targetMicrons !== null && args.targetMicrons > pu ? Math.log(args.targetMicrons - pu) : -Infinity;
  const secondsPerU = (u: number) => args.volumeLitres / args.speedLpsAt(pu + Math.exp(u));
  const tSeconds = [0];
  const microns = [args.startMicrons];
  let timeToTargetSeconds: number | null = uTarget >= u0 ? 0 : null;
  const du = (u0 - u1) / args.steps;
  let prevRate = secondsPerU(u0);
  let t = 0;
  for (let k = 1; k <= args.steps; k++) {
    const u = u0 - k * du;
    const rate = secondsPerU(u);
    const dt = ((prevRate + rate) / 2) * du;
    if (timeToTargetSeconds === null && u <= uTarget) timeToTargetSeconds = t + dt * ((u0 - (k - 1) * du - uTarget) / du);
    t += dt;
    tSeconds.push(t);
    microns.push(pu + Math.exp(u));
    prevRate = rate;
  }
  return { curve: { tSeconds, microns }, timeToTargetSeconds };
}

/** Free-air displacement in L/s. */
export function pumpSpeedLpsOf(pump: PlannerInput["pump"]): number {
  return pump.displacement * (pump.displacementUnit === "cfm" ? LPS_PER_CFM : LPS_PER_M3H);
}

/**
 * Predicted pull-down for one setup: the curve p(t) from the start to below the target, the time
 * to the target, the effective speed there and the element that limits it. See the file comment
 * for the model and the equivalent-tube assumptions.
 */
export function planPullDown(raw: PlannerInput, steps = 160): Plan {
  const input = checkInput(raw);
  const s0 = pumpSpeedLpsOf(input.pump);
  const puMbar = input.pump.blankOffMicrons * MBAR_PER_MICRON;
  const path = flowPathOf(input);
  const pu = input.pump.blankOffMicrons;
  const reachable = input.targetMicrons > pu;
  // Curve ends a little past the target (or just above blank-off when the target is out of reach).
  const endMicrons = reachable ? Math.max(pu + (input.targetMicrons - pu) * 0.4, pu * 1.02) : pu * 1.05;
  const speedAt = (m: number) => pathEffectiveSpeedLps(path, s0, puMbar, m * MBAR_PER_MICRON);
  const { curve, timeToTargetSeconds } = integratePullDown({
    volumeLitres: input.volumeLitres,
    startMicrons: input.startMicrons,
    endMicrons,
    ultimateMicrons: pu,
    targetMicrons: reachable ? input.targetMicrons : null,
    speedLpsAt: speedAt,
    steps,
  });
  const targetMbar = input.targetMicrons * MBAR_PER_MICRON;
  const elements: PlanElement[] = path.map((el) => ({
    name: el.name,
    diameterMm: mm(el.diameterCm),
    lengthCm: el.lengthCm,
    parallel: el.parallel,
    assumed: el.assumed,
    conductanceAtTargetLps: el.parallel * knudsenConductanceLps(el.diameterCm, el.lengthCm, targetMbar),
  }));
  const bottleneck = elements.reduce<PlanElement | null>((b, e) => (!b || e.conductanceAtTargetLps < b.conductanceAtTargetLps ? e : b), null);
  const assumptions = [
    "Air at about 20 °C; the path is modelled as round tubes (Knudsen whole-range conductance).",
    `Pump speed ${s0.toFixed(2)} L/s from its free-air displacement, falling near its ${pu} micron blank-off as S0·(1 − blank-off/p).`,
    ...elements.filter((e) => e.assumed).map((e) => `Assumption: ${e.name.toLowerCase()} taken as a ${e.diameterMm.toFixed(1)} mm bore, ${e.lengthCm} cm long tube.`),
  ];
  if (!reachable) assumptions.push(`The target (${input.targetMicrons} microns) is at or below the pump's blank-off (${pu} microns): it is never reached.`);
  return {
    input,
    pumpSpeedLps: s0,
    curve,
    timeToTargetSeconds,
    effectiveSpeedAtTargetLps: reachable ? pathEffectiveSpeedLps(path, s0, puMbar, targetMbar) : null,
    elements,
    bottleneck: bottleneck?.name ?? null,
    assumptions,
    caveat: GAS_ONLY_CAVEAT,
  };
}

export interface WhatIf {
  key: "as_planned" | "hoses_3_8" | "hoses_1_4" | "shorter_hoses" | "cores_out" | "no_manifold" | "best";
  label: string;
  plan: Plan;
}

/** 3/8 in and 1/4 in nominal hose bores, inches. */
export const HOSE_ID_3_8_IN = 0.375;
export const HOSE_ID_1_4_IN = 0.25;

/**
 * The plan as entered beside what-ifs that change one thing each (3/8 in or 1/4 in hoses,
 * hoses half as long, cores out, no manifold) and the best of all of them together.
 */
export function planWhatIfs(input: PlannerInput): WhatIf[] {
  const out: WhatIf[] = [{ key: "as_planned", label: "As planned", plan: planPullDown(input) }];
  const h = input.hoses;
  if (Math.abs(h.insideDiameterIn - HOSE_ID_3_8_IN) > 1e-9)
    out.push({ key: "hoses_3_8", label: "3/8 in hoses", plan: planPullDown({ ...input, hoses: { ...h, insideDiameterIn: HOSE_ID_3_8_IN } }) });
  if (Math.abs(h.insideDiameterIn - HOSE_ID_1_4_IN) > 1e-9)
    out.push({ key: "hoses_1_4", label: "1/4 in hoses", plan: planPullDown({ ...input, hoses: { ...h, insideDiameterIn: HOSE_ID_1_4_IN } }) });
  out.push({ key: "shorter_hoses", label: `Hoses ${h.lengthFt / 2} ft`, plan: planPullDown({ ...input, hoses: { ...h, lengthFt: h.lengthFt / 2 } }) });
  if (!input.coresRemoved) out.push({ key: "cores_out", label: "Cores out", plan: planPullDown({ ...input, coresRemoved: true }) });
  if (input.manifold) out.push({ key: "no_manifold", label: "No manifold", plan: planPullDown({ ...input, manifold: false }) });
  const best: PlannerInput = {
    ...input,
    coresRemoved: true,
    manifold: false,
    hoses: { ...h, insideDiameterIn: Math.max(h.insideDiameterIn, HOSE_ID_3_8_IN), lengthFt: h.lengthFt / 2 },
  };
  out.push({ key: "best", label: "All of these together", plan: planPullDown(best) });
  return out;
}
