/**
 * Nitrogen standing-pressure test: is a drop (or rise) between two gauge readings explained by
 * the temperature change, or is it a leak?
 *
 * Method: ideal gas at constant volume, in absolute units (Gay-Lussac / Amontons):
 *   P2,abs = P1,abs · T2,abs / T1,abs
 * with P,abs = P,gauge + atmosphere (14.696 psia, 101.325 kPa or 1.01325 bar unless entered)
 * and T,abs = °F + 459.67 (°R) or °C + 273.15 (K). Nitrogen at a few hundred psig and room
 * temperature deviates from the ideal gas by well under 1 % in compressibility, and the change
 * of that deviation over a few tens of degrees is far below gauge resolution, so the ideal form
 * is what the trade uses.
 *
 * Verdict tolerance (our choice, common practice, no published source): a measured end within
 *   gauge resolution (default 1 psi, 5 kPa or 0.05 bar) + the pressure effect of the thermometer's
 *   uncertainty (default ±1 °F / ±0.5 °C; effect = P2,abs · ΔT / T2,abs)
 * of the expected end "holds"; lower "drops" (a leak beyond what temperature explains); higher
 * "rises" (check the thermometer, where it was placed, and that the regulator was closed off).
 */

export type NitrogenPressureUnit = "psig" | "kpa_gauge" | "bar_gauge";
export type TemperatureUnit = "F" | "C";
export type NitrogenVerdict = "holds" | "drops" | "rises";

/** Standard atmosphere in the absolute unit that goes with each gauge unit (101325 Pa). */
export const STANDARD_ATMOSPHERE: Readonly<Record<NitrogenPressureUnit, number>> = {
  psig: 14.696,
  kpa_gauge: 101.325,
  bar_gauge: 1.01325,
};

/** Default gauge resolution per unit (a typical nitrogen gauge reads to about 1 psi). */
export const DEFAULT_GAUGE_RESOLUTION: Readonly<Record<NitrogenPressureUnit, number>> = {
  psig: 1,
  kpa_gauge: 5,
  bar_gauge: 0.05,
};

/** Default thermometer uncertainty in the temperature unit entered. */
export const DEFAULT_THERMOMETER_UNCERTAINTY: Readonly<Record<TemperatureUnit, number>> = { F: 1, C: 0.5 };

/** Unit words: a gauge reading, an absolute one, and a difference between two readings. */
export const PRESSURE_UNIT_LABEL: Readonly<Record<NitrogenPressureUnit, { gauge: string; absolute: string; difference: string }>> = {
  psig: { gauge: "psig", absolute: "psia", difference: "psi" },
  kpa_gauge: { gauge: "kPa gauge", absolute: "kPa abs", difference: "kPa" },
  bar_gauge: { gauge: "bar gauge", absolute: "bar abs", difference: "bar" },
};

export const TEMPERATURE_LABEL: Readonly<Record<TemperatureUnit, { unit: string; absolute: string; offset: number }>> = {
  F: { unit: "°F", absolute: "°R", offset: 459.67 },
  C: { unit: "°C", absolute: "K", offset: 273.15 },
};

/** The cautions shown with every nitrogen test, whatever the result. */
export const NITROGEN_CAUTIONS: readonly string[] = [
  "Use dry nitrogen only, always through a pressure regulator.",
  "Keep a relief valve in place on the regulator or the test hose.",
  "Never pressurise with oxygen or compressed air.",
  "Never exceed the system's rated test pressure; follow the equipment maker's limits and local codes.",
];

export interface NitrogenReading {
  /** Gauge pressure in the test's unit. */
  pressureGauge: number;
  /** Temperature (ambient or on the line) in the test's temperature unit. */
  temperature: number;
}

export interface NitrogenTestInput {
  unit: NitrogenPressureUnit;
  temperatureUnit: TemperatureUnit;
  start: NitrogenReading;
  end: NitrogenReading;
  /** Local atmosphere in the absolute unit (psia, kPa, bar); default standard atmosphere. */
  atmosphereAbs?: number;
  /** The system's rated (nameplate) test pressure, gauge, same unit. */
  ratedTestPressureGauge?: number | null;
  /** Gauge resolution, same unit; default DEFAULT_GAUGE_RESOLUTION. */
  gaugeResolution?: number;
  /** Thermometer uncertainty in the temperature unit; default DEFAULT_THERMOMETER_UNCERTAINTY. */
  thermometerUncertainty?: number;
}

