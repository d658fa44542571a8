/**
 * One test's story, from its analysis alone: the curve statement, the profile statement, the
 * confidence in words, the numbers (each once, with its definition) and the forecast or the
 * measured value at the hold time. The test page, the lists, the report, the PDF and the e-mail all
 * render from storyOf(), so two places cannot quote two numbers for one thing.
 * Pure (no React, no database). Older analyses, stored before the engine gave its figures, get
 * figures rebuilt from their decay numbers, labelled as such.
 */
import type { AnalysisResult, CertaintyWords, Figure, HoldFigures } from "@/analysis/decay/types";
import { groupedInteger } from "@/analysis/shared/format";
import { curveWords, outcomeOf, profileSentence, RULE_LABELS, type CurveWords, type Outcome } from "./words";

const fmt = (x: number) => groupedInteger(Math.round(x));
const min1 = (s: number) => `${(s / 60).toFixed(1)} min`;

export interface StoryNumber {
  key: "start" | "last" | "highest" | "rise" | "rate" | "plateau" | "hold" | "atHoldReading";
  label: string;
  /** Formatted with its unit ("925 µ", "62.0 µ/min", "15.0 min"). */
  value: string;
  /** The number itself, in its unit (microns, microns per minute, seconds). */
  raw: number;
  definition: string;
  /** For a smoothed number: the raw reading beside it, formatted, with what it is. */
  beside?: { value: string; raw: number; definition: string };
}

export interface StoryForecast {
  kind: "measured" | "early_pass" | "early_fail" | "no_call";
  headline: string;
  note: string;
  tone: "pass" | "fail" | "neutral";
}

export interface Story {
  curve: CurveWords;
  outcome: Outcome;
  profile: { met: boolean; name: string; sentence: string; failed: { rule: string; label: string; detail: string }[] };
  /** Null for an unclear curve: there is no verdict to be sure of. */
  confidence: { percent: number; words: CertaintyWords; line: string; why: string[] } | null;
  numbers: StoryNumber[];
  forecast: StoryForecast | null;
  /** "From 186 to a last reading of 3,370 microns in 15.0 min; highest 2,650." */
  holdSentence: string | null;
}

const CERTAINTY_FROM = { sure: 0.9, likely: 0.7 };

function wordsOf(c: number): CertaintyWords {
  return c >= CERTAINTY_FROM.sure ? "sure" : c >= CERTAINTY_FROM.likely ? "likely" : "unsure";
}

/** Figures of an analysis stored before the engine gave them: rebuilt from its decay and hold. */
function legacyFigures(r: AnalysisResult): HoldFigures | null {
  const d = r.decay;
  const holds = r.phases?.holds ?? r.holds ?? [];
  const hold = r.phases?.primary != null ? holds[r.phases.primary] : null;
  if (!d || !hold) return null;
  const old = "(as stored by an earlier engine version)";
  const fig = (value: number, definition: string, atSeconds: number | null = null): Figure => ({ value, definition: `${definition} ${old}`, atSeconds });
  const highest = r.profileRules.find((x) => x.rule === "limit")?.detail.match(/highest ([\d,]+)/)?.[1];
  return {
    startMicrons: fig(hold.startMicrons, "the reading at isolation", hold.isolatedAtSeconds),
    lastMicrons: fig(hold.endMicrons, "the last reading of the hold", hold.endSeconds),
    highestMicrons: fig(highest ? Number(highest.replace(/,/g, "")) : Math.max(hold.endMicrons, hold.startMicrons), "the highest reading the limit rule judged"),
    riseMicrons: fig(hold.endMicrons - hold.startMicrons, "the last reading minus the start"),
    rateMicronsPerMinute: fig(d.leakRateMicronsPerMinute, "the steady climb of the fitted curve"),
    plateauMicrons: d.plateauMicrons != null ? fig(d.plateauMicrons, "where the fitted curve levels off") : null,
    holdSeconds: fig(hold.endSeconds - hold.isolatedAtSeconds, "from isolation to the last reading of the hold"),
    atHoldTime: null,
  };
}

export function figuresOf(r: AnalysisResult): HoldFigures | null {
  return r.figures !== undefined ? r.figures : legacyFigures(r);
}

