/**
 * A create request → the nitrogen test's readings, times and verdict. Pure (no database), so the
 * form runs the same code for its preview as the route does before saving.
 *
 * Typed readings go straight to the evaluation with the readings in between; a logger CSV is read
 * first (gauge or absolute from its header, or from the technician's answer — never guessed) and
 * every row goes into the over-pressure check. The atmosphere is the one entered, or the standard
 * atmosphere at the site's elevation (ISO 2533), or the standard sea-level one.
 */
import { atmosphereAtElevation, ATMOSPHERE_UNIT_LABEL, METRES_PER_FOOT } from "@/analysis/calculators/atmosphere";
import {
  ABSOLUTE_UNIT_OF,
  evaluateNitrogenTest,
  type NitrogenPressureUnit,
  type NitrogenReading,
  type NitrogenResult,
  type TemperatureUnit,
} from "@/analysis/calculators/nitrogen";
import { endReadingsOfNitrogenLog, inspectNitrogenLogHeader, readNitrogenLog } from "@/analysis/calculators/nitrogen-log";
import type { PressureTestCreate } from "./schemas";

export interface EvaluatedPressureTest {
  unit: NitrogenPressureUnit;
  temperatureUnit: TemperatureUnit;
  start: NitrogenReading;
  end: NitrogenReading;
  durationSeconds: number | null;
  startedAt: Date | null;
  endedAt: Date | null;
  series: { tSeconds: number[]; pressureGauge: number[]; temperature: number[] | null } | null;
  atmosphereSource: "standard" | "entered" | "elevation";
  elevationM: number | null;
  result: NitrogenResult;
  assumptions: string[];
}

/** The atmosphere for a test in `unit`: entered, from the elevation, or standard (undefined → the engine's default). */
function atmosphereFor(body: PressureTestCreate, unit: NitrogenPressureUnit) {
  if (body.atmosphereAbs !== undefined) return { atmosphereAbs: body.atmosphereAbs, source: "entered" as const, elevationM: null, words: "entered" };
  if (body.siteElevation) {
    const { value, unit: eu } = body.siteElevation;
    const abs = ABSOLUTE_UNIT_OF[unit];
    const atmosphereAbs = atmosphereAtElevation(value, eu, abs);
    const words = `${Number(atmosphereAbs.toFixed(3))} ${ATMOSPHERE_UNIT_LABEL[abs]} at ${value.toLocaleString("en-US")} ${eu} elevation, ISO 2533 standard atmosphere`;
    return { atmosphereAbs, source: "elevation" as const, elevationM: eu === "ft" ? value * METRES_PER_FOOT : value, words };
  }
  return { atmosphereAbs: undefined, source: "standard" as const, elevationM: null, words: undefined };
}

function typed(body: Extract<PressureTestCreate, { source: "typed" }>): EvaluatedPressureTest {
  const atm = atmosphereFor(body, body.unit);
  const startedAt = body.startedAt ? new Date(body.startedAt) : null;
  // The schema requires one of them before saving; the form's preview may not have it yet.
  const durationSeconds = body.endedAt && startedAt ? (Date.parse(body.endedAt) - startedAt.getTime()) / 1000 : body.durationMinutes !== undefined ? body.durationMinutes * 60 : null;
  const readings = (body.readings ?? []).map((x, i) => {
    if (durationSeconds !== null && x.minutes * 60 > durationSeconds) throw new RangeError(`reading ${i + 1}: ${x.minutes} min is after the end of the test`);
    return { pressureGauge: x.pressureGauge, tSeconds: x.minutes * 60 };
  });
  const result = evaluateNitrogenTest({
    unit: body.unit,
    temperatureUnit: body.temperatureUnit,
    start: body.start,
    end: body.end,
    readings,
    durationSeconds,
    atmosphereAbs: atm.atmosphereAbs,
    atmosphereSource: atm.words,
    ratedTestPressureGauge: body.ratedTestPressureGauge ?? null,
    gaugeResolution: body.gaugeResolution,
  });
  const series = readings.length
    ? {
        tSeconds: [0, ...readings.map((x) => x.tSeconds), durationSeconds ?? Math.max(...readings.map((x) => x.tSeconds))],
        pressureGauge: [body.start.pressureGauge, ...readings.map((x) => x.pressureGauge), body.end.pressureGauge],
        temperature: null,
      }
    : null;
  return {
    unit: body.unit,
    temperatureUnit: body.temperatureUnit,
    start: body.start,
    end: body.end,
    durationSeconds,
    startedAt,
    endedAt: startedAt && durationSeconds !== null ? new Date(startedAt.getTime() + durationSeconds * 1000) : null,
    series,
    atmosphereSource: atm.source,
    elevationM: atm.elevationM,
    result,
    assumptions: [],
  };
}

function fromFile(body: Extract<PressureTestCreate, { source: "file" }>): EvaluatedPressureTest {
  const family = inspectNitrogenLogHeader(body.csvText).unit.family;
  const atm = atmosphereFor(body, family);
  const log = readNitrogenLog(body.csvText, { atmosphereAbs: atm.atmosphereAbs, ambiguousAs: body.ambiguousAs, temperatureUnit: body.temperatureUnit });
  const fallback = body.startTemperature !== undefined && body.endTemperature !== undefined ? { startTemperature: body.startTemperature, endTemperature: body.endTemperature } : undefined;
  const ends = endReadingsOfNitrogenLog(log, fallback);
  const temperatureUnit = log.temperatureUnit ?? body.temperatureUnit;
  const last = log.pressureGauge.length - 1;
  const result = evaluateNitrogenTest({
    unit: log.unit,
    temperatureUnit,
    start: ends.start,
    end: ends.end,
    readings: log.pressureGauge.slice(1, last).map((p, i) => ({ pressureGauge: p, tSeconds: log.tSeconds[i + 1], line: log.lines[i + 1] })),
    durationSeconds: ends.durationSeconds > 0 ? ends.durationSeconds : null,
    atmosphereAbs: log.atmosphereAbs,
    atmosphereSource: atm.words,
    ratedTestPressureGauge: body.ratedTestPressureGauge ?? null,
    gaugeResolution: body.gaugeResolution,
  });
  const assumptions = [...log.assumptions];
  if (log.startedAtMs !== null && body.startedAt) assumptions.push("Start time taken from the log's clock, not the one entered.");
  const startedAt = log.startedAtMs !== null ? new Date(log.startedAtMs) : body.startedAt ? new Date(body.startedAt) : null;
  return {
    unit: log.unit,
    temperatureUnit,
    start: ends.start,
    end: ends.end,
    durationSeconds: ends.durationSeconds,
    startedAt,
    endedAt: startedAt ? new Date(startedAt.getTime() + ends.durationSeconds * 1000) : null,
    series: { tSeconds: log.tSeconds, pressureGauge: log.pressureGauge, temperature: log.temperature },
    atmosphereSource: atm.source,
    elevationM: atm.elevationM,
    result,
    assumptions,
  };
}

/** Evaluate a create request. Throws RangeError (bad number, implausible atmosphere) or LogError (unreadable log). */
export function evaluatePressureTestRequest(body: PressureTestCreate): EvaluatedPressureTest {
  return body.source === "typed" ? typed(body) : fromFile(body);
}
