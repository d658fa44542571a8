/**
 * A pressure logger's CSV from a nitrogen standing-pressure test → gauge readings over time.
 *
 * Units are read with the importer's `parsePressureUnit`, which tells gauge units (psig, kPa g,
 * barg) from absolute ones (psia, kPa, mbar…). Absolute readings become gauge readings by
 * subtracting the atmosphere (entered, or the standard 101325 Pa). "psi" or "bar" alone does not
 * say which: the caller must tell (`ambiguousAs`), or the log is refused.
 */
import Papa from "papaparse";
import { LogError } from "./errors";
import { namesAmbiguousUnit, PA_PER_UNIT, parsePressureUnit, unitTokens } from "./units";
import { STANDARD_ATMOSPHERE, type NitrogenPressureUnit, type NitrogenReading, type TemperatureUnit } from "./nitrogen";

export interface NitrogenLogOptions {
  /** Local atmosphere in the absolute unit that goes with the log's gauge unit (psia, kPa or bar). */
  atmosphereAbs?: number;
  /** How to read a bare "psi" or "bar" header. */
  ambiguousAs?: "gauge" | "absolute";
  /** Temperature unit when the header does not say. */
  temperatureUnit?: TemperatureUnit;
}

export interface NitrogenLog {
  unit: NitrogenPressureUnit;
  /** The unit as the file named it ("psia", "kPa g"…). */
  sourceUnitText: string;
  /** True when the file was in absolute units and the atmosphere was subtracted. */
  convertedFromAbsolute: boolean;
  atmosphereAbs: number;
  tSeconds: number[];
  pressureGauge: number[];
  temperatureUnit: TemperatureUnit | null;
  temperature: number[] | null;
  assumptions: string[];
}

/** Pa in one unit of the absolute scales that map onto each gauge family. */
const ABS_FAMILY: Record<string, { unit: NitrogenPressureUnit; paPerUnit: number }> = {
  psia: { unit: "psig", paPerUnit: PA_PER_UNIT.psia },
  kpa: { unit: "kpa_gauge", paPerUnit: 1000 },
  pa: { unit: "kpa_gauge", paPerUnit: 1 },
  mbar: { unit: "kpa_gauge", paPerUnit: 100 },
  hpa: { unit: "kpa_gauge", paPerUnit: 100 },
};
const FAMILY_PA: Record<NitrogenPressureUnit, number> = { psig: PA_PER_UNIT.psia, kpa_gauge: 1000, bar_gauge: 1e5 };

function num(cell: string | undefined): number {
  if (cell === undefined) return NaN;
  const s = cell.trim().replace(/\s/g, "");
  return s === "" ? NaN : Number(s.replace(/,(?=\d+$)/, "."));
}

function isTimeHeader(h: string): boolean {
  const t = unitTokens(h);
  return t.some((x) => ["time", "date", "timestamp", "elapsed", "t", "seconds", "s", "min", "minutes"].includes(x));
}

function isTemperatureHeader(h: string): boolean {
  return /temp|°|deg/i.test(h) || /(^|[^a-z])(f|c)\)?$/i.test(h.trim());
}

function temperatureUnitOf(h: string): TemperatureUnit | null {
  if (/°\s*f|degf|\(f\)|\bf\b|fahrenheit/i.test(h)) return "F";
  if (/°\s*c|degc|\(c\)|\bc\b|celsius/i.test(h)) return "C";
  return null;
}

/**
 * Read a logger CSV of a nitrogen test: a time column, a pressure column with its unit in the
 * header, and optionally a temperature column. Throws LogError with the line and column.
 */
