/**
 * A create request → the nitrogen test's readings and verdict. Typed readings go straight to
 * the pure evaluation; a logger CSV is read first (gauge vs absolute units told apart, absolute
 * turned into gauge with the entered atmosphere).
 */
import { evaluateNitrogenTest, type NitrogenPressureUnit, type NitrogenReading, type NitrogenResult, type TemperatureUnit } from "@/analysis/nitrogen";
import { endReadingsOfNitrogenLog, readNitrogenLog } from "@/analysis/nitrogen-log";
import type { PressureTestCreate } from "./schemas";

export interface EvaluatedPressureTest {
  unit: NitrogenPressureUnit;
  temperatureUnit: TemperatureUnit;
  start: NitrogenReading;
  end: NitrogenReading;
  durationSeconds: number | null;
  series: { tSeconds: number[]; pressureGauge: number[]; temperature: number[] | null } | null;
  result: NitrogenResult;
  assumptions: string[];
}

export function evaluatePressureTestRequest(body: PressureTestCreate): EvaluatedPressureTest {
  if (body.source === "typed") {
    const result = evaluateNitrogenTest({
      unit: body.unit,
      temperatureUnit: body.temperatureUnit,
      start: body.start,
      end: body.end,
      atmosphereAbs: body.atmosphereAbs,
      ratedTestPressureGauge: body.ratedTestPressureGauge ?? null,
      gaugeResolution: body.gaugeResolution,
    });
    return { unit: body.unit, temperatureUnit: body.temperatureUnit, start: body.start, end: body.end, durationSeconds: body.durationMinutes ? body.durationMinutes * 60 : null, series: null, result, assumptions: [] };
  }
  const log = readNitrogenLog(body.csvText, { atmosphereAbs: body.atmosphereAbs, ambiguousAs: body.ambiguousAs, temperatureUnit: body.temperatureUnit });
  const fallback = body.startTemperature !== undefined && body.endTemperature !== undefined ? { startTemperature: body.startTemperature, endTemperature: body.endTemperature } : undefined;
  const ends = endReadingsOfNitrogenLog(log, fallback);
  const temperatureUnit = log.temperatureUnit ?? body.temperatureUnit;
  const result = evaluateNitrogenTest({
    unit: log.unit,
    temperatureUnit,
    start: ends.start,
    end: ends.end,
    atmosphereAbs: log.atmosphereAbs,
    ratedTestPressureGauge: body.ratedTestPressureGauge ?? null,
    gaugeResolution: body.gaugeResolution,
  });
  return {
    unit: log.unit,
    temperatureUnit,
    start: ends.start,
    end: ends.end,
    durationSeconds: ends.durationSeconds,
    series: { tSeconds: log.tSeconds, pressureGauge: log.pressureGauge, temperature: log.temperature },
    result,
    assumptions: log.assumptions,
  };
}
