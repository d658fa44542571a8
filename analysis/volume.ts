/**
 * Internal volume of a system from its line set (ACR copper tube) and coil, and the leak rate in physical
 * units that a rate of rise means for that volume.
 */
import { LogError } from "./errors";
import type { LeakRate, SystemVolume } from "./types";
import { PA_PER_MICRON } from "./units";

export type TubeTemper = "annealed" | "drawn";

/**
 * Inside diameters (inches) of ACR copper tube, ASTM B280 (transcription of the standard's table,
 * /work/shared/reference/CHECK-VALUES.md), by nominal outside diameter; annealed and drawn where the
 * standard's walls differ.
 */
export const ACR_TUBE_ID_INCHES: Readonly<Record<string, Readonly<Record<TubeTemper, number>>>> = {
  "1/4": { annealed: 0.19, drawn: 0.19 },
  "3/8": { annealed: 0.311, drawn: 0.315 },
  "1/2": { annealed: 0.436, drawn: 0.43 },
  "5/8": { annealed: 0.555, drawn: 0.545 },
  "3/4": { annealed: 0.68, drawn: 0.666 },
  "7/8": { annealed: 0.785, drawn: 0.785 },
  "1-1/8": { annealed: 1.025, drawn: 1.025 },
};

/** Litres in one cubic inch: 2.54³ cm³ = 16.387064 mL, exact (inch = 2.54 cm by definition). */
const LITRES_PER_CUBIC_INCH = 0.016387064;

/**
 * Internal volume of one foot of ACR copper tube, litres: π/4 · ID² · 12 in, ID from ASTM B280 for the
 * nominal OD ("1/4" … "1-1/8") and temper (default annealed, the soft coils line sets are run in; common
 * practice, no published source). Throws LogError("invalid_option") for a size not in the table.
 */
export function tubeLitresPerFoot(od: string, temper: TubeTemper = "annealed"): number {
  const row = ACR_TUBE_ID_INCHES[od.trim()];
  if (!row) throw new LogError("invalid_option", `tube size "${od}" is not an ACR size (${Object.keys(ACR_TUBE_ID_INCHES).join(", ")})`);
  const id = row[temper];
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