function numbersOf(f: HoldFigures): StoryNumber[] {
  const µ = (x: number) => `${fmt(x)} µ`;
  const out: StoryNumber[] = [
    { key: "start", label: "Hold start", value: µ(f.startMicrons.value), raw: f.startMicrons.value, definition: f.startMicrons.definition },
    { key: "last", label: "Last reading", value: µ(f.lastMicrons.value), raw: f.lastMicrons.value, definition: f.lastMicrons.definition },
    {
      key: "highest",
      label: "Highest",
      value: µ(f.highestMicrons.value),
      raw: f.highestMicrons.value,
      definition: f.highestMicrons.definition,
      beside: f.highestMicrons.raw ? { value: µ(f.highestMicrons.raw.value), raw: f.highestMicrons.raw.value, definition: f.highestMicrons.raw.definition } : undefined,
    },
    { key: "rise", label: "Rise", value: µ(f.riseMicrons.value), raw: f.riseMicrons.value, definition: f.riseMicrons.definition },
    { key: "rate", label: "Steady climb", value: `${f.rateMicronsPerMinute.value.toFixed(1)} µ/min`, raw: f.rateMicronsPerMinute.value, definition: f.rateMicronsPerMinute.definition },
  ];
  if (f.plateauMicrons) out.push({ key: "plateau", label: "Levels off near", value: µ(f.plateauMicrons.value), raw: f.plateauMicrons.value, definition: f.plateauMicrons.definition });
  out.push({ key: "hold", label: "Hold time", value: min1(f.holdSeconds.value), raw: f.holdSeconds.value, definition: f.holdSeconds.definition });
  if (f.atHoldTime)
    out.push({
      key: "atHoldReading",
      label: `At ${min1(f.atHoldTime.holdSeconds)} (measured)`,
      value: µ(f.atHoldTime.readingMicrons.value),
      raw: f.atHoldTime.readingMicrons.value,
      definition: f.atHoldTime.readingMicrons.definition,
    });
  return out;
}

const RULE_WORDS: Record<string, string> = { limit: "the limit", leak_rate: "the leak rate", plateau: "the level-off (moisture)" };

function forecastOf(r: AnalysisResult, f: HoldFigures | null): StoryForecast | null {
  const limit = fmt(r.profile.limitMicrons);
  if (f?.atHoldTime) {
    const at = f.atHoldTime;
    return {
      kind: "measured",
      headline: `At ${min1(at.holdSeconds)} of hold (measured): ${fmt(at.readingMicrons.value)} microns`,
      note: `Highest up to then ${fmt(at.highestMicrons.value)} microns, limit ${limit}. The hold ran ${min1(f.holdSeconds.value)}, past the profile's ${r.profile.holdMinutes} min, so no forecast is needed.`,
      tone: "neutral",
    };
  }
  const fc = r.forecast;
  if (!fc) return null;
  const band = `about ${fmt(fc.predictedMicrons)} microns (95 % band ${fmt(fc.lowMicrons)}–${fmt(fc.highMicrons)}), limit ${limit}`;
  const basis = fc.basis ? ` Basis: ${fc.basis}.` : "";
  // Only what the verdict beside it allows: a failing verdict never sits beside "will pass".
  if (fc.earlyCall === "pass" && (r.verdict === "pass" || r.verdict === "inconclusive"))
    return { kind: "early_pass", headline: "Early call: on course to pass", note: `At ${min1(fc.atHoldSeconds)} of hold: ${band}.${basis}`, tone: "pass" };
  if (fc.earlyCall === "fail" || (fc.earlyCall === "pass" && r.verdict !== "pass" && r.verdict !== "inconclusive"))
    return {
      kind: "early_fail",
      headline: `Early call: will not pass${fc.decidingRule ? ` (${RULE_WORDS[fc.decidingRule] ?? fc.decidingRule})` : ""}`,
      note: `At ${min1(fc.atHoldSeconds)} of hold: ${band}.${basis}`,
      tone: "fail",
    };
  return { kind: "no_call", headline: "Too early to call", note: `At ${min1(fc.atHoldSeconds)} of hold: ${band}.${basis} Keep holding.`, tone: "neutral" };
}

export function storyOf(r: AnalysisResult): Story {
  const curve = curveWords(r.verdict);
  const f = figuresOf(r);
  const failed = r.profileRules.filter((x) => !x.met).map((x) => ({ rule: x.rule, label: RULE_LABELS[x.rule] ?? x.rule, detail: x.detail }));
  const c = r.certainty;
  const confidence =
    r.verdict === "inconclusive" || !Number.isFinite(r.confidence)
      ? null
      : (() => {
          const percent = Math.round(r.confidence * 100);
          const words = c?.words ?? wordsOf(r.confidence);
          const why = c?.why ?? [];
          return { percent, words, why, line: `${percent} % — ${words === "unsure" ? "unsure" : words}` };
        })();
  return {
    curve,
    outcome: outcomeOf(r.verdict, r.meetsProfile),
    profile: { met: r.meetsProfile, name: r.profile.name, sentence: profileSentence(r), failed },
    confidence,
    numbers: f ? numbersOf(f) : [],
    forecast: forecastOf(r, f),
    holdSentence: f
      ? `From ${fmt(f.startMicrons.value)} to a last reading of ${fmt(f.lastMicrons.value)} microns in ${min1(f.holdSeconds.value)}; highest ${fmt(f.highestMicrons.value)} microns${f.highestMicrons.raw && fmt(f.highestMicrons.raw.value) !== fmt(f.highestMicrons.value) ? ` (single highest reading ${fmt(f.highestMicrons.raw.value)})` : ""}.`
      : null,
  };
}
