/**
 * Gas flow through a small opening (a depressed valve core, a core depressor, a valve body) at
 * the high pressures at the start of a pull-down, where the flow is compressible and chokes.
 *
 * Method: isentropic flow of an ideal gas through a nozzle from stagnation pressure p_u and
 * temperature T into p_d (J. D. Anderson, "Modern Compressible Flow", ch. 5, quasi-one-dimensional
 * flow; any gas-dynamics text):
 *   r = p_d / p_u;  critical ratio r* = (2/(γ+1))^(γ/(γ−1)) = 0.5283 for γ = 1.4
 *   r ≥ r*:  ṁ = A · p_u · √( 2γ/((γ−1) R T) · (r^(2/γ) − r^((γ+1)/γ)) )
 *   r < r*:  ṁ = A · p_u · √(γ / (R T)) · (2/(γ+1))^((γ+1)/(2(γ−1)))      (choked: sonic at the throat)
 * Throughput Q = ṁ · R · T (Pa·m³/s, ×10 for mbar·L/s). A choked opening passes a volume flow at
 * the upstream pressure of A · √(γ R T) · (2/(γ+1))^((γ+1)/(2(γ−1))) whatever the pump does
 * downstream: 19.86 L/s per cm² for air at 20 °C (γ = 1.4, R = 287.05 J/(kg·K)).
 * A is the effective flow area (geometric area × discharge coefficient); the planner's opening
 * sizes are effective ones. Units here: area in cm², pressures in mbar, throughput in mbar·L/s.
 */

/** Ratio of specific heats of air (diatomic ideal gas), dimensionless. */
export const GAMMA_AIR = 1.4;
/** Specific gas constant of dry air, J/(kg·K) (ISO 2533 value, 287.05287). */
export const R_AIR = 287.05287;
/** Air at the system, K (20 °C, the temperature the rest of the planner's formulas assume). */
export const T_AIR_K = 293.15;

/** The pressure ratio below which the flow chokes: (2/(γ+1))^(γ/(γ−1)). */
export function criticalPressureRatio(gamma = GAMMA_AIR): number {
  return Math.pow(2 / (gamma + 1), gamma / (gamma - 1));
}

/**
 * Volume flow at upstream conditions through a choked opening, L/s per cm² of effective area:
 * √(γ R T) · (2/(γ+1))^((γ+1)/(2(γ−1))) m/s × 0.1 (1e-4 m² per cm², 1000 L per m³).
 */
export function chokedSpeedLpsPerCm2(gamma = GAMMA_AIR, rSpecific = R_AIR, temperatureK = T_AIR_K): number {
  const speed = Math.sqrt(gamma * rSpecific * temperatureK) * Math.pow(2 / (gamma + 1), (gamma + 1) / (2 * (gamma - 1)));
  return speed * 0.1;
}

/**
 * Isentropic throughput (mbar·L/s) through an opening of effective area `areaCm2` from `upMbar`
 * to `downMbar` (see the file comment): subsonic below the critical ratio's pressure drop, choked
 * beyond it. 0 when downMbar ≥ upMbar.
 */
export function nozzleThroughput(areaCm2: number, upMbar: number, downMbar: number, gamma = GAMMA_AIR, rSpecific = R_AIR, temperatureK = T_AIR_K): number {
  if (!(upMbar > downMbar) || upMbar <= 0) return 0;
  const r = Math.max(downMbar, 0) / upMbar;
  const rStar = criticalPressureRatio(gamma);
  if (r <= rStar) return areaCm2 * chokedSpeedLpsPerCm2(gamma, rSpecific, temperatureK) * upMbar;
  // ṁ R T / (A p_u) = √(2γ R T/(γ−1) · (r^(2/γ) − r^((γ+1)/γ))) m/s; × 0.1 for L/s per cm².
  const speed = Math.sqrt(((2 * gamma * rSpecific * temperatureK) / (gamma - 1)) * (Math.pow(r, 2 / gamma) - Math.pow(r, (gamma + 1) / gamma)));
  return areaCm2 * speed * 0.1 * upMbar;
}
