/**
 * Pressure units: exact conversions to and from microns of mercury, and reading a unit from a
 * column header or a unit cell.
 *
 * Definitions (NIST SP 811, Guide to the SI, appendix B.8):
 *   1 torr = 101325/760 Pa exactly; 1 micron of mercury = 1 mTorr = 101325/760/1000 Pa;
 *   1 mmHg (conventional) = 133.322387415 Pa; 1 inHg (conventional) = 3386.388640 Pa;
 *   1 psi = 6894.757293168 Pa; 1 mbar = 1 hPa = 100 Pa; 1 kPa = 1000 Pa.
 */
import type { PressureUnit } from "../decay/types";

/** Pascals in one micron of mercury (= one millitorr), exact by definition: 101325/760/1000. */
export const PA_PER_MICRON = 101325 / 760 / 1000;

/** Pascals in one unit of each absolute pressure unit (NIST SP 811 B.8). */
export const PA_PER_UNIT: Readonly<Record<PressureUnit, number>> = {
  micron: PA_PER_MICRON,
  mtorr: PA_PER_MICRON,
  torr: 101325 / 760,
  mmhg: 133.322387415,
  pa: 1,
  kpa: 1000,
  mbar: 100,
  hpa: 100,
  psia: 6894.757293168,
  inhg: 3386.38864,
};

/**
 * Microns in one unit. Micron, mTorr and torr are written out so that they convert with no
 * rounding at all (1 torr = 1000 microns exactly); the rest are Pa-per-unit / Pa-per-micron.
 */
const MICRONS_PER_UNIT: Readonly<Record<PressureUnit, number>> = {
  micron: 1,
  mtorr: 1,
  torr: 1000,
  mmhg: PA_PER_UNIT.mmhg / PA_PER_MICRON,
  pa: 1 / PA_PER_MICRON,
  kpa: PA_PER_UNIT.kpa / PA_PER_MICRON,
  mbar: PA_PER_UNIT.mbar / PA_PER_MICRON,
  hpa: PA_PER_UNIT.hpa / PA_PER_MICRON,
  psia: PA_PER_UNIT.psia / PA_PER_MICRON,
  inhg: PA_PER_UNIT.inhg / PA_PER_MICRON,
};

/** Factor that turns a reading in `unit` into microns (multiply). */
export function micronsPerUnit(unit: PressureUnit): number {
  return MICRONS_PER_UNIT[unit];
}

/** Convert an absolute pressure in `unit` to microns of mercury (value × microns per unit). */
export function toMicrons(value: number, unit: PressureUnit): number {
  return value * MICRONS_PER_UNIT[unit];
}

/** Convert microns of mercury to `unit` (value ÷ microns per unit). */
export function micronsTo(value: number, unit: PressureUnit): number {
  return value / MICRONS_PER_UNIT[unit];
}

/** Gauge (relative-to-atmosphere) units: read but never taken as an absolute vacuum reading. */
export type GaugeUnit = "psig" | "kpa_gauge" | "bar_gauge" | "inhg_vacuum";

/** Pascals per unit of each gauge unit (the same size as the absolute unit; only the zero differs). */
export const PA_PER_GAUGE_UNIT: Readonly<Record<GaugeUnit, number>> = {
  psig: PA_PER_UNIT.psia,
  kpa_gauge: 1000,
  bar_gauge: 1e5,
  inhg_vacuum: PA_PER_UNIT.inhg,
};

export type ParsedPressureUnit =
  | { unit: PressureUnit; gauge: false }
  | { gaugeUnit: GaugeUnit; gauge: true };

/** Units the importer reads, in words for error messages. */
export const UNITS_UNDERSTOOD: readonly string[] = [
  "microns (µmHg)",
  "mTorr",
  "Torr",
  "mmHg",
  "Pa",
  "kPa",
  "mbar",
  "hPa",
  "psia",
  "inHg (absolute)",
];

