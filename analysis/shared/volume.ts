/**
 * Internal volume of a system from its line set (ACR copper tube) and coil, and the leak rate in physical
 * units that a rate of rise means for that volume.
 */
import { LogError } from "./errors";
import type { LeakRate, SystemVolume } from "../decay/types";
import { PA_PER_MICRON } from "./units";

export type TubeTemper = "annealed" | "drawn";

/**
 * ACR copper tube, ASTM B280: outside diameter and wall (inches) of each size in the tempers the
 * standard makes it in. Drawn (straight lengths): B280-20 Table 1, read in the standard. Annealed
 * (coils): the standard's coil table as transcribed in tests/reference/CHECK-VALUES.md and
 * in secondary references. 5/16 comes in coils only; 1-5/8 and 2-1/8 in straight lengths only
 * (this table offers them so; 3/4 coils also come with a 0.042 wall, the 0.035 one is used here).
 */
export const ACR_TUBE: Readonly<Record<string, { odIn: number; wallIn: Readonly<Partial<Record<TubeTemper, number>>> }>> = {
  "1/4": { odIn: 0.25, wallIn: { annealed: 0.03, drawn: 0.025 } },
  "5/16": { odIn: 0.312, wallIn: { annealed: 0.032 } },
  "3/8": { odIn: 0.375, wallIn: { annealed: 0.032, drawn: 0.03 } },
  "1/2": { odIn: 0.5, wallIn: { annealed: 0.032, drawn: 0.035 } },
  "5/8": { odIn: 0.625, wallIn: { annealed: 0.035, drawn: 0.04 } },
  "3/4": { odIn: 0.75, wallIn: { annealed: 0.035, drawn: 0.042 } },
  "7/8": { odIn: 0.875, wallIn: { annealed: 0.045, drawn: 0.045 } },
  "1-1/8": { odIn: 1.125, wallIn: { annealed: 0.05, drawn: 0.05 } },
  "1-3/8": { odIn: 1.375, wallIn: { annealed: 0.055, drawn: 0.055 } },
  "1-5/8": { odIn: 1.625, wallIn: { drawn: 0.06 } },
  "2-1/8": { odIn: 2.125, wallIn: { drawn: 0.07 } },
};

/** The temper a size is really made in: the one asked for when B280 lists it, else the only one it lists. */
export function temperOf(od: string, temper: TubeTemper = "annealed"): TubeTemper {
  const row = ACR_TUBE[od.trim()];
  if (!row) throw new LogError("invalid_option", `tube size "${od}" is not an ACR size (${Object.keys(ACR_TUBE).join(", ")})`);
  return row.wallIn[temper] !== undefined ? temper : temper === "annealed" ? "drawn" : "annealed";
}

/** Inside diameter (inches) of an ACR size and temper: OD − 2 × wall (ASTM B280); see temperOf for a temper B280 does not make. */
export function tubeInsideDiameterIn(od: string, temper: TubeTemper = "annealed"): number {
  const t = temperOf(od, temper);
  const row = ACR_TUBE[od.trim()];
  return row.odIn - 2 * row.wallIn[t]!;
}

/** Inside diameters (inches) by size and temper, from ACR_TUBE (both tempers filled, see temperOf). */
export const ACR_TUBE_ID_INCHES: Readonly<Record<string, Readonly<Record<TubeTemper, number>>>> = Object.fromEntries(
  Object.keys(ACR_TUBE).map((od) => [od, { annealed: tubeInsideDiameterIn(od, "annealed"), drawn: tubeInsideDiameterIn(od, "drawn") }]),
);

/** Litres in one cubic inch: 2.54³ cm³ = 16.387064 mL, exact (inch = 2.54 cm by definition). */
const LITRES_PER_CUBIC_INCH = 0.016387064;

/**
 * Internal volume of one foot of ACR copper tube, litres: π/4 · ID² · 12 in, ID = OD − 2 × wall from
 * ASTM B280 for the nominal OD ("1/4" … "2-1/8") and temper (default annealed, the soft coils line
 * sets are run in; common practice, no published source; a size made in one temper only uses it).
 * Throws LogError("invalid_option") for a size not in the table.
 */
export function tubeLitresPerFoot(od: string, temper: TubeTemper = "annealed"): number {
  const id = tubeInsideDiameterIn(od, temper);
  return (Math.PI / 4) * id * id * 12 * LITRES_PER_CUBIC_INCH;
}

/**
 * Internal volume of the system, litres. A positive `litres` given wins; otherwise the sum of the line
 * sets (liquid line + suction line, each lengthFeet long, tubeLitresPerFoot) and coilLitres. null when
 * nothing is known. Throws LogError("invalid_option") for a negative or non-finite length or volume.
 */
export function systemVolumeLitres(v: SystemVolume): number | null {
  if (v.litres !== undefined) {
    if (!(Number.isFinite(v.litres) && v.litres > 0)) throw new LogError("invalid_option", `system volume ${v.litres} L must be a positive number`);
    return v.litres;
  }
  if (!v.lineSet?.length && v.coilLitres === undefined) return null;
  let litres = 0;
  for (const set of v.lineSet ?? []) {
    if (!(Number.isFinite(set.lengthFeet) && set.lengthFeet >= 0)) throw new LogError("invalid_option", `line-set length ${set.lengthFeet} ft must be zero or more`);
    litres += set.lengthFeet * (tubeLitresPerFoot(set.liquidOd, set.temper) + tubeLitresPerFoot(set.suctionOd, set.temper));
  }
  if (v.coilLitres !== undefined) {
    if (!(Number.isFinite(v.coilLitres) && v.coilLitres >= 0)) throw new LogError("invalid_option", `coil volume ${v.coilLitres} L must be zero or more`);
    litres += v.coilLitres;
  }
  return litres;
}

/**
 * Gas load (leak rate) behind a pressure rise in a closed volume: Q = V · dp/dt (rate-of-rise method).
 * In: rise in microns per minute, volume in litres. Out: Pa·m³/s, mbar·L/s and micron·L/min.
 * Example (CHECK-VALUES.md): 2 L rising 1 Torr in 600 s → 3.3e-3 Torr·L/s = 4.4e-4 Pa·m³/s.
 * Reference: rate-of-rise leak measurement, e.g. K. Zapfe, "Leak Detection", CERN Accelerator School (2006).
 */
export function leakRateFromRise(micronsPerMinute: number, volumeLitres: number): LeakRate {
  const paPerSecond = (micronsPerMinute * PA_PER_MICRON) / 60;
  return {
    volumeLitres,
    paM3PerSecond: (volumeLitres / 1000) * paPerSecond,
    mbarLitresPerSecond: volumeLitres * (paPerSecond / 100),
    micronLitresPerMinute: volumeLitres * micronsPerMinute,
  };
}
