/**
 * Shared shapes of the analysis engine. Pure data: no functions, no classes, so a result
 * can be stored as JSON, sent over the wire and compared in tests.
 *
 * Conventions: time is seconds from the first data row of the file (t = 0 at that row,
 * whether or not its pressure cell is a number); pressure is microns of mercury (= mTorr).
 */

/** Pressure units the importer understands (absolute unless the name says gauge). */
export type PressureUnit =
  | "micron"
  | "mtorr"
  | "torr"
  | "mmhg"
  | "pa"
  | "kpa"
  | "mbar"
  | "hpa"
  | "psia"
  | "inhg";

/** How the time column was written. */
export type TimeFormat =
  | "iso" // 2026-06-14T13:05:00Z, with or without zone
  | "datetime" // 2026-06-14 13:05:00
  | "date_and_time" // separate date and time columns
  | "clock" // 13:05:00, rolling over midnight
  | "elapsed_s"
  | "elapsed_min"
  | "typed"; // readings entered by hand (already in seconds)

export type Verdict = "pass" | "leak" | "moisture" | "leak_and_moisture" | "inconclusive";

export type HoldModelKind = "flat" | "plateau" | "climb" | "plateau_climb";

export type Severity = "info" | "advice" | "warning" | "danger";

/** One finding: a sign in the log, in plain words, with what to check next. */
export interface Finding {
  /** Stable machine code, snake_case, e.g. "target_not_reached". */
  code: string;
  severity: Severity;
  /** Short headline for a phone screen. */
  title: string;
  /** One or two sentences in plain words. */
  message: string;
  /** The numbers behind it (named with units, e.g. { lowestMicrons: 812 }). */
  evidence: Record<string, number | string | boolean | null>;
  /** What the technician should check or do, in order. */
  checks: string[];
  /** Safety cautions that apply (never energise the compressor under vacuum, …). */
  cautions: string[];
  /** Seconds from the first data row where the sign is seen, when it has a place. */
  atSeconds?: number | null;
}

/** Options a caller may pass to the importer; explicit values always win over detection. */
export interface ImportOptions {
  /** Header name (case-insensitive) or 0-based column index. */
  timeColumn?: string | number;
  pressureColumn?: string | number;
  unit?: PressureUnit;
  timeUnit?: "s" | "min";
  /**
   * How the pressure readings write their numbers, when the importer could not tell: "point" = a
   * comma groups thousands ("4,150" is 4150), "comma" = a comma is the decimal mark ("4,150" is 4.15).
   */
  decimalMark?: "point" | "comma";
  /** Defaults: 64 MiB (maxBytes, counted in characters) and 1,000,000 data rows (see DEFAULT_MAX_BYTES and DEFAULT_MAX_ROWS in import/index.ts). */
  maxBytes?: number;
  maxRows?: number;
}

/** Why the importer is not sure, by topic, so a screen can ask the right question. */
export interface UnsureReason {
  /** decimal_mark: thousands separator or decimal comma; unit: no unit named; time: time unit or format guessed; columns: a column guessed; date_order: day/month order guessed. */
  code: "decimal_mark" | "unit" | "time" | "columns" | "date_order";
  message: string;
  /** For decimal_mark: the two readings of the example cell, each with the importer option that gives it. */
  choices?: { decimalMark: "point" | "comma"; cell: string; reads: string }[];
}

/** What the importer read and what it had to assume. */
export interface ImportSummary {
  /** Data rows after the header (including those skipped). */
  rows: number;
  /** Data rows whose pressure was not a number (blank, over-range marker, dash, …). */
  skipped: number;
  /** Of the skipped, those that were over-range markers such as ">25000" or "OR". */
  overRange: number;
  unit: PressureUnit;
  timeFormat: TimeFormat;
  delimiter: string;
  decimalComma: boolean;
  /** 0-based line index of the header row in the file (after preamble lines). */
  headerLine: number;
  columns: string[];
  timeColumn: string;
  pressureColumn: string;
  temperatureColumn: string | null;
  /** True when a choice was a guess the user should confirm. */
  unsure: boolean;
  /** Each guess behind `unsure`, with its topic (empty when sure). */
  unsureReasons?: UnsureReason[];
  /** The thousands separator of the pressure readings ("," or "."), or null when none was seen. */
  thousandsSeparator?: string | null;
  /** Rows whose time cell was not a time, skipped (a few garbled rows do not refuse a log). */
  badTimeRows?: number;
  /** What was assumed, in words ("unit taken as microns: the header names none"). */
  assumptions: string[];
}

