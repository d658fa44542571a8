/**
 * Noise-free pressure curves for the simulator (microns of mercury, seconds).
 *
 * Pull-down: the gas load G falls as dG/dt = −G / τ(G) with τ(G) = τ_fast · (1 + p_k / G), so the
 * effective pumping speed falls as the flow leaves the viscous range (Roth, Vacuum Technology:
 * t = (V/S) ln(p0/p) while S is constant; conductance drops at low pressure). On top sit the pump's
 * ultimate pressure p_u and a moisture tail M·e^(−t/τ_m) that slows the final approach:
 *   p(t) = p_u + G(t) + M·e^(−t/τ_m).
 * Hold (pump valved off at s = 0): p(s) = p_iso + A·(1 − e^(−s/τ)) + L·s — outgassing or moisture
 * levels off (the exponential), a leak through a fixed opening climbs linearly (rate = Q/V)
 * (K. Zapfe, "Leak Detection", CERN Accelerator School 2006: outgassing levels off, a leak is linear).
 */
import type { Rng } from "./prng";

export interface PulldownSpec {
  /** Pressure when the pump starts (microns); above the gauge range the log shows over-range markers. */
  startMicrons: number;
  /** What the pump and rig can reach (microns). */
  ultimateMicrons: number;
  /** e-folding time in the viscous range, V/S (seconds). */
  fastTauSeconds: number;
  /** Pressure below which the effective speed falls (microns), p_k above. */
  speedKneeMicrons: number;
  /** Height of the moisture tail at the start of the pull-down (microns). */
  moistureMicrons: number;
  moistureTauSeconds: number;
  /** Seconds from the start of this pull-down to isolation. */
  durationSeconds: number;
  /** Readings hop tens of microns while the pressure is between about 90 and 260 microns. */
  oilOscillation?: boolean;
  /** Frozen moisture: the fall stalls near this pressure for this long, then resumes. */
  freezeStall?: { atMicrons: number; seconds: number } | null;
}

export interface HoldSpec {
  holdSeconds: number;
  /** A: height of the part that levels off (microns). */
  plateauRiseMicrons: number;
  /** τ of the part that levels off (seconds). */
  tauSeconds: number;
  /** L: steady climb (microns per minute). */
  leakMicronsPerMinute: number;
}

/** A pull-down sampled on a 1-second grid: p(t) for t in [0, durationSeconds]. */
export interface PulldownCurve {
  at(tSeconds: number): number;
  /** Noise-free pressure at isolation. */
  endMicrons: number;
}

export function makePulldownCurve(spec: PulldownSpec, rng: Rng): PulldownCurve {
  const stepSeconds = 1;
  const gasStart = Math.max(spec.startMicrons - spec.ultimateMicrons - spec.moistureMicrons, 1);
  const steps = Math.ceil(spec.durationSeconds / stepSeconds) + 2;
  const grid = new Float64Array(steps + 1);
  let gas = gasStart;
  const stall = spec.freezeStall ?? null;
  let stallStart = -1;
  // hop: a telegraph-like offset for oil lying in the coil (tens of microns)
  let hop = 0;
  let nextHopAt = 0;
  for (let k = 0; k <= steps; k++) {
    const t = k * stepSeconds;
    const base = spec.ultimateMicrons + gas + spec.moistureMicrons * Math.exp(-t / spec.moistureTauSeconds);
    let p = base;
    if (stall) {
      if (stallStart < 0 && base <= stall.atMicrons) stallStart = t;
      if (stallStart >= 0) {
        const since = t - stallStart;
        // ice subliming holds the pressure near the stall level, then the fall resumes
        if (since < stall.seconds) p = stall.atMicrons * (1 - 0.06 * (since / stall.seconds));
      }
    }
    if (spec.oilOscillation && p > 90 && p < 260) {
      if (t >= nextHopAt) {
        hop = rng.uniform(-35, 55);
        nextHopAt = t + rng.uniform(15, 70);
      }
      p += hop;
    }
    grid[k] = p;
    const stalled = stall !== null && stallStart >= 0 && t - stallStart < stall.seconds;
    if (!stalled) gas *= Math.exp(-stepSeconds / (spec.fastTauSeconds * (1 + spec.speedKneeMicrons / Math.max(gas, 1e-9))));
  }
  // after a stall the whole remaining curve is shifted in time: continue from the stall level
  if (stall && stallStart >= 0) {
    const resumeK = Math.min(steps, Math.round((stallStart + stall.seconds) / stepSeconds));
    const level = stall.atMicrons * 0.94;
    for (let k = resumeK; k <= steps; k++) grid[k] = Math.min(grid[k], level);
  }
  const at = (tSeconds: number): number => {
    const x = Math.min(Math.max(tSeconds / stepSeconds, 0), steps);
    const k = Math.floor(x);
    const f = x - k;
    return k >= steps ? grid[steps] : grid[k] * (1 - f) + grid[k + 1] * f;
  };
  return { at, endMicrons: at(spec.durationSeconds) };
}

/** Hold curve: p_iso + A·(1 − e^(−s/τ)) + L·s, s in seconds since isolation (microns). */
export function holdMicrons(spec: HoldSpec, isolationMicrons: number, sSeconds: number): number {
  const s = Math.max(sSeconds, 0);
  return (
    isolationMicrons +
    spec.plateauRiseMicrons * (1 - Math.exp(-s / Math.max(spec.tauSeconds, 1e-6))) +
    (spec.leakMicronsPerMinute / 60) * s
  );
}
