/**
 * The atmosphere a gauge reading is relative to: its plausible range in each absolute unit, and
 * the standard atmosphere at a site's elevation.
 *
 * Standard atmosphere (ISO 2533:1975 / ICAO Doc 7488, identical to the 1976 US Standard
 * Atmosphere below 32 km), troposphere layer (below 11 km geopotential):
 *   p = p0 · (1 − L·H / T0)^(g0·M / (R·L))
 * with p0 = 101325 Pa, T0 = 288.15 K, lapse rate L = 0.0065 K/m, g0 = 9.80665 m/s²,
 * R/M = 287.05287 J/(kg·K) for dry air, so the exponent is 5.255877.
 * H is geopotential height; at a site's elevation (below 4.3 km) it differs from the geometric
 * height z by z²/(r + z) < 3.1 m (r = 6,356,766 m), at most about 25 Pa (0.004 psi) in pressure,
 * so the elevation is used as H.
 * Weather moves the real pressure a few per cent either side of this; a barometer reading (as
 * station pressure, not corrected to sea level) is better where one is at hand.
 */

export type AtmosphereUnit = "psia" | "kpa" | "bar";

/** Pa in one unit of each absolute unit (NIST SP 811: psi = 6894.757293168 Pa). */
export const PA_PER_ATMOSPHERE_UNIT: Readonly<Record<AtmosphereUnit, number>> = { psia: 6894.757293168, kpa: 1000, bar: 1e5 };

/**
 * The range of local atmospheric pressure a site can have, per unit: from about 4,400 m up
 * (58 kPa) to below sea level in deep valleys with high weather pressure (107 kPa). Our rule,
 * common practice, no published source; the psia and bar bounds are the same range rounded.
 */
export const PLAUSIBLE_ATMOSPHERE: Readonly<Record<AtmosphereUnit, { min: number; max: number }>> = {
  psia: { min: 8.5, max: 15.5 },
  kpa: { min: 58, max: 107 },
  bar: { min: 0.58, max: 1.07 },
};

export const ATMOSPHERE_UNIT_LABEL: Readonly<Record<AtmosphereUnit, string>> = { psia: "psia", kpa: "kPa abs", bar: "bar abs" };

const P0_PA = 101325;
const T0_K = 288.15;
const LAPSE_K_PER_M = 0.0065;
/** g0 / (R_air · L) = 9.80665 / (287.05287 × 0.0065). */
const EXPONENT = 9.80665 / (287.05287 * LAPSE_K_PER_M);
export const METRES_PER_FOOT = 0.3048;

/** Elevations the standard-atmosphere estimate is offered for (m): the Dead Sea shore (106.8 kPa) to 4,300 m (59.3 kPa, 8.6 psia), inside the plausible range above. */
export const ELEVATION_RANGE_M = { min: -450, max: 4300 };

/**
 * Standard-atmosphere pressure (Pa) at an elevation in metres (ISO 2533 troposphere formula above).
 * Throws RangeError outside ELEVATION_RANGE_M or for a non-finite elevation.
 */
export function standardAtmospherePa(elevationM: number): number {
  if (!Number.isFinite(elevationM)) throw new RangeError("elevation must be a number");
  if (elevationM < ELEVATION_RANGE_M.min || elevationM > ELEVATION_RANGE_M.max)
    throw new RangeError(`elevation ${Math.round(elevationM)} m is outside ${ELEVATION_RANGE_M.min} to ${ELEVATION_RANGE_M.max} m`);
  return P0_PA * Math.pow(1 - (LAPSE_K_PER_M * elevationM) / T0_K, EXPONENT);
}

/** The standard atmosphere at an elevation given in metres or feet, in one absolute unit. */
export function atmosphereAtElevation(elevation: number, elevationUnit: "m" | "ft", unit: AtmosphereUnit): number {
  const metres = elevationUnit === "ft" ? elevation * METRES_PER_FOOT : elevation;
  return standardAtmospherePa(metres) / PA_PER_ATMOSPHERE_UNIT[unit];
}

/**
 * Checks an atmosphere entered (or computed) in `unit` against PLAUSIBLE_ATMOSPHERE and throws a
 * RangeError that says what is wrong and what was probably meant: 101.3 entered for a psi test is
 * kPa, 14.7 for a kPa test is psi.
 */
export function checkAtmosphere(value: number, unit: AtmosphereUnit): void {
  if (!Number.isFinite(value)) throw new RangeError("atmosphere must be a number");
  const { min, max } = PLAUSIBLE_ATMOSPHERE[unit];
  if (value >= min && value <= max) return;
  const label = ATMOSPHERE_UNIT_LABEL[unit];
  const pa = value * PA_PER_ATMOSPHERE_UNIT[unit];
  const other = (Object.keys(PLAUSIBLE_ATMOSPHERE) as AtmosphereUnit[]).find((u) => {
    const r = PLAUSIBLE_ATMOSPHERE[u];
    return u !== unit && value >= r.min && value <= r.max;
  });
  const hint = other ? ` ${value} looks like ${ATMOSPHERE_UNIT_LABEL[other]}, not ${label}.` : "";
  throw new RangeError(
    `atmosphere ${value} ${label} (${Math.round(pa / 100) / 10} kPa) is outside the ${min}–${max} ${label} a site can have.${hint} Enter it in ${label}, or give the site's elevation instead.`,
  );
}
