/**
 * Deciding how a time column is written, from its header and its first cells, and turning
 * that into one parser used for every row.
 */
import type { TimeFormat } from "../types";
import { unitTokens } from "../../shared/units";
import { parseReading } from "./numbers";
import {
  type DateOrder,
  hasZone,
  parseClock,
  parseColonDuration,
  parseDateOnly,
  parseDateTime,
} from "./time";
import { median } from "simple-statistics";

export type ElapsedUnit = "ms" | "s" | "min" | "h";

const SECONDS_PER: Record<ElapsedUnit, number> = { ms: 0.001, s: 1, min: 60, h: 3600 };

export interface TimeSpec {
  format: TimeFormat;
  /** Seconds for one row: absolute (seconds since 1970, wall time) for dated forms, of the day for clocks, elapsed otherwise. NaN = not a time. */
  parse: (timeCell: string, dateCell: string) => number;
  /** Clock times: add a day when a stamp falls more than 12 h behind the one before. */
  rollover: boolean;
  /** Dated forms: the parse result is a calendar time (for startedAt). */
  dated: boolean;
  zoned: boolean;
  /** The other day/month order, to retry with when the chosen one fails on a later row. */
  alternate: TimeSpec | null;
  assumptions: string[];
  unsure: boolean;
  /** Plain words for the summary: "ISO 8601 with zone", "elapsed minutes", … */
  description: string;
}

/** Time unit named in a header: "elapsed_s", "time (min)", "t [ms]", "Runtime hours". */
export function timeUnitFromHeader(header: string): ElapsedUnit | null {
  for (const t of unitTokens(header)) {
    if (t === "s" || t === "sec" || t === "secs" || t === "second" || t === "seconds") return "s";
    if (t === "min" || t === "mins" || t === "minute" || t === "minutes") return "min";
    if (t === "ms" || t === "msec" || t === "millis" || t === "milliseconds") return "ms";
    if (t === "h" || t === "hr" || t === "hrs" || t === "hour" || t === "hours") return "h";
  }
  return null;
}

/** A stamp with a month name, through Date.parse with " UTC" appended (so the machine's zone plays no part). */
function parseNamedMonth(cell: string): number {
  if (!/[A-Za-z]{3}/.test(cell)) return NaN;
  const ms = Date.parse(cell.trim() + " UTC");
  return ms === ms ? ms / 1000 : NaN;
}

/** Share of sample cells that may be strays (a garbled row): 10 %, or half while looking for the cell to blame in an error. */
let strayShare = 0.1;

function fits(samples: string[], test: (s: string) => boolean): boolean {
  if (samples.length === 0) return false;
  let ok = 0;
  for (const s of samples) if (test(s)) ok++;
  // Allow a few stray cells in a sample (garbled rows are skipped later, and said, with their line).
  return ok >= Math.max(1, samples.length - Math.max(1, Math.floor(samples.length * strayShare)));
}

/**
 * The form most of the cells are written in, for an error that names the first cell that is not in it:
 * detectTimeSpec allowing half the cells to be strays. Null when not even half are times.
 */
export function detectTimeSpecLoosely(header: string, samples: string[], decimalComma: boolean): TimeSpec | null {
  strayShare = 0.5;
  try {
    return detectTimeSpec(header, samples, decimalComma, undefined);
  } finally {
    strayShare = 0.1;
  }
}

/** Day/month order of slash- or dot-dates, or null when the cells are not such dates. */
function dateOrderOf(samples: string[], parseAs: (s: string, o: DateOrder) => number): { order: DateOrder; unsure: boolean } | null {
  if (fits(samples, (s) => parseAs(s, "ymd") === parseAs(s, "ymd"))) return { order: "ymd", unsure: false };
  const dmy = fits(samples, (s) => parseAs(s, "dmy") === parseAs(s, "dmy"));
  const mdy = fits(samples, (s) => parseAs(s, "mdy") === parseAs(s, "mdy"));
  if (dmy && !mdy) return { order: "dmy", unsure: false };
  if (mdy && !dmy) return { order: "mdy", unsure: false };
  if (!dmy) return null;
  // Ambiguous (every day ≤ 12): dots and dashes are day-first by custom, slashes month-first.
  const slash = samples.some((s) => s.includes("/"));
  return { order: slash ? "mdy" : "dmy", unsure: true };
}

function orderWords(order: DateOrder): string {
  return order === "ymd" ? "year-month-day" : order === "dmy" ? "day/month/year" : "month/day/year";
}