/** One line of the correction, worked out, for the UI to show as written arithmetic. */
export interface NitrogenStep {
  key: string;
  label: string;
  /** The arithmetic in words and numbers, e.g. "300 + 14.696". */
  expression: string;
  value: number;
  unit: string;
  /** Decimals to show the value with (enough to follow the arithmetic by hand). */
  displayDigits: number;
}

export interface NitrogenWarning {
  code: "above_rated_pressure" | "rated_pressure_missing" | "under_vacuum" | "temperature_implausible";
  message: string;
}

export interface NitrogenResult {
  verdict: NitrogenVerdict;
  /** Expected end pressure, gauge, test unit. */
  expectedEndGauge: number;
  expectedEndAbs: number;
  /** Measured end minus expected end, gauge unit (negative = lower than temperature explains). */
  differenceGauge: number;
  /** Raw drop start − end, gauge unit. */
  rawDropGauge: number;
  /** Of the raw drop, the part that temperature explains: start − expected end. */
  temperatureExplainedDropGauge: number;
  toleranceGauge: number;
  atmosphereAbs: number;
  steps: NitrogenStep[];
  warnings: NitrogenWarning[];
  cautions: readonly string[];
  summary: string;
}

/** Round for display in steps: enough digits to follow the arithmetic by hand. */
function r(value: number, digits = 3): string {
  return Number(value.toFixed(digits)).toString();
}

function check(input: NitrogenTestInput): void {
  const finite = (v: unknown, name: string) => {
    if (typeof v !== "number" || !Number.isFinite(v)) throw new RangeError(`${name} must be a number`);
  };
  if (!(input.unit in STANDARD_ATMOSPHERE)) throw new RangeError(`unit '${String(input.unit)}' is not psig, kpa_gauge or bar_gauge`);
  if (!(input.temperatureUnit in TEMPERATURE_LABEL)) throw new RangeError(`temperature unit '${String(input.temperatureUnit)}' is not F or C`);
  finite(input.start.pressureGauge, "start pressure");
  finite(input.end.pressureGauge, "end pressure");
  finite(input.start.temperature, "start temperature");
  finite(input.end.temperature, "end temperature");
  const off = TEMPERATURE_LABEL[input.temperatureUnit].offset;
  if (input.start.temperature + off <= 0 || input.end.temperature + off <= 0) throw new RangeError("temperature is below absolute zero");
  if (input.atmosphereAbs !== undefined && !(input.atmosphereAbs > 0)) throw new RangeError("atmosphere must be above zero");
}

/**
 * Temperature-corrected expected end pressure and verdict of a nitrogen standing-pressure test.
 * Ideal gas at constant volume in absolute units: P2 = P1 · T2 / T1 (see the file comment).
 * Inputs and outputs in the test's gauge unit; the steps carry the absolute values.
 */
