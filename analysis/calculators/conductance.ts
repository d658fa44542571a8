/**
 * Gas flow through the evacuation path (hoses, valve cores, manifold) for air at about 20 °C.
 *
 * Units follow the vacuum-engineering convention of the formulas: diameters and lengths in cm,
 * pressures in mbar, conductances and pump speeds in L/s, throughput in mbar·L/s.
 *
 * References: A. Roth, Vacuum Technology (molecular C = 12.1 d³/L for a long round tube; the
 * Knudsen whole-range formula); Poiseuille flow C = π d⁴ p̄ / (128 η L), with η = 1.81e-5 Pa·s
 * giving 135 d⁴ p̄ / L in these units. Short tubes (valve cores, depressors, valve bodies): the
 * molecular term with Dushman's correction, the aperture and the long tube in series,
 * 1/C = 1/C_aperture + 1/C_long, C_aperture = 11.6 · A (S. Dushman, "Scientific Foundations of
 * Vacuum Technique"; J. F. O'Hanlon, "A User's Guide to Vacuum Technology", ch. 3), which is
 * within about 12 % of Clausing's exact factors. At high pressure every element is also limited
 * by isentropic (choked) flow through its bore (choked-flow.ts).
 */
import { nozzleThroughput } from "./choked-flow";
import { PA_PER_MICRON } from "../shared/units";

/** mbar in one micron of mercury (0.133322… Pa / 100). */
export const MBAR_PER_MICRON = PA_PER_MICRON / 100;
/** L/s in one cubic foot per minute (28.316846592 L / 60 s). */
export const LPS_PER_CFM = 28.316846592 / 60;
/** L/s in one m³/h (1000 L / 3600 s). */
export const LPS_PER_M3H = 1000 / 3600;
export const CM_PER_INCH = 2.54;
export const CM_PER_FOOT = 30.48;

/** Molecular-flow conductance of a long round tube, L/s: C = 12.1 · d³ / L (d, L in cm; Roth). */
export function molecularConductanceLps(diameterCm: number, lengthCm: number): number {
  return (12.1 * diameterCm ** 3) / lengthCm;
}

/** Molecular-flow conductance of a thin round aperture, L/s: C = 11.6 · π d²/4 (d in cm; air at 20 °C). */
export function apertureConductanceLps(diameterCm: number): number {
  return 11.6 * ((Math.PI * diameterCm * diameterCm) / 4);
}

/**
 * Molecular-flow conductance of a round tube of any length, L/s, with Dushman's short-tube
 * correction: 1/C = 1/C_aperture + 1/C_long (= C_aperture / (1 + 0.753 L/d) with these constants;
 * Dushman writes 1 + 3L/(4d)). Tends to C_long for long tubes and to the aperture as L → 0.
 */
export function shortTubeMolecularConductanceLps(diameterCm: number, lengthCm: number): number {
  return 1 / (1 / apertureConductanceLps(diameterCm) + lengthCm / (12.1 * diameterCm ** 3));
}

/** Viscous (Poiseuille) conductance of a round tube, L/s: C = 135 · d⁴ · p̄ / L (cm, mbar). */
export function viscousConductanceLps(diameterCm: number, lengthCm: number, meanMbar: number): number {
  return (135 * diameterCm ** 4 * meanMbar) / lengthCm;
}

/**
 * Whole-range (Knudsen) conductance of a round tube, L/s, from viscous through transitional to
 * molecular flow: C = 135 d⁴p̄/L + 12.1 (d³/L)(1 + 192 d p̄)/(1 + 237 d p̄) (cm, mbar; Roth).
 */
export function knudsenConductanceLps(diameterCm: number, lengthCm: number, meanMbar: number): number {
  const dp = diameterCm * meanMbar;
  return viscousConductanceLps(diameterCm, lengthCm, meanMbar) + molecularConductanceLps(diameterCm, lengthCm) * ((1 + 192 * dp) / (1 + 237 * dp));
}

/**
 * Whole-range conductance of a round tube of any length, L/s: the Knudsen formula with its
 * molecular term taken from the short-tube (Dushman) conductance,
 * C = 135 d⁴p̄/L + C_mol,short · (1 + 192 d p̄)/(1 + 237 d p̄) (cm, mbar).
 */
export function shortTubeConductanceLps(diameterCm: number, lengthCm: number, meanMbar: number): number {
  const dp = diameterCm * meanMbar;
  return viscousConductanceLps(diameterCm, lengthCm, meanMbar) + shortTubeMolecularConductanceLps(diameterCm, lengthCm) * ((1 + 192 * dp) / (1 + 237 * dp));
}

/** Conductances in series: 1/C = Σ 1/C_i (L/s). */
export function seriesConductanceLps(conductancesLps: readonly number[]): number {
  let inv = 0;
  for (const c of conductancesLps) inv += 1 / c;
  return 1 / inv;
}

/** Effective pumping speed at the system through the conductances: 1/S_eff = 1/S + Σ 1/C_i (L/s). */
export function effectiveSpeedLps(pumpSpeedLps: number, conductancesLps: readonly number[]): number {
  return seriesConductanceLps([pumpSpeedLps, ...conductancesLps]);
}