/** Spellings (lower case, separators removed, µ read as u) → unit. */
const SPELLINGS: ReadonlyMap<string, ParsedPressureUnit> = (() => {
  const table: [ParsedPressureUnit, string[]][] = [
    [{ unit: "micron", gauge: false }, ["micron", "microns", "u", "umhg", "uhg", "micronhg", "micronshg", "micronsofmercury", "micronofmercury", "micronsmercury"]],
    [{ unit: "mtorr", gauge: false }, ["mtorr", "millitorr", "mtorrabs"]],
    [{ unit: "torr", gauge: false }, ["torr", "torrabs"]],
    [{ unit: "mmhg", gauge: false }, ["mmhg", "mmhga", "mmhgabs", "mmhgabsolute", "mmofmercury"]],
    [{ unit: "pa", gauge: false }, ["pa", "paa", "paabs", "pascal", "pascals"]],
    [{ unit: "kpa", gauge: false }, ["kpa", "kpaa", "kpaabs", "kpaabsolute", "kilopascal", "kilopascals"]],
    [{ unit: "mbar", gauge: false }, ["mbar", "mbara", "mbarabs", "mbarabsolute", "millibar", "millibars"]],
    [{ unit: "hpa", gauge: false }, ["hpa", "hpaa", "hpaabs", "hectopascal", "hectopascals"]],
    [{ unit: "psia", gauge: false }, ["psia", "psiabs", "psiabsolute"]],
    [{ unit: "inhg", gauge: false }, ["inhg", "inhga", "inhgabs", "inhgabsolute", "inchhg", "incheshg", "inchesofmercury", "inchofmercury", "inofmercury"]],
    [{ gaugeUnit: "psig", gauge: true }, ["psig", "psigauge", "psid"]],
    [{ gaugeUnit: "kpa_gauge", gauge: true }, ["kpag", "kpagauge", "kpagage"]],
    [{ gaugeUnit: "bar_gauge", gauge: true }, ["barg", "bargauge"]],
    [{ gaugeUnit: "inhg_vacuum", gauge: true }, ["inhgvac", "inhgvacuum", "inhgv", "inhggauge", "invac", "invacuum", "inchvac", "inchesvac", "inchesvacuum", "inchvacuum", "inchesofvacuum", "inchesofmercuryvacuum", "hgvac", "inhgvac"]],
  ];
  const map = new Map<string, ParsedPressureUnit>();
  for (const [parsed, spellings] of table) for (const s of spellings) map.set(s, parsed);
  return map;
})();

/** Split a header into lower-case word tokens: camelCase boundaries, µ/μ → u, any non-letter/digit separates. */
export function unitTokens(text: string): string[] {
  return text
    .replace(/([a-z])([A-Z])/g, "$1 $2")
    .toLowerCase()
    .replace(/[µμ]/g, "u")
    .split(/[^a-z0-9]+/)
    .filter((t) => t.length > 0);
}

/**
 * Read a pressure unit from a header ("Vacuum (microns)", "pressure_mTorr") or a unit cell
 * ("µmHg", "in Hg abs", "kPa g"). Tries runs of three, two, then one adjacent word tokens, joined,
 * against the known spellings; the first match from the left wins. Gauge units are told apart
 * (psig, barg, "kPa g", "inHg vac"). Returns null when no unit is named.
 */
export function parsePressureUnit(text: string): ParsedPressureUnit | null {
  const tokens = unitTokens(text);
  for (let i = 0; i < tokens.length; i++) {
    for (let n = Math.min(4, tokens.length - i); n >= 1; n--) {
      const hit = SPELLINGS.get(tokens.slice(i, i + n).join(""));
      if (hit) return hit;
    }
  }
  return null;
}

/** Whether a header or cell names a unit that is ambiguous between absolute and gauge ("psi", "bar"). */
export function namesAmbiguousUnit(text: string): string | null {
  const tokens = unitTokens(text);
  if (tokens.includes("psi")) return "psi";
  if (tokens.includes("bar")) return "bar";
  return null;
}
