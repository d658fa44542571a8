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
 *
 * Over-pressure: every reading of the test (each row of a log, each typed reading, the start and
 * the end) is compared with the system's rated test pressure. Any reading above it makes the
 * result "stopped" whatever the temperature comparison says: the system was taken above what its
 * parts are rated for, and the record says so with the highest reading and when it was.
 *
 * Rate of change: the measured end minus the temperature-corrected expected end, divided by the
 * test's duration in hours (gauge unit per hour; negative = falling beyond what temperature explains).
 */
import { checkAtmosphere, type AtmosphereUnit } from "./atmosphere";
import { durationWords } from "../shared/format";

export type NitrogenPressureUnit = "psig" | "kpa_gauge" | "bar_gauge";
export type TemperatureUnit = "F" | "C";
/** What the temperature comparison says. */
export type TemperatureVerdict = "holds" | "drops" | "rises";
/** The result: the temperature comparison's, or "stopped" when any reading went above the rated test pressure. */
export type NitrogenVerdict = TemperatureVerdict | "stopped";

/** The absolute unit that goes with each gauge unit (for the atmosphere). */
export const ABSOLUTE_UNIT_OF: Readonly<Record<NitrogenPressureUnit, AtmosphereUnit>> = { psig: "psia", kpa_gauge: "kpa", bar_gauge: "bar" };

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

/** One reading of the test anywhere between start and end (a log row or a typed reading). */
export interface NitrogenTimedReading {
  pressureGauge: number;
  /** Seconds from the start of the test, when known. */
  tSeconds: number | null;
  /** 1-based line of the file the reading came from, when it came from a file. */
  line?: number | null;
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
  /** Every reading of the test (log rows, typed readings), checked against the rating with the start and end. */
  readings?: readonly NitrogenTimedReading[];
  /** Seconds from the start reading to the end reading, for the rate per hour. */
  durationSeconds?: number | null;
  /** How the atmosphere was found, in words for the steps ("from 1,600 m elevation, ISO 2533"). */
  atmosphereSource?: string;
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

/** The highest reading of the test and when it was. */
export interface NitrogenHighest {
  pressureGauge: number;
  /** Seconds from the start; null when a typed reading had no time. */
  atSeconds: number | null;
  line: number | null;
  which: "start" | "end" | "reading";
}

export interface NitrogenOverPressure {
  highest: NitrogenHighest;
  ratedGauge: number;
  /** Highest reading minus the rating, gauge unit. */
  excessGauge: number;
  /** How many readings were above the rating. */
  readingsAbove: number;
}

export interface NitrogenResult {
  verdict: NitrogenVerdict;
  /** What the temperature comparison alone says (kept for the record also when the test stopped). */
  temperatureVerdict: TemperatureVerdict;
  highest: NitrogenHighest;
  /** Set when any reading went above the rated test pressure. */
  overPressure: NitrogenOverPressure | null;
  durationSeconds: number | null;
  /** Measured minus expected end per hour of test, gauge unit per hour; null without a duration. */
  ratePerHourGauge: number | null;
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
  if (input.atmosphereAbs !== undefined) checkAtmosphere(input.atmosphereAbs, ABSOLUTE_UNIT_OF[input.unit]);
  for (const [i, r] of (input.readings ?? []).entries()) finite(r.pressureGauge, `reading ${i + 1}`);
  if (input.durationSeconds != null && !(Number.isFinite(input.durationSeconds) && input.durationSeconds > 0)) throw new RangeError("duration must be above zero");
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

  const temperatureVerdict: TemperatureVerdict = differenceGauge < -tolerance ? "drops" : differenceGauge > tolerance ? "rises" : "holds";
  const durationSeconds = input.durationSeconds ?? null;
  const ratePerHourGauge = durationSeconds ? differenceGauge / (durationSeconds / 3600) : null;

  const steps: NitrogenStep[] = [
    { key: "p1_abs", label: "Start pressure, absolute", expression: `${r(input.start.pressureGauge)} ${pl.gauge} + ${r(atm)}${input.atmosphereSource ? ` (atmosphere ${input.atmosphereSource})` : ""}`, value: p1Abs, unit: pl.absolute, displayDigits: 3 },
    { key: "t1_abs", label: "Start temperature, absolute", expression: `${r(input.start.temperature)} ${tl.unit} + ${tl.offset}`, value: t1Abs, unit: tl.absolute, displayDigits: 2 },
    { key: "t2_abs", label: "End temperature, absolute", expression: `${r(input.end.temperature)} ${tl.unit} + ${tl.offset}`, value: t2Abs, unit: tl.absolute, displayDigits: 2 },
    { key: "p2_abs", label: "Expected end pressure, absolute", expression: `${r(p1Abs)} × ${r(t2Abs, 2)} ÷ ${r(t1Abs, 2)}`, value: p2AbsExpected, unit: pl.absolute, displayDigits: 3 },
    { key: "p2_gauge", label: "Expected end pressure, gauge", expression: `${r(p2AbsExpected)} − ${r(atm)}`, value: expectedEndGauge, unit: pl.gauge, displayDigits: 2 },
    { key: "difference", label: "Measured minus expected", expression: `${r(input.end.pressureGauge)} − ${r(expectedEndGauge, 2)}`, value: differenceGauge, unit: pl.difference, displayDigits: 2 },
    { key: "tolerance", label: "Tolerance (gauge resolution + thermometer)", expression: `${r(resolution)} + ${r(p2AbsExpected)} × ${r(thermo)} ÷ ${r(t2Abs, 2)}`, value: tolerance, unit: pl.difference, displayDigits: 2 },
  ];
  if (durationSeconds && ratePerHourGauge !== null)
    steps.push({ key: "rate_per_hour", label: "Change beyond temperature, per hour", expression: `${r(differenceGauge, 2)} ÷ ${r(durationSeconds / 3600, 3)} h`, value: ratePerHourGauge, unit: `${pl.difference}/h`, displayDigits: 2 });

