/**
 * Unit conversions between the shop's two working systems. Factors from NIST SP 811 (2008),
 * appendix B.8/B.9: 1 ft = 0.3048 m exactly; 1 lb (avoirdupois) = 0.45359237 kg exactly;
 * 1 lbf/in² (psi) = 6.894757 kPa (rounded to 7 significant figures there); t/°F = t/°C·9/5 + 32.
 * Gauge pressure (psig, kPa gauge) converts by the same factor: both are above the same atmosphere.
 */
export const METRE_PER_FOOT = 0.3048;
export const KG_PER_POUND = 0.45359237;
export const KPA_PER_PSI = 6.894757;

export type UnitSystem = "imperial" | "metric";
export const UNIT_SYSTEMS = ["imperial", "metric"] as const satisfies readonly UnitSystem[];

export const fahrenheitFromCelsius = (c: number): number => (c * 9) / 5 + 32;
export const celsiusFromFahrenheit = (f: number): number => ((f - 32) * 5) / 9;
export const metresFromFeet = (ft: number): number => ft * METRE_PER_FOOT;
export const feetFromMetres = (m: number): number => m / METRE_PER_FOOT;
export const kgFromPounds = (lb: number): number => lb * KG_PER_POUND;
export const poundsFromKg = (kg: number): number => kg / KG_PER_POUND;
export const kpaFromPsi = (psi: number): number => psi * KPA_PER_PSI;
export const psiFromKpa = (kpa: number): number => kpa / KPA_PER_PSI;

/** The effective system: the person's own choice when they made one, else the shop's. */
export function effectiveUnitSystem(shop: UnitSystem, person: UnitSystem | null | undefined): UnitSystem {
  return person ?? shop;
}

export function isUnitSystem(v: unknown): v is UnitSystem {
  return v === "imperial" || v === "metric";
}