/** A log ready for analysis: sorted by time, numeric readings only. */
export interface ImportedLog {
  /** Seconds from the first data row, ascending, one per usable reading. */
  tSeconds: number[];
  /** Microns, same length as tSeconds. */
  microns: number[];
  /** Seconds of rows whose cell was an over-range marker (gauge out of range, high). */
  overRangeSeconds: number[];
  /** Temperature in °C aligned with tSeconds (NaN where blank), or null when the file has none. */
  temperatureC: number[] | null;
  /** ISO 8601 time of the first data row when the file carries absolute times, else null. */
  startedAt: string | null;
  summary: ImportSummary;
  /** Findings raised while importing (duplicates or out-of-order stamps sorted, …). */
  findings: Finding[];
}

/** The organisation's acceptance rules. Default: common practice, no published source. */
export interface AcceptanceProfile {
  name: string;
  /** Isolate at or below this (microns). Default 500. */
  targetMicrons: number;
  /** Hold at least this long (minutes). Default 10. */
  holdMinutes: number;
  /** Stay at or below this during the hold (microns). Default 1000. */
  limitMicrons: number;
  /** A fitted steady climb at or above this is a leak (microns per minute). Default see profile.ts. */
  leakRateMicronsPerMinute: number;
}

/** A least-squares fit of one hold model, t in seconds from isolation, p in microns. */
export interface ModelFit {
  kind: HoldModelKind;
  /** p0 microns, a microns (plateau height), tauSeconds, l microns per second (climb). Absent = not in the model. */
  params: { p0: number; a?: number; tauSeconds?: number; l?: number };
  /** Standard errors of the same parameters (same units). */
  stdErrors: { p0: number; a?: number; tauSeconds?: number; l?: number };
  /** Parameter covariance matrix in the order p0, a, tauSeconds, l (present ones only). */
  covariance: number[][];
  n: number;
  dof: number;
  rss: number;
  residualSd: number;
  rSquared: number;
  /** Small-sample corrected Akaike information criterion. */
  aicc: number;
  iterations: number;
  stopReason: "converged" | "iteration_limit" | "non_finite" | "closed_form";
  /** Indices (into the hold samples) treated as spikes and left out of the fit. */
  excluded: number[];
}

export interface HoldFitResult {
  chosen: HoldModelKind;
  /** The rule that chose, in words (e.g. "lowest AICc; plateau_climb beat plateau by 14.2"). */
  rule: string;
  fits: Partial<Record<HoldModelKind, ModelFit>>;
}

export interface Forecast {
  /** Seconds after isolation the forecast is for (the profile's hold time). */
  atHoldSeconds: number;
  predictedMicrons: number;
  /** Approximate 95 % prediction interval. */
  lowMicrons: number;
  highMicrons: number;
  /** "pass" / "fail" when the interval lies wholly below / above the limit, else null. */
  earlyCall: "pass" | "fail" | null;
  /** Seconds of hold data the forecast was made from. */
  basedOnSeconds: number;
  /** Points for a chart band: seconds after isolation with predicted/low/high microns. */
  band: { tSeconds: number; microns: number; low: number; high: number }[];
  /**
   * The rule that decides the early call ("limit": the reading at the hold time; "leak_rate": the
   * steady climb; "plateau": the level-off above the limit), null without a call. Absent in older results.
   */
  decidingRule?: "limit" | "leak_rate" | "plateau" | null;
  /** Share (0–1) of the plausible continuations of the curve that give the call's verdict. */
  agreement?: number;
  /** How the call was made, in words (shown on the page under the call). */
  basis?: string;
}

export interface Hold {
  /** Seconds from the first data row: the pump valved off (lowest point before the rise). */
  isolatedAtSeconds: number;
  /** End of the hold (last reading before a break, a new pull-down or the end of the log). */
  endSeconds: number;
  startMicrons: number;
  endMicrons: number;
  /** Whether the hold ran to its end (not cut by the end of the log mid-rise …). */
  complete: boolean;
  endedBy: "end_of_log" | "break" | "pulldown";
  /** Seconds of the first over-range row when the hold climbed out of the gauge's range (a gross leak), else null. */
  leftRangeAtSeconds?: number | null;
  /** Seconds of the readings left out of the fit as spikes (one or two wild readings: a bumped hose). */
  spikeSeconds?: number[];
  fit: HoldFitResult | null;
}

export interface Phases {
  pulldown: { startSeconds: number; endSeconds: number; startMicrons: number; lowestMicrons: number } | null;
  holds: Hold[];
  /** Index into holds of the primary (last complete) hold, or null. */
  primary: number | null;
  /** Vacuum broken: the reading leaves toward atmosphere. */
  breakAtSeconds: number | null;
}

