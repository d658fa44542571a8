import type { AnalysisResult } from "@/analysis/types";
import { Card } from "@/components/ui";
import { storyOf } from "@/lib/verdict/story";

const TONE: Record<"pass" | "fail" | "neutral", string> = {
  pass: "text-verdict-pass dark:text-green-300",
  fail: "text-verdict-leak dark:text-orange-300",
  neutral: "text-fg",
};

/**
 * Where a short hold is heading at the profile's hold time, with an early call made by the verdict's
 * own rules; or, once the hold ran past that time, what was measured then (no forecast looks back).
 */
export function ForecastPanel({ analysis }: { analysis: AnalysisResult }) {
  const f = storyOf(analysis).forecast;
  if (!f) return null;
  return (
    <Card title={f.kind === "measured" ? "At the hold time" : "Forecast"}>
      <p className={`text-lead font-semibold ${TONE[f.tone]}`} data-testid="early-call" data-kind={f.kind}>{f.headline}</p>
      <p className="text-body text-fg-soft">{f.note}</p>
    </Card>
  );
}
