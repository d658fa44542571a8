/**
 * Riseline's verdict words on screen: the one vocabulary of lib/verdict/words.ts with the colours
 * each verdict is drawn in. Every verdict is shown as icon + colour + words, never colour alone.
 */
import type { Verdict } from "@/analysis/decay/types";
import { CURVE_WORDS, curveWords, type CurveWords, type Outcome } from "@/lib/verdict/words";

export { RULE_LABELS, outcomeOf, curveWords, type Outcome } from "@/lib/verdict/words";

export interface VerdictText extends CurveWords {
  /** Tailwind classes for a solid chip/banner (white text passes contrast on every verdict colour). */
  solid: string;
  /** Tailwind border/text accent for outlines. */
  accent: string;
}

const COLOURS: Record<Verdict, { solid: string; accent: string }> = {
  pass: { solid: "bg-verdict-pass text-white", accent: "border-verdict-pass" },
  leak: { solid: "bg-verdict-leak text-white", accent: "border-verdict-leak" },
  moisture: { solid: "bg-verdict-moisture text-white", accent: "border-verdict-moisture" },
  leak_and_moisture: { solid: "bg-verdict-both text-white", accent: "border-verdict-both" },
  inconclusive: { solid: "bg-verdict-unsure text-white", accent: "border-verdict-unsure" },
};

export const VERDICT_TEXT: Record<Verdict, VerdictText> = Object.fromEntries(
  (Object.keys(CURVE_WORDS) as Verdict[]).map((v) => [v, { ...CURVE_WORDS[v], ...COLOURS[v] }]),
) as Record<Verdict, VerdictText>;

export function verdictText(verdict: Verdict | null | undefined): VerdictText {
  const v = (verdict ?? "inconclusive") as Verdict;
  return VERDICT_TEXT[v] ?? { ...curveWords(v), ...COLOURS.inconclusive };
}

/** Chip classes of a combined outcome: a tight curve that missed the profile is amber, never green. */
export function outcomeClasses(o: Outcome): string {
  return o.tone === "attention" ? "bg-flare-500 text-ink" : COLOURS[o.tone].solid;
}

/** 0.83 → "83 %". */
export function confidenceWords(confidence: number | null | undefined): string {
  if (confidence == null || !Number.isFinite(confidence)) return "—";
  return `${Math.round(confidence * 100)} %`;
}