  const highest = highestReading(input);
  const rated = input.ratedTestPressureGauge;
  const overPressure: NitrogenOverPressure | null =
    rated !== undefined && rated !== null && highest.pressureGauge > rated
      ? { highest, ratedGauge: rated, excessGauge: highest.pressureGauge - rated, readingsAbove: readingsOf(input).filter((x) => x.pressureGauge > rated).length }
      : null;
  const verdict: NitrogenVerdict = overPressure ? "stopped" : temperatureVerdict;

  const warnings: NitrogenWarning[] = [];
  if (overPressure) {
    warnings.push({ code: "above_rated_pressure", message: `${highestWords(highest, pl.gauge)} is above the system's rated test pressure of ${r(overPressure.ratedGauge, 1)} ${pl.gauge}. Release the pressure through the regulator now. Follow the equipment maker's instructions and local codes before testing again, at or below the rating.` });
  } else if (rated === undefined || rated === null) {
    warnings.push({ code: "rated_pressure_missing", message: "Enter the system's rated test pressure from the nameplate so Riseline can check every reading stayed below it." });
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
  const perHour = ratePerHourGauge !== null ? ` (${r(ratePerHourGauge, 2)} ${pl.difference}/h)` : "";
  const summary = overPressure
    ? `Stopped: above the rated test pressure. ${highestWords(highest, pl.gauge)} went above the ${r(overPressure.ratedGauge, 1)} ${pl.gauge} rating; this test cannot pass.`
    : temperatureVerdict === "holds"
      ? `Holds: the end reading is within ${r(tolerance, 2)} ${pl.difference} of the ${r(expectedEndGauge, 2)} ${pl.gauge} the temperature change explains${perHour}.`
      : temperatureVerdict === "drops"
        ? `Drops: ${r(-differenceGauge, 2)} ${pl.difference} lower than the temperature change explains${perHour}. Look for a leak.`
        : `Rises: ${r(differenceGauge, 2)} ${pl.difference} higher than the temperature change explains${perHour}. Check the thermometer and its placement, and that the regulator is closed off from the system.`;

  return {
    verdict,
    temperatureVerdict,
    highest,
    overPressure,
    durationSeconds,
    ratePerHourGauge,
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

/** Every reading of the test: the start, the readings in between (log rows, typed) and the end. */
function readingsOf(input: NitrogenTestInput): { pressureGauge: number; tSeconds: number | null; line: number | null; which: NitrogenHighest["which"] }[] {
  return [
    { pressureGauge: input.start.pressureGauge, tSeconds: 0, line: null, which: "start" as const },
    ...(input.readings ?? []).map((x) => ({ pressureGauge: x.pressureGauge, tSeconds: x.tSeconds, line: x.line ?? null, which: "reading" as const })),
    { pressureGauge: input.end.pressureGauge, tSeconds: input.durationSeconds ?? null, line: null, which: "end" as const },
  ];
}

/** The highest of every reading (the first of equal ones), with its time and file line. */
export function highestReading(input: NitrogenTestInput): NitrogenHighest {
  let best = readingsOf(input)[0];
  for (const x of readingsOf(input)) if (x.pressureGauge > best.pressureGauge) best = x;
  return { pressureGauge: best.pressureGauge, atSeconds: best.tSeconds, line: best.line, which: best.which };
}

/** "The highest reading, 480 psig at 1 h 10 min (line 9)," in words. */
function highestWords(h: NitrogenHighest, gaugeUnit: string): string {
  const when = h.which === "start" ? " at the start" : h.atSeconds !== null ? ` at ${durationWords(h.atSeconds)}` : h.which === "end" ? " at the end" : "";
  const line = h.line !== null ? ` (line ${h.line} of the file)` : "";
  return `The highest reading, ${r(h.pressureGauge, 1)} ${gaugeUnit}${when}${line},`;
}
