/**
 * Which pressure unit a nitrogen logger's column header names, and whether it says gauge or
 * absolute. Never guessed: a header that names only the unit ("Pressure (kPa)", "mbar", "psi",
 * "bar", "Pa") is reported as silent, and the technician is asked.
 *
 * Read as gauge: a unit with a g suffix (psig, kPag, barg, mbarg, MPag) or followed by g, gauge,
 * gage, rel or relative ("kPa g", "bar (g)", "kPa gauge"), and the phrases "gauge pressure" and
 * "relative pressure". Read as absolute: an a suffix (psia, kPaa, bara, mbara, MPaa), a unit
 * followed by a, abs or absolute, and the words abs or absolute anywhere in the header. Both at
 * once is refused. Vacuum units (microns, Torr, inHg) are refused for a nitrogen test.
 * Our reading rules, common practice, no published source; unit sizes from NIST SP 811.
 */
import type { NitrogenPressureUnit } from "./nitrogen";

export type PressureReference = "gauge" | "absolute";

export interface NitrogenHeaderUnit {
  /** The unit as the header writes it, without the reference ("kPa", "mbar", "psi"). */
  unitWord: string;
  /** The gauge unit the test is kept in, and the factor from the header's unit to it. */
  family: NitrogenPressureUnit;
  toFamily: number;
  /** What the header says; null when it names the unit only (ask). */
  reference: PressureReference | null;
}

/** Unit word (lower case) → the family it is kept in and its size in that family's unit. */
const UNIT_WORDS: Readonly<Record<string, { word: string; family: NitrogenPressureUnit; toFamily: number }>> = {
  psi: { word: "psi", family: "psig", toFamily: 1 },
  bar: { word: "bar", family: "bar_gauge", toFamily: 1 },
  mbar: { word: "mbar", family: "kpa_gauge", toFamily: 0.1 },
  millibar: { word: "mbar", family: "kpa_gauge", toFamily: 0.1 },
  hpa: { word: "hPa", family: "kpa_gauge", toFamily: 0.1 },
  kpa: { word: "kPa", family: "kpa_gauge", toFamily: 1 },
  kilopascal: { word: "kPa", family: "kpa_gauge", toFamily: 1 },
  kilopascals: { word: "kPa", family: "kpa_gauge", toFamily: 1 },
  mpa: { word: "MPa", family: "kpa_gauge", toFamily: 1000 },
  pa: { word: "Pa", family: "kpa_gauge", toFamily: 0.001 },
  pascal: { word: "Pa", family: "kpa_gauge", toFamily: 0.001 },
  pascals: { word: "Pa", family: "kpa_gauge", toFamily: 0.001 },
};

const GAUGE_AFTER = new Set(["g", "gauge", "gage", "rel", "relative"]);
const ABSOLUTE_AFTER = new Set(["a", "abs", "absolute"]);
const VACUUM_WORDS = new Set(["micron", "microns", "um", "umhg", "mtorr", "torr", "inhg", "mmhg", "vac", "vacuum"]);

/** Lower-case word tokens of a header ("Pressure (kPa g)" → pressure, kpa, g); no camelCase split, so kPa stays one word. */
function tokensOf(header: string): string[] {
  return header.toLowerCase().replace(/[µμ]/g, "u").split(/[^a-z0-9]+/).filter((t) => t.length > 0);
}

/** A header token → unit word with an attached reference suffix ("psig" → psi + gauge), or null. */
function unitOfToken(token: string): { unit: (typeof UNIT_WORDS)[string]; reference: PressureReference | null } | null {
  if (UNIT_WORDS[token]) return { unit: UNIT_WORDS[token], reference: null };
  const base = token.slice(0, -1);
  const last = token.slice(-1);
  if ((last === "g" || last === "a") && UNIT_WORDS[base] && base !== "pa")
    return { unit: UNIT_WORDS[base], reference: last === "g" ? "gauge" : "absolute" };
  return null;
}

/** Whether a header names a vacuum unit (microns, Torr, inHg…), which a nitrogen test cannot be in. */
export function namesVacuumUnit(header: string): boolean {
  return tokensOf(header).some((t) => VACUUM_WORDS.has(t));
}

/**
 * The pressure unit a header names and what it says about gauge or absolute (see the file
 * comment); null when it names no pressure unit. Throws RangeError when it says both.
 */
export function readNitrogenHeaderUnit(header: string): NitrogenHeaderUnit | null {
  const tokens = tokensOf(header);
  for (let i = 0; i < tokens.length; i++) {
    const hit = unitOfToken(tokens[i]);
    if (!hit) continue;
    const says = new Set<PressureReference>();
    if (hit.reference) says.add(hit.reference);
    const next = tokens[i + 1];
    if (next && GAUGE_AFTER.has(next)) says.add("gauge");
    if (next && ABSOLUTE_AFTER.has(next)) says.add("absolute");
    if (tokens.includes("abs") || tokens.includes("absolute")) says.add("absolute");
    tokens.forEach((t, k) => {
      if ((t === "gauge" || t === "gage" || t === "relative") && tokens[k + 1] === "pressure") says.add("gauge");
    });
    if (says.size > 1) throw new RangeError(`column '${header}' says both gauge and absolute`);
    return { unitWord: hit.unit.word, family: hit.unit.family, toFamily: hit.unit.toFamily, reference: [...says][0] ?? null };
  }
  return null;
}