/** Internal volume of the system, when known, for a leak rate in physical units. */
export interface SystemVolume {
  litres?: number;
  lineSet?: { lengthFeet: number; liquidOd: string; suctionOd: string; temper?: "annealed" | "drawn" }[];
  coilLitres?: number;
}

export interface AnalyzeOptions {
  import?: ImportOptions;
  profile?: Partial<AcceptanceProfile>;
  volume?: SystemVolume;
  /** Force the isolation point (seconds from the first data row). */
  isolationAtSeconds?: number;
  /** Limit the hold to a window (seconds from the first data row). */
  holdWindow?: { startSeconds: number; endSeconds: number };
  /** Ambient temperature in °C when the file has none (for the freeze-risk finding). */
  ambientC?: number;
}

export interface Decay {
  startMicrons: number;
  endMicrons: number;
  riseMicrons: number;
  holdSeconds: number;
  /** 0 when the chosen model has no climb. */
  leakRateMicronsPerMinute: number;
  /** True when the climb is a lower bound: the hold left the gauge's range, so the rise beyond it is unseen. */
  leakRateAtLeast?: boolean;
  plateauMicrons: number | null;
  timeConstantSeconds: number | null;
}

export interface LeakRate {
  volumeLitres: number;
  paM3PerSecond: number;
  mbarLitresPerSecond: number;
  micronLitresPerMinute: number;
}

/** One number of the hold, with what it is. */
export interface Figure {
  value: number;
  /** What the number is, in plain words ("the last reading of the hold, as the gauge showed it"). */
  definition: string;
  /** Seconds from the first data row where it was read; null when it is not one reading (a fit, a difference). */
  atSeconds: number | null;
  /** For a smoothed value: the raw reading beside it. */
  raw?: { value: number; atSeconds: number | null; definition: string };
}

/** Every number of the primary hold, each given once; every screen, the report and the e-mail quote these. */
export interface HoldFigures {
  /** The reading at isolation (or the first reading when the log starts in the hold), microns. */
  startMicrons: Figure;
  /** The last reading of the hold, microns. */
  lastMicrons: Figure;
  /** The highest reading the limit rule judges (smoothed, the raw highest beside it), microns. */
  highestMicrons: Figure;
  /** Last reading minus start, microns. */
  riseMicrons: Figure;
  /** The steady climb the leak rule judges, microns per minute. */
  rateMicronsPerMinute: Figure;
  /** Where the curve levels off (p0 + a of the fit), microns, or null without a level-off part. */
  plateauMicrons: Figure | null;
  /** Seconds from isolation to the last reading of the hold. */
  holdSeconds: Figure;
  /**
   * What was measured at the profile's hold time, when the recorded hold reached it: the reading
   * there and the highest up to there (the same value the limit rule judges).
   */
  atHoldTime: { holdSeconds: number; readingMicrons: Figure; highestMicrons: Figure } | null;
}

export type CertaintyWords = "sure" | "likely" | "unsure";

/** The verdict's confidence: a calibrated probability that it is right, its words, and why it is not higher. */
export interface Certainty {
  /** 0–1, calibrated on simulated logs with known truth (analysis/decay/confidence). */
  confidence: number;
  words: CertaintyWords;
  /** What holds the confidence down, in plain words; empty when "sure". */
  why: string[];
  /** The evidence the confidence was read from (named numbers, see analysis/decay/confidence/features.ts). */
  evidence: Record<string, number>;
  /** Which calibration table gave it. */
  calibration: string;
}

/** The whole result: the CLI's --json shape and what the server stores. */
export interface AnalysisResult {
  engineVersion: string;
  verdict: Verdict;
  /** 0–1. */
  confidence: number;
  reasons: string[];
  isolationAt: number | null;
  decay: Decay | null;
  meetsProfile: boolean;
  profile: AcceptanceProfile;
  /** Each profile rule with whether it was met. */
  profileRules: { rule: "target" | "hold_time" | "limit" | "leak_rate"; met: boolean; detail: string }[];
  forecast: Forecast | null;
  holds: Hold[];
  phases: Phases;
  leakRate: LeakRate | null;
  findings: Finding[];
  import: ImportSummary;
  /** Each number of the primary hold once, with its definition (null without a hold). Absent in older results. */
  figures?: HoldFigures | null;
  /** The confidence in words and why. Absent in older results. */
  certainty?: Certainty;
}