export function readNitrogenLog(text: string, options: NitrogenLogOptions = {}): NitrogenLog {
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.trim() === "") throw new LogError("empty_file", "the file is empty");
  const rows = Papa.parse<string[]>(text.trim(), { header: false, skipEmptyLines: true }).data;
  const headerIndex = rows.findIndex((r) => r.some((c) => /[a-z]/i.test(c)) && r.length >= 2);
  if (headerIndex < 0) throw new LogError("no_header", "no header row with column names was found");
  const header = rows[headerIndex].map((h) => h.trim());
  const assumptions: string[] = [];

  let pIdx = -1;
  let pUnit: { unit: NitrogenPressureUnit; paPerUnit: number; absolute: boolean; text: string } | null = null;
  for (let i = 0; i < header.length && pIdx < 0; i++) {
    const h = header[i];
    const parsed = parsePressureUnit(h);
    if (parsed?.gauge) {
      if (parsed.gaugeUnit === "inhg_vacuum") throw new LogError("unknown_unit", `column '${h}': inches of mercury vacuum is a vacuum reading, not a nitrogen test pressure`, { column: h });
      pIdx = i;
      pUnit = { unit: parsed.gaugeUnit, paPerUnit: FAMILY_PA[parsed.gaugeUnit], absolute: false, text: h };
    } else if (parsed && ABS_FAMILY[parsed.unit]) {
      pIdx = i;
      pUnit = { ...ABS_FAMILY[parsed.unit], absolute: true, text: h };
    } else {
      const amb = namesAmbiguousUnit(h);
      if (amb) {
        if (!options.ambiguousAs)
          throw new LogError("unknown_unit", `column '${h}': '${amb}' does not say gauge or absolute; choose which the logger records`, { column: h });
        const unit: NitrogenPressureUnit = amb === "psi" ? "psig" : "bar_gauge";
        pIdx = i;
        pUnit = { unit, paPerUnit: FAMILY_PA[unit], absolute: options.ambiguousAs === "absolute", text: h };
        assumptions.push(`'${amb}' read as ${options.ambiguousAs}, as chosen`);
      }
    }
  }
  if (pIdx < 0 || !pUnit) throw new LogError("no_pressure_column", `no column names a pressure unit (psig, psia, kPa g, kPa, bar g…): columns are ${header.join(", ")}`);

  const tIdx = header.findIndex((h, i) => i !== pIdx && isTimeHeader(h));
  if (tIdx < 0) throw new LogError("no_time_column", `no time column: columns are ${header.join(", ")}`);
  const tempIdx = header.findIndex((h, i) => i !== pIdx && i !== tIdx && isTemperatureHeader(h));
  let temperatureUnit: TemperatureUnit | null = null;
  if (tempIdx >= 0) {
    temperatureUnit = temperatureUnitOf(header[tempIdx]) ?? options.temperatureUnit ?? null;
    if (!temperatureUnit) throw new LogError("unknown_unit", `column '${header[tempIdx]}': say whether the temperature is °F or °C`, { column: header[tempIdx] });
  }

  const atmosphereAbs = options.atmosphereAbs ?? STANDARD_ATMOSPHERE[pUnit.unit];
  const toFamily = pUnit.paPerUnit / FAMILY_PA[pUnit.unit];
  const minutes = /min/i.test(header[tIdx]);
  const tSeconds: number[] = [];
  const pressureGauge: number[] = [];
  const temperature: number[] = [];
  let t0: number | null = null;
  for (let r = headerIndex + 1; r < rows.length; r++) {
    const row = rows[r];
    const line = r + 1;
    const rawP = num(row[pIdx]);
    if (!Number.isFinite(rawP)) continue;
    const cell = (row[tIdx] ?? "").trim();
    let t = num(cell);
    if (Number.isFinite(t)) t = minutes ? t * 60 : t;
    else {
      const ms = Date.parse(cell.replace(" ", "T"));
      if (!Number.isFinite(ms)) throw new LogError("bad_time", `line ${line}: time '${cell.slice(0, 40)}' is not a time`, { line, column: header[tIdx] });
      t = ms / 1000;
    }
    t0 ??= t;
    tSeconds.push(t - t0);
    const inFamily = rawP * toFamily;
    pressureGauge.push(pUnit.absolute ? inFamily - atmosphereAbs : inFamily);
    if (tempIdx >= 0) temperature.push(num(row[tempIdx]));
  }
  if (pressureGauge.length < 2) throw new LogError("too_few_readings", `only ${pressureGauge.length} usable reading(s); at least 2 are needed`);
  if (pUnit.absolute) assumptions.push(`absolute readings turned into gauge by subtracting the atmosphere (${atmosphereAbs})`);
  return {
    unit: pUnit.unit,
    sourceUnitText: pUnit.text,
    convertedFromAbsolute: pUnit.absolute,
    atmosphereAbs,
    tSeconds,
    pressureGauge,
    temperatureUnit,
    temperature: tempIdx >= 0 ? temperature : null,
    assumptions,
  };
}

/**
 * Start and end readings of a log: the first and last rows. Temperatures come from the log's
 * column, or from `fallback` when the log has none (typed by the technician).
 */
export function endReadingsOfNitrogenLog(
  log: NitrogenLog,
  fallback?: { startTemperature: number; endTemperature: number },
): { start: NitrogenReading; end: NitrogenReading; durationSeconds: number } {
  const last = log.pressureGauge.length - 1;
  const tStart = log.temperature?.[0];
  const tEnd = log.temperature?.[last];
  const startTemperature = Number.isFinite(tStart) ? tStart! : fallback?.startTemperature;
  const endTemperature = Number.isFinite(tEnd) ? tEnd! : fallback?.endTemperature;
  if (startTemperature === undefined || endTemperature === undefined)
    throw new LogError("invalid_option", "the log has no temperature: enter the start and end temperatures");
  return {
    start: { pressureGauge: log.pressureGauge[0], temperature: startTemperature },
    end: { pressureGauge: log.pressureGauge[last], temperature: endTemperature },
    durationSeconds: log.tSeconds[last] - log.tSeconds[0],
  };
}
