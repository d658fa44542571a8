/**
 * The water and outgassing load of a pull-down: what keeps a real system above the gas-only
 * curve for tens of minutes. Stated as an assumption the technician can change.
 *
 * Model: the system holds an amount of water (adsorbed on the copper, dissolved in the oil; plus
 * refrigerant dissolved in the oil of a circuit that has run, lumped in as its water equivalent)
 * that comes off as vapour. Its sites hold it with a spread of binding energies, so the release
 * times τ spread evenly in ln τ between τ_min and τ_max; each part empties first-order, and the
 * sum is the classic 1/t outgassing of water from unbaked surfaces between the two (J. F.
 * O'Hanlon, "A User's Guide to Vacuum Technology", ch. 4, outgassing of water vapour):
 *   Q(t) = N / ln(τ_max/τ_min) · (e^(−t/τ_max) − e^(−t/τ_min)) / t,   Q(0) = N / ln(τ_max/τ_min) · (1/τ_min − 1/τ_max)
 * which releases N in all. N = m · R T / M_water with m in grams, M_water = 18.015 g/mol,
 * T = 293.15 K: 1 g of water is 1,353 mbar·L of vapour. Q is added to the gas balance
 * V dp/dt = −Q_pumped(p) + Q(t) (planner.ts).
 * The amounts and release times per condition are our estimates, common practice, no published
 * source. Ice (below about 4,600 microns water can freeze) slows the release further; a wet
 * system with ice takes longer than even the slow end of its range.
 */

export type SystemCondition = "dry" | "typical" | "wet";

/** How much water a condition means, per litre of system volume (the copper's surface and the oil charge grow with it). */
export interface WaterPreset {
  gramsPerLitre: number;
  releaseMinSeconds: number;
  releaseMaxSeconds: number;
}

export interface WaterLoad {
  /** Water (equivalent) to remove, grams. */
  waterGrams: number;
  /** Shortest and longest release time (e-folding) of its parts, seconds. */
  releaseMinSeconds: number;
  releaseMaxSeconds: number;
}

/** mbar·L of water vapour in one gram at 20 °C: R T / M = 8.314462618 × 293.15 / 18.015 J/g = 135.30 Pa·m³/g. */
export const MBAR_LITRES_PER_GRAM_WATER = ((8.314462618 * 293.15) / 18.015) * 10;

/**
 * The three cases of each condition, fast end to slow end, per litre of system (our estimates;
 * see the file comment): a 5 L split opened for a repair gives up about 0.8 g (0.3–2 g).
 */
export const WATER_LOAD_PRESETS: Readonly<Record<SystemCondition, Readonly<Record<"fast" | "likely" | "slow", WaterPreset>>>> = {
  dry: {
    fast: { gramsPerLitre: 0.01, releaseMinSeconds: 60, releaseMaxSeconds: 1800 },
    likely: { gramsPerLitre: 0.03, releaseMinSeconds: 60, releaseMaxSeconds: 1800 },
    slow: { gramsPerLitre: 0.08, releaseMinSeconds: 60, releaseMaxSeconds: 1800 },
  },
  typical: {
    fast: { gramsPerLitre: 0.06, releaseMinSeconds: 120, releaseMaxSeconds: 3600 },
    likely: { gramsPerLitre: 0.16, releaseMinSeconds: 120, releaseMaxSeconds: 3600 },
    slow: { gramsPerLitre: 0.4, releaseMinSeconds: 120, releaseMaxSeconds: 3600 },
  },
  wet: {
    fast: { gramsPerLitre: 0.4, releaseMinSeconds: 300, releaseMaxSeconds: 14400 },
    likely: { gramsPerLitre: 1, releaseMinSeconds: 300, releaseMaxSeconds: 14400 },
    slow: { gramsPerLitre: 2.4, releaseMinSeconds: 300, releaseMaxSeconds: 14400 },
  },
};

/** The water load of a preset for a system of `volumeLitres`. */
export function loadForVolume(preset: WaterPreset, volumeLitres: number): WaterLoad {
  return { waterGrams: Number((preset.gramsPerLitre * volumeLitres).toPrecision(3)), releaseMinSeconds: preset.releaseMinSeconds, releaseMaxSeconds: preset.releaseMaxSeconds };
}

export const CONDITION_WORDS: Readonly<Record<SystemCondition, string>> = {
  dry: "Dry: new line set and coil, capped and purged with nitrogen while brazing",
  typical: "Typical: a circuit opened for a repair, oil and refrigerant in it",
  wet: "Wet: open to the air for days, water suspected, or after a burn-out",
};

/** Water vapour load Q(t), mbar·L/s, t in seconds from the start of the pull-down (see the file comment). */
export function waterLoadMbarLps(load: WaterLoad, tSeconds: number): number {
  if (load.waterGrams <= 0) return 0;
  const n = load.waterGrams * MBAR_LITRES_PER_GRAM_WATER;
  const a = load.releaseMinSeconds;
  const b = load.releaseMaxSeconds;
  const spread = Math.log(b / a);
  // Near t = 0 the difference quotient loses digits; its series is (1/a − 1/b) − t(1/a² − 1/b²)/2.
  if (tSeconds < a * 1e-3) return (n / spread) * (1 / a - 1 / b - (tSeconds * (1 / (a * a) - 1 / (b * b))) / 2);
  return ((n / spread) * (Math.exp(-tSeconds / b) - Math.exp(-tSeconds / a))) / tSeconds;
}

/** Water (grams) the load has given up by time t: the integral of Q from 0 to t ÷ 1,353 mbar·L/g (trapezoid, for checks). */
export function waterReleasedGrams(load: WaterLoad, tSeconds: number, steps = 4000): number {
  let sum = 0;
  const h = tSeconds / steps;
  for (let k = 0; k <= steps; k++) sum += (k === 0 || k === steps ? 0.5 : 1) * waterLoadMbarLps(load, k * h);
  return (sum * h) / MBAR_LITRES_PER_GRAM_WATER;
}

/**
 * The condition the system's own history suggests: the verdict of its last decay test with one
 * (moisture in the last hold → wet; tight and dry → typical for a circuit opened again; none → null).
 * Common practice, no published source.
 */
export function conditionFromHistory(verdicts: readonly (string | null)[]): { condition: SystemCondition; why: string } | null {
  const last = verdicts.find((v) => v !== null && v !== "inconclusive");
  if (!last) return null;
  if (last === "moisture" || last === "leak_and_moisture") return { condition: "wet", why: "its last decay test levelled off high: moisture" };
  return { condition: "typical", why: `its last decay test was ${last === "pass" ? "tight and dry" : `a ${last.replace(/_/g, " ")}`}` };
}