/**
 * Pump-down time at constant speed S from p0 to p with ultimate pressure pu:
 * t = (V/S) · ln((p0 − pu)/(p − pu)) (seconds; V in L, S in L/s; any one pressure unit).
 */
export function constantSpeedPumpDownSeconds(volumeLitres: number, speedLps: number, p0: number, p: number, pUltimate = 0): number {
  return (volumeLitres / speedLps) * Math.log((p0 - pUltimate) / (p - pUltimate));
}

/** One element of the flow path, as an equivalent round tube, `parallel` identical copies side by side. */
export interface FlowElement {
  name: string;
  diameterCm: number;
  lengthCm: number;
  parallel: number;
  /** True when the diameter and length are our equivalent-tube assumption, not a measured size. */
  assumed: boolean;
}

/** Halvings in each bisection: 2^-32 ≈ 2.3e-10 of the bracket, far below any input's precision. */
const BISECTIONS = 32;

/**
 * Throughput through one element (mbar·L/s) with the given end pressures: the whole-range
 * short-tube conductance at the mean pressure times the drop, but never more than isentropic
 * flow through its bore (choked at high pressure).
 */
export function elementThroughput(el: FlowElement, upMbar: number, downMbar: number): number {
  const area = (Math.PI * el.diameterCm * el.diameterCm) / 4;
  const tube = shortTubeConductanceLps(el.diameterCm, el.lengthCm, (upMbar + downMbar) / 2) * (upMbar - downMbar);
  return el.parallel * Math.min(tube, nozzleThroughput(area, upMbar, downMbar));
}

/** The upstream pressure that drives `q` through the element from `downMbar` (bisection; throughput rises with it). */
function upstreamPressure(el: FlowElement, downMbar: number, q: number): number {
  // Start from the molecular drop (the tube's least conductance) and widen until the element passes q.
  const cMin = el.parallel * shortTubeMolecularConductanceLps(el.diameterCm, el.lengthCm) * (192 / 237);
  let lo = downMbar;
  let hi = downMbar + q / cMin;
  for (let k = 0; k < 200 && elementThroughput(el, hi, downMbar) < q; k++) {
    lo = hi;
    hi = downMbar + 2 * (hi - downMbar);
  }
  for (let i = 0; i < BISECTIONS; i++) {
    const mid = (lo + hi) / 2;
    if (elementThroughput(el, mid, downMbar) < q) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/**
 * Throughput (mbar·L/s) drawn from a system at `systemMbar` through `path` (ordered system → pump)
 * by a pump of free-air speed S0 (L/s) with ultimate pressure pu. The pump takes S0·(p_inlet − pu),
 * i.e. its speed falls near blank-off as S(p) = S0·(1 − pu/p). Each element's throughput is found at
 * its own end pressures by walking up from the pump (bisection on the throughput); in the molecular
 * limit this is exactly 1/S_eff = 1/S0 + Σ 1/C_i.
 */
export function pathThroughput(path: readonly FlowElement[], pumpSpeedLps: number, ultimateMbar: number, systemMbar: number): number {
  if (systemMbar <= ultimateMbar) return 0;
  let lo = 0;
  let hi = pumpSpeedLps * (systemMbar - ultimateMbar);
  for (let i = 0; i < BISECTIONS; i++) {
    const mid = (lo + hi) / 2;
    if (systemPressureFor(path, pumpSpeedLps, ultimateMbar, mid) < systemMbar) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** The system pressure (mbar) at which the path passes throughput `q` (mbar·L/s): walk up from the pump. */
export function systemPressureFor(path: readonly FlowElement[], pumpSpeedLps: number, ultimateMbar: number, q: number): number {
  let p = ultimateMbar + q / pumpSpeedLps;
  for (let i = path.length - 1; i >= 0; i--) p = upstreamPressure(path[i], p, q);
  return p;
}

/**
 * The path's throughput curve from `startMbar` down to just above the pump's ultimate, as points
 * (system pressure mbar, throughput mbar·L/s), pressures falling: throughputs spaced evenly in
 * ln q from the start's down by `factor` each, each mapped to its system pressure by one walk up
 * the path (the inverse of pathThroughput, without its outer bisection).
 */
export function pathThroughputCurve(path: readonly FlowElement[], pumpSpeedLps: number, ultimateMbar: number, startMbar: number, factor = 0.7): { systemMbar: number[]; throughputMbarLps: number[] } {
  const systemMbar: number[] = [];
  const throughputMbarLps: number[] = [];
  let q = pathThroughput(path, pumpSpeedLps, ultimateMbar, startMbar);
  for (let k = 0; k < 400 && q > 0; k++) {
    const p = k === 0 ? startMbar : systemPressureFor(path, pumpSpeedLps, ultimateMbar, q);
    systemMbar.push(p);
    throughputMbarLps.push(q);
    if (p - ultimateMbar < ultimateMbar * 1e-4) break;
    q *= factor;
  }
  return { systemMbar, throughputMbarLps };
}

/** Effective speed at the system (L/s) at `systemMbar`: throughput / (p − pu). */
export function pathEffectiveSpeedLps(path: readonly FlowElement[], pumpSpeedLps: number, ultimateMbar: number, systemMbar: number): number {
  return pathThroughput(path, pumpSpeedLps, ultimateMbar, systemMbar) / (systemMbar - ultimateMbar);
}
