/**
 * Riseline's verdict words. Every verdict is shown as icon + colour + words, never colour alone.
 * The wording is plain and says what to do next, in the technician's terms.
 */
import type { Verdict } from "@/analysis/types";

export interface VerdictText {
  /** One or two words for badges and lists. */
  label: string;
  /** The banner headline. */
  headline: string;
  /** What the curve did, in one sentence. */
  meaning: string;
  /** The usual next step. */
  next: string;
  /** Tailwind classes for a solid chip/banner (white text passes contrast on every verdict colour). */
  solid: string;
  /** Tailwind border/text accent for outlines. */
  accent: string;
}

export const VERDICT_TEXT: Record<Verdict, VerdictText> = {
  pass: {
    label: "Passed",
    headline: "Tight and dry",
    meaning: "The rise was small and settled below the limit.",
    next: "Isolate the gauge, then break the vacuum with refrigerant.",
    solid: "bg-verdict-pass text-white",
    accent: "border-verdict-pass",
  },
  leak: {
    label: "Leak",
    headline: "Leak likely",
    meaning: "The pressure keeps climbing at a steady rate.",
    next: "Test the rig on its own (hoses, gaskets, core tools), check the valve stem O-rings, then pressure-test with nitrogen.",
    solid: "bg-verdict-leak text-white",
    accent: "border-verdict-leak",
  },
  moisture: {
    label: "Moisture",
    headline: "Moisture likely",
    meaning: "The pressure rose fast, then levelled off above the limit.",
    next: "Keep evacuating and add heat (indoor blower, outdoor fan). Never run the compressor under vacuum.",
    solid: "bg-verdict-moisture text-white",
    accent: "border-verdict-moisture",
  },
  leak_and_moisture: {
    label: "Leak + moisture",
    headline: "Leak and moisture",
    meaning: "The pressure levelled off and still keeps climbing.",
    next: "Find the leak first, then keep evacuating.",
    solid: "bg-verdict-both text-white",
    accent: "border-verdict-both",
  },
  inconclusive: {
    label: "Can't tell",
    headline: "Can't tell from this log",
    meaning: "The log does not show enough of a hold to judge.",
    next: "Hold longer after isolating, or check the isolation point and analyse again.",
    solid: "bg-verdict-unsure text-white",
    accent: "border-verdict-unsure",
  },
};

export function verdictText(verdict: Verdict | null | undefined): VerdictText {
  return VERDICT_TEXT[verdict ?? "inconclusive"] ?? VERDICT_TEXT.inconclusive;
}

/** 0.83 → "83 %". */
export function confidenceWords(confidence: number | null | undefined): string {
  if (confidence == null || !Number.isFinite(confidence)) return "—";
  return `${Math.round(confidence * 100)} %`;
}

export const RULE_LABELS: Record<"target" | "hold_time" | "limit" | "leak_rate", string> = {
  target: "Reached target before isolating",
  hold_time: "Held long enough",
  limit: "Stayed below the limit",
  leak_rate: "Rise rate under the leak threshold",
};