export function evaluateNitrogenTest(input: NitrogenTestInput): NitrogenResult {
  check(input);
  const { unit, temperatureUnit } = input;
  const pl = PRESSURE_UNIT_LABEL[unit];
  const tl = TEMPERATURE_LABEL[temperatureUnit];
  const atm = input.atmosphereAbs ?? STANDARD_ATMOSPHERE[unit];
  const resolution = input.gaugeResolution ?? DEFAULT_GAUGE_RESOLUTION[unit];
  const thermo = input.thermometerUncertainty ?? DEFAULT_THERMOMETER_UNCERTAINTY[temperatureUnit];

  const p1Abs = input.start.pressureGauge + atm;
  const t1Abs = input.start.temperature + tl.offset;
  const t2Abs = input.end.temperature + tl.offset;
  const p2AbsExpected = (p1Abs * t2Abs) / t1Abs;
  const expectedEndGauge = p2AbsExpected - atm;
  const differenceGauge = input.end.pressureGauge - expectedEndGauge;
  const thermoEffect = (p2AbsExpected * thermo) / t2Abs;
  const tolerance = resolution + thermoEffect;

  const verdict: NitrogenVerdict = differenceGauge < -tolerance ? "drops" : differenceGauge > tolerance ? "rises" : "holds";

  const steps: NitrogenStep[] = [
    { key: "p1_abs", label: "Start pressure, absolute", expression: `${r(input.start.pressureGauge)} ${pl.gauge} + ${r(atm)}`, value: p1Abs, unit: pl.absolute, displayDigits: 3 },
    { key: "t1_abs", label: "Start temperature, absolute", expression: `${r(input.start.temperature)} ${tl.unit} + ${tl.offset}`, value: t1Abs, unit: tl.absolute, displayDigits: 2 },
    { key: "t2_abs", label: "End temperature, absolute", expression: `${r(input.end.temperature)} ${tl.unit} + ${tl.offset}`, value: t2Abs, unit: tl.absolute, displayDigits: 2 },
    { key: "p2_abs", label: "Expected end pressure, absolute", expression: `${r(p1Abs)} × ${r(t2Abs, 2)} ÷ ${r(t1Abs, 2)}`, value: p2AbsExpected, unit: pl.absolute, displayDigits: 3 },
    { key: "p2_gauge", label: "Expected end pressure, gauge", expression: `${r(p2AbsExpected)} − ${r(atm)}`, value: expectedEndGauge, unit: pl.gauge, displayDigits: 2 },
    { key: "difference", label: "Measured minus expected", expression: `${r(input.end.pressureGauge)} − ${r(expectedEndGauge, 2)}`, value: differenceGauge, unit: pl.difference, displayDigits: 2 },
    { key: "tolerance", label: "Tolerance (gauge resolution + thermometer)", expression: `${r(resolution)} + ${r(p2AbsExpected)} × ${r(thermo)} ÷ ${r(t2Abs, 2)}`, value: tolerance, unit: pl.difference, displayDigits: 2 },
  ];

  const warnings: NitrogenWarning[] = [];
  const rated = input.ratedTestPressureGauge;
  const highest = Math.max(input.start.pressureGauge, input.end.pressureGauge);
  if (rated === undefined || rated === null) {
    warnings.push({ code: "rated_pressure_missing", message: "Enter the system's rated test pressure from the nameplate so Riseline can check the test stayed below it." });
  } else if (highest > rated) {
    warnings.push({
      code: "above_rated_pressure",
      message: `The test pressure (${r(highest, 1)} ${pl.gauge}) is above the system's rated test pressure (${r(rated, 1)} ${pl.gauge}). Release pressure through the regulator now and test at or below the rating.`,
    });
  }
  if (input.start.pressureGauge <= 0 || input.end.pressureGauge <= 0)
    warnings.push({ code: "under_vacuum", message: "A reading at or below 0 gauge is not a nitrogen standing-pressure test; check the unit and the readings." });
  const cOf = (t: number) => (temperatureUnit === "C" ? t : ((t - 32) * 5) / 9);
  for (const t of [input.start.temperature, input.end.temperature])
    if (cOf(t) < -40 || cOf(t) > 70) {
      warnings.push({ code: "temperature_implausible", message: `A temperature of ${r(t, 1)} ${tl.unit} is outside what a line or the air usually reads; check the unit (°F or °C).` });
      break;
    }

  const explained = input.start.pressureGauge - expectedEndGauge;
  const summary =
    verdict === "holds"
      ? `Holds: the end reading is within ${r(tolerance, 2)} ${pl.difference} of the ${r(expectedEndGauge, 2)} ${pl.gauge} the temperature change explains.`
      : verdict === "drops"
        ? `Drops: ${r(-differenceGauge, 2)} ${pl.difference} lower than the temperature change explains. Look for a leak.`
        : `Rises: ${r(differenceGauge, 2)} ${pl.difference} higher than the temperature change explains. Check the thermometer and its placement, and that the regulator is closed off from the system.`;

  return {
    verdict,
    expectedEndGauge,
    expectedEndAbs: p2AbsExpected,
    differenceGauge,
    rawDropGauge: input.start.pressureGauge - input.end.pressureGauge,
    temperatureExplainedDropGauge: explained,
    toleranceGauge: tolerance,
    atmosphereAbs: atm,
    steps,
    warnings,
    cautions: NITROGEN_CAUTIONS,
    summary,
  };
}
