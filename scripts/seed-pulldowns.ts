/**
 * Pull-downs for the demo month that fit the system and the rig they were made with (invented
 * data, physically shaped). They use the simulator's own curve (analysis/decay/simulate/curve.ts: a gas
 * term whose speed falls below a knee pressure, plus a moisture tail M·e^(−t/τm)) with its knobs
 * set from textbook rules of thumb, independently of the planner's model:
 *  - high-pressure speed: the pump (80–100 % of its rating) or the choked limit of the smallest
 *    openings, about 20 L/s per cm² (O'Hanlon, from memory), whichever is lower; τ_fast = V / S_hi;
 *  - low-pressure speed at 500 microns: the pump and the rig's long-tube conductances in series
 *    (molecular 12.1 d³/L plus Poiseuille 135 d⁴p̄/L; Roth), a depressed core as a 1.5 mm passage
 *    1.5 cm long; the knee is set so the curve's speed there matches it;
 *  - moisture: a water store released with one time constant, M = water / (τm · S_lo), with the
 *    amount per litre and τm drawn for the system's condition (dry new install, a repair, wet);
 *    a single time constant understates the long tail of real outgassing, so M is never below a
 *    drawn multiple of the isolation pressure (an opened circuit always shows water holding the
 *    gauge up for a while: 1.2–2× for a dry one, 2–4× for a repair, 4–8× for a wet one).
 * Rules and ranges are common practice, no published source.
 */
import { makePulldownCurve, makeRng, type PulldownSpec, type Rng } from "@/analysis/decay/simulate";

export interface SeedRig {
  name: string;
  truck: string;
  pumpCfm: number;
  blankOffMicrons: number;
  hoseCount: number;
  hoseInsideDiameterIn: number;
  hoseLengthFt: number;
  coreTools: boolean;
}

/** Three demo kits: a fast one, the standard one through a manifold, and a fast one with longer hoses. */
export const SEED_RIGS: readonly SeedRig[] = [
  { name: "Van 2 — core tools, 3/8 in hoses", truck: "Van 2", pumpCfm: 8, blankOffMicrons: 22, hoseCount: 2, hoseInsideDiameterIn: 0.375, hoseLengthFt: 3, coreTools: true },
  { name: "Van 5 — manifold kit", truck: "Van 5", pumpCfm: 6, blankOffMicrons: 35, hoseCount: 2, hoseInsideDiameterIn: 0.25, hoseLengthFt: 6, coreTools: false },
  { name: "Van 3 — core tools, long hoses", truck: "Van 3", pumpCfm: 7, blankOffMicrons: 28, hoseCount: 2, hoseInsideDiameterIn: 0.375, hoseLengthFt: 6, coreTools: true },
];

export type SeedCondition = "dry" | "typical" | "wet";

const LPS_PER_CFM = 28.316846592 / 60;
const CHOKED_LPS_PER_CM2 = 20;
const MICRON_LITRES_PER_GRAM = 1_015_000; // 1 g of water ≈ 1,353 mbar·L = 1.015e6 micron·L at 20 °C
const area = (dCm: number) => (Math.PI * dCm * dCm) / 4;

/** Conductance (L/s) of a long round tube at 500 microns (0.667 mbar mean): Poiseuille + molecular (Roth). */
function tubeAt500(dCm: number, lCm: number): number {
  return (135 * dCm ** 4 * 0.667) / lCm + (12.1 * dCm ** 3) / lCm;
}

/** The rig's speeds (L/s): at high pressure and at 500 microns. */
export function rigSpeeds(rig: SeedRig, pumpFraction: number): { high: number; low: number } {
  const s0 = rig.pumpCfm * LPS_PER_CFM * pumpFraction;
  const hoseD = rig.hoseInsideDiameterIn * 2.54;
  const openingCm = rig.coreTools ? 0.5 : 0.15;
  const high = Math.min(s0, rig.hoseCount * area(openingCm) * CHOKED_LPS_PER_CM2);
  const inv = [
    1 / s0,
    1 / (rig.hoseCount * tubeAt500(hoseD, rig.hoseLengthFt * 30.48)),
    1 / (rig.hoseCount * (rig.coreTools ? tubeAt500(0.5, 6) : tubeAt500(0.15, 1.5))),
    ...(rig.coreTools ? [] : [1 / tubeAt500(0.5, 15), 1 / tubeAt500(hoseD, rig.hoseLengthFt * 30.48)]),
  ];
  return { high, low: 1 / inv.reduce((a, b) => a + b, 0) };
}

const WATER: Record<SeedCondition, { gramsPerLitre: [number, number]; tauSeconds: [number, number]; shelf: [number, number] }> = {
  dry: { gramsPerLitre: [0.02, 0.06], tauSeconds: [360, 600], shelf: [1.2, 2] },
  typical: { gramsPerLitre: [0.1, 0.4], tauSeconds: [900, 1800], shelf: [2, 4] },
  wet: { gramsPerLitre: [0.5, 1.5], tauSeconds: [1800, 3600], shelf: [4, 8] },
};

/**
 * A pull-down from atmosphere for a system of `volumeLitres` with this rig and condition, ending
 * when the noise-free curve first reaches `isolateAtMicrons` (at most 5 h), as the simulator's spec.
 */
export function seedPulldown(args: { volumeLitres: number; rig: SeedRig; condition: SeedCondition; isolateAtMicrons: number; seed: number; keep?: Pick<PulldownSpec, "oilOscillation" | "freezeStall"> }): PulldownSpec {
  const rng: Rng = makeRng(args.seed);
  const { high, low } = rigSpeeds(args.rig, rng.uniform(0.8, 1));
  const w = WATER[args.condition];
  const grams = rng.logUniform(...w.gramsPerLitre) * args.volumeLitres;
  const tau = rng.uniform(...w.tauSeconds);
  const ultimate = args.rig.blankOffMicrons + rng.uniform(5, 25);
  const base: Omit<PulldownSpec, "durationSeconds"> = {
    startMicrons: 760_000,
    ultimateMicrons: ultimate,
    fastTauSeconds: args.volumeLitres / high,
    speedKneeMicrons: 500 * Math.max(high / low - 1, 0),
    moistureMicrons: Math.max((grams * MICRON_LITRES_PER_GRAM) / (tau * low), rng.uniform(...w.shelf) * args.isolateAtMicrons),
    moistureTauSeconds: tau,
    ...args.keep,
  };
  const maxSeconds = 5 * 3600;
  const probe = makePulldownCurve({ ...base, oilOscillation: false, durationSeconds: maxSeconds }, makeRng(args.seed + 1));
  let t = 0;
  while (t < maxSeconds && probe.at(t) > args.isolateAtMicrons) t += 2;
  return { ...base, durationSeconds: Math.max(t, 120) };
}
