/**
 * Riseline's one vocabulary for a test, used by every screen, the report, the PDF and the e-mail.
 * Two statements, never merged: what the curve shows (the engine's verdict) and whether the shop's
 * acceptance profile was met. "Passed" is the word for both at once and for nothing else.
 */
import type { AnalysisResult, Verdict } from "@/analysis/decay/types";

export type CurveKey = "tight_dry" | "levels_off" | "steady_climb" | "both" | "unclear";

export interface CurveWords {
  key: CurveKey;
  /** One to three words for badges and lists. */
  label: string;
  /** The banner headline: what the curve shows and what it usually means. */
  headline: string;
  /** What the curve did, in one sentence. */
  meaning: string;
  /** The usual next step. */
  next: string;
}

export const CURVE_WORDS: Record<Verdict, CurveWords> = {
  pass: {
    key: "tight_dry",
    label: "Tight and dry",
    headline: "Tight and dry",
    meaning: "The rise was small and settled below the limit.",
    next: "Isolate the gauge, then break the vacuum with refrigerant.",
  },
  moisture: {
    key: "levels_off",
    label: "Levels off",
    headline: "Levels off: moisture likely",
    meaning: "The pressure rose fast, then levelled off above the limit: water boiling off, or refrigerant leaving the oil.",
    next: "Keep evacuating and add heat (indoor blower, outdoor fan). Never run the compressor under vacuum.",
  },
  leak: {
    key: "steady_climb",
    label: "Steady climb",
    headline: "Steady climb: leak likely",
    meaning: "The pressure keeps climbing at a steady rate, as gas coming in through an opening does.",
    next: "Test the rig on its own (hoses, gaskets, core tools), check the valve stem O-rings, then pressure-test with nitrogen.",
  },
  leak_and_moisture: {
    key: "both",
    label: "Levels off and climbs",
    headline: "Levels off and climbs: moisture and a leak",
    meaning: "The pressure levelled off above the limit and still keeps climbing.",
    next: "Find the leak first, then keep evacuating.",
  },
  inconclusive: {
    key: "unclear",
    label: "Unclear",
    headline: "Unclear from this log",
    meaning: "The log does not show enough of a hold to judge.",
    next: "Hold longer after isolating, or check the isolation point and analyse again.",
  },
};

export function curveWords(verdict: Verdict | string | null | undefined): CurveWords {
  return CURVE_WORDS[(verdict ?? "inconclusive") as Verdict] ?? CURVE_WORDS.inconclusive;
}

export type RuleKey = AnalysisResult["profileRules"][number]["rule"];

/** Each profile rule in words, as a statement that is met or not. */
export const RULE_LABELS: Record<RuleKey, string> = {
  target: "Reached the target before isolating",
  hold_time: "Held long enough",
  limit: "Stayed at or below the limit",
  leak_rate: "Climb under the leak rate",
};

/** The combined outcome a list shows in one chip: "Passed" only for a tight, dry curve that met the profile. */
export interface Outcome {
  label: string;
  /** Colour family: the verdict's own, or "attention" for a tight curve that missed the profile. */
  tone: Verdict | "attention";
  /** Words of the profile half, when it is not plain from the label. */
  profile: "meets" | "misses" | "unknown";
}

export function outcomeOf(verdict: Verdict | string | null | undefined, meetsProfile: boolean | null | undefined): Outcome {
  const v = (verdict ?? "inconclusive") as Verdict;
  const profile = meetsProfile === true ? "meets" : meetsProfile === false ? "misses" : "unknown";
  if (v === "pass") {
    if (profile === "meets") return { label: "Passed", tone: "pass", profile };
    if (profile === "misses") return { label: "Tight and dry, misses profile", tone: "attention", profile };
    return { label: CURVE_WORDS.pass.label, tone: "pass", profile };
  }
  return { label: curveWords(v).label, tone: v, profile };
}

/** The profile statement: "Meets the profile “Shop default”" or "Misses the profile “…”: <what failed>". */
export function profileSentence(r: Pick<AnalysisResult, "meetsProfile" | "profile" | "profileRules">): string {
  if (r.meetsProfile) return `Meets the profile “${r.profile.name}”.`;
  const failed = r.profileRules.filter((x) => !x.met).map((x) => x.detail);
  return `Misses the profile “${r.profile.name}”${failed.length ? `: ${failed.join("; ")}` : ""}.`;
}

/** A list of short steps written as one line: "Keep evacuating. Warm the circuit." (each ends with one stop). */
export function stepsLine(steps: string[]): string {
  return steps.map((s) => s.trim().replace(/[.;:,\s]+$/, "") + ".").join(" ");
}