/** The same spec read the other day/month way, for a guessed order (the retry when a later row disproves it). */
function withOtherOrder(spec: TimeSpec, order: DateOrder, other: TimeSpec): TimeSpec {
  other.assumptions.push(`dates read as ${orderWords(order === "dmy" ? "mdy" : "dmy")}: a later row did not fit ${orderWords(order)}`);
  spec.alternate = other;
  return spec;
}

function dateTimeSpec(samples: string[], order: DateOrder, unsure: boolean): TimeSpec {
  const spec = dateTimeSpecOnce(samples, order, unsure);
  return unsure && order !== "ymd" ? withOtherOrder(spec, order, dateTimeSpecOnce(samples, order === "dmy" ? "mdy" : "dmy", false)) : spec;
}

function dateTimeSpecOnce(samples: string[], order: DateOrder, unsure: boolean): TimeSpec {
  const isIso = order === "ymd" && samples.some((s) => /\d[Tt]\d/.test(s));
  const zoned = samples.length > 0 && samples.every((s) => hasZone(s));
  const assumptions: string[] = [];
  if (!zoned) assumptions.push("times carry no zone: read as local wall time (only differences are used)");
  if (unsure) assumptions.push(`dates read as ${orderWords(order)}: every day in the first rows is 12 or less, so the order is a guess`);
  const spec: TimeSpec = {
    format: isIso ? "iso" : "datetime",
    parse: (cell) => parseDateTime(cell, order),
    rollover: false,
    dated: true,
    zoned,
    alternate: null,
    assumptions,
    unsure,
    description: isIso ? `ISO 8601${zoned ? " with zone" : ""}` : `date and time (${orderWords(order)})`,
  };
  return spec;
}

/**
 * Work out how the time column is written from its header and sample cells (non-blank, trimmed).
 * `dateSamples` are the cells of a separate date column, when there is one. Returns null when the
 * cells are not times in any form known here.
 */
export function detectTimeSpec(
  header: string,
  samples: string[],
  decimalComma: boolean,
  timeUnitOption: "s" | "min" | undefined,
  dateHeader: string | null = null,
  dateSamples: string[] | null = null,
): TimeSpec | null {
  if (samples.length === 0) return null;

  if (dateHeader !== null && dateSamples !== null) {
    const found = dateOrderOf(dateSamples, parseDateOnly);
    if (!found || !fits(samples, (s) => parseClock(s) === parseClock(s))) return null;
    const { order, unsure } = found;
    const spec = dateAndTimeSpec(order, unsure);
    return unsure && order !== "ymd" ? withOtherOrder(spec, order, dateAndTimeSpec(order === "dmy" ? "mdy" : "dmy", false)) : spec;
  }

  const headerUnit = timeUnitFromHeader(header);
  if (fits(samples, (s) => parseReading(s, decimalComma) === parseReading(s, decimalComma))) {
    const first = firstNumber(samples, decimalComma);
    // Spreadsheet serial dates (days since 1899-12-30; 36526 = 2000-01-01, 73051 = 2100-01-01) in a
    // date-named column, or in any column whose values step by under a hundredth (as seconds, far
    // faster than any gauge logs).
    if (!timeUnitOption && !headerUnit && first >= 36526 && first < 73051 && (/date|stamp/i.test(header) || medianStep(samples, decimalComma) < 0.01)) {
      return {
        format: "datetime",
        // Rounded to the millisecond: the stored fraction of a day carries binary noise.
        parse: (cell) => Math.round((parseReading(cell, decimalComma) - 25569) * 86_400_000) / 1000,
        rollover: false,
        dated: true,
        zoned: false,
        alternate: null,
        assumptions: ["time column read as spreadsheet serial dates (days since 1899-12-30), local wall time"],
        unsure: false,
        description: "spreadsheet serial date",
      };
    }
    if (first >= 1e9 && !timeUnitOption) {
      const scale = first >= 1e11 ? 0.001 : 1;
      return {
        format: "elapsed_s",
        parse: (cell) => parseReading(cell, decimalComma) * scale,
        rollover: false,
        dated: true,
        zoned: true,
        alternate: null,
        assumptions: [`time column read as Unix time (${scale === 1 ? "seconds" : "milliseconds"} since 1970 UTC)`],
        unsure: false,
        description: "Unix time",
      };
    }
    const unit: ElapsedUnit = timeUnitOption ?? headerUnit ?? "s";
    const factor = SECONDS_PER[unit];
    const assumptions: string[] = [];
    let unsure = false;
    if (timeUnitOption) assumptions.push(`elapsed time in ${unit === "s" ? "seconds" : "minutes"}, as asked`);
    else if (!headerUnit) {
      assumptions.push(`elapsed time taken as seconds: the header '${header}' names no unit`);
      unsure = true;
    } else if (unit === "ms" || unit === "h") assumptions.push(`elapsed time in ${unit === "ms" ? "milliseconds" : "hours"}, converted to seconds`);
    return {
      format: unit === "min" ? "elapsed_min" : "elapsed_s",
      parse: (cell) => parseReading(cell, decimalComma) * factor,
      rollover: false,
      dated: false,
      zoned: false,
      alternate: null,
      assumptions,
      unsure,
      description: unit === "min" ? "elapsed minutes" : unit === "s" ? "elapsed seconds" : `elapsed ${unit}`,
    };
  }

  const found = dateOrderOf(samples, parseDateTime);
  if (found) return dateTimeSpec(samples, found.order, found.unsure);

  // Month names ("Jun 14 2026 13:05:00", "14-Jun-2026 1:05 PM"): the engine's date parser, read as UTC wall time.
  if (fits(samples, (s) => /[A-Za-z]{3}/.test(s) && parseNamedMonth(s) === parseNamedMonth(s))) {
    return {
      format: "datetime",
      parse: parseNamedMonth,
      rollover: false,
      dated: true,
      zoned: false,
      alternate: null,
      assumptions: ["times carry no zone: read as local wall time (only differences are used)"],
      unsure: false,
      description: "date with month name and time",
    };
  }

  // A clock, unless the header says elapsed or the first stamp is zero ("00:00", "0:00:00": a stopwatch
  // from the start of the log, whose minutes may run past 59 and hours past 24).
  const elapsedHeader = headerUnit !== null || /elapsed|duration|runtime|run time|stopwatch/i.test(header);
  const duration = fits(samples, (s) => parseColonDuration(s) === parseColonDuration(s)) ? durationSpec(samples) : null;
  const fromZero = duration !== null && parseColonDuration(samples[0]) === 0 && !/[AaPp][Mm]/.test(samples[0]);
  if (!elapsedHeader && !fromZero && fits(samples, (s) => parseClock(s) === parseClock(s))) {
    return {
      format: "clock",
      parse: (cell) => parseClock(cell),
      rollover: true,
      dated: false,
      zoned: false,
      // a later row past 23:59 ("75:30") proves a stopwatch
      alternate: duration,
      assumptions: [],
      unsure: false,
      description: "clock time (midnight rollover handled)",
    };
  }
  return duration;
}

