/**
 * Minimal typing for the CommonJS `psychrolib` package (PsychroLib 1.1.1, Meyer & Thevenard, JOSS 4(33)
 * 1137, 2019): only what Riseline calls. Its methods use `this`: call them as psychrolib.X(...), never
 * detached. Set SI units once with psychrolib.SetUnitSystem(psychrolib.SI).
 */
declare module "psychrolib" {
  interface Psychrometrics {
    readonly IP: number;
    readonly SI: number;
    SetUnitSystem(unitSystem: number): void;
    GetUnitSystem(): number | undefined;
    /** Saturation vapour pressure, Pa [SI], over ice at or below the triple point, over liquid above; −100…200 °C. */
    GetSatVapPres(tDryBulbC: number): number;
    /** Dew/frost point, °C [SI], from the partial pressure of water vapour in Pa. */
    GetTDewPointFromVapPres(tDryBulbC: number, vapPresPa: number): number;
  }
  const psychrolib: Psychrometrics;
  export default psychrolib;
}
