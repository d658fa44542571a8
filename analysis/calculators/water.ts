/**
 * Water and ice at deep-vacuum pressures: the saturation (vapour) pressure of water, and its inverse —
 * the temperature at which water or ice is in equilibrium with a given vacuum (below about 4,588 microns
 * that is the frost point: water left in the system boils, cools itself and freezes).
 *
 * Saturation pressure from PsychroLib (npm `psychrolib`; D. Meyer & D. Thevenard, JOSS 4(33) 1137, 2019),
 * which implements the Hyland–Wexler equations of ASHRAE Handbook Fundamentals 2017 ch.1 eq. 5 (over ice,
 * −100…0.01 °C) and eq. 6 (over liquid water, 0.01…200 °C), switching at the triple point 0.01 °C.
 */
import psychrolib from "psychrolib";
import { PA_PER_MICRON } from "../shared/units";

psychrolib.SetUnitSystem(psychrolib.SI);

/** Range of the Hyland–Wexler equations in PsychroLib, °C. */
export const WATER_MIN_C = -100;
export const WATER_MAX_C = 200;

/**
 * Saturation vapour pressure of water in Pa at tempC (°C): over ice at or below the triple point
 * (0.01 °C), over liquid water above, as PsychroLib's GetSatVapPres. NaN outside −100…200 °C.
 * Reference: ASHRAE Handbook Fundamentals 2017 ch.1 eqs. 5–6 (Hyland & Wexler 1983), via PsychroLib.
 */
export function waterVapourPressurePa(tempC: number): number {
  if (!(tempC >= WATER_MIN_C && tempC <= WATER_MAX_C)) return NaN;
  return psychrolib.GetSatVapPres(tempC);
}

/**
 * Temperature in °C at which water (ice below the triple point, liquid above) is in equilibrium with a
 * vacuum of `microns`: the inverse of waterVapourPressurePa, by bisection on ln p over −100…200 °C to
 * 1e-9 °C (the saturation curve is strictly increasing; the two branches meet at the triple point, so the
 * inverse is continuous). Below the triple-point pressure (≈ 4,588 microns) this is the ice (frost) point;
 * above it the boiling point of water. NaN when the pressure lies outside the equations' range.
 * Units: microns of mercury in (1 micron = 101325/760/1000 Pa, units.ts), °C out.
 */
export function iceEquilibriumC(microns: number): number {
  const pa = microns * PA_PER_MICRON;
  const lnTarget = Math.log(pa);
  const lnAt = (c: number) => Math.log(psychrolib.GetSatVapPres(c));
  let lo = WATER_MIN_C;
  let hi = WATER_MAX_C;
  if (!(lnTarget >= lnAt(lo) && lnTarget <= lnAt(hi))) return NaN;
  while (hi - lo > 1e-9) {
    const mid = (lo + hi) / 2;
    if (lnAt(mid) < lnTarget) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/**
 * Temperature in °C at which water boils (or, below the triple point, ice sublimes) at `microns`:
 * the same inversion as iceEquilibriumC, named for the screen that explains boiling moisture out.
 */
export function waterBoilingC(microns: number): number {
  return iceEquilibriumC(microns);
}