/** Separate date and time columns, the date read in the given order. */
function dateAndTimeSpec(order: DateOrder, unsure: boolean): TimeSpec {
  let lastDateCell = "";
  let lastDays = NaN;
  const assumptions = ["times carry no zone: read as local wall time (only differences are used)"];
  if (unsure) assumptions.push(`dates read as ${orderWords(order)}: every day in the first rows is 12 or less, so the order is a guess`);
  return {
    format: "date_and_time",
    parse: (timeCell, dateCell) => {
      if (dateCell !== lastDateCell) {
        lastDateCell = dateCell;
        lastDays = parseDateOnly(dateCell, order);
      }
      return lastDays * 86400 + parseClock(timeCell);
    },
    rollover: false,
    dated: true,
    zoned: false,
    alternate: null,
    assumptions,
    unsure,
    description: `separate date (${orderWords(order)}) and time columns`,
  };
}

/** Elapsed time written with colons, h:mm:ss or mm:ss, minutes past 59 allowed ("75:30"). */
function durationSpec(samples: string[]): TimeSpec {
  const form = samples[0].split(":").length === 3 ? "h:mm:ss" : "mm:ss";
  return {
    format: "elapsed_s",
    parse: (cell) => parseColonDuration(cell),
    rollover: false,
    dated: false,
    zoned: false,
    alternate: null,
    assumptions: [`elapsed time read as ${form}`],
    unsure: false,
    description: `elapsed ${form}`,
  };
}

/** The first sample cell that is a number (a garbled first row does not decide the form). */
function firstNumber(samples: string[], decimalComma: boolean): number {
  for (const s of samples) {
    const v = parseReading(s, decimalComma);
    if (v === v) return v;
  }
  return NaN;
}

/** Median positive step between successive numeric sample cells (Infinity when none). */
function medianStep(samples: string[], decimalComma: boolean): number {
  const steps: number[] = [];
  let prev = NaN;
  for (const s of samples) {
    const v = parseReading(s, decimalComma);
    if (v === v && prev === prev && v > prev) steps.push(v - prev);
    if (v === v) prev = v;
  }
  return steps.length ? median(steps) : Infinity;
}
