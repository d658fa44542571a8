import type { AnalysisResult } from "@/analysis/decay/types";
import { storyOf } from "@/lib/verdict/story";
import { VerdictIcon } from "./VerdictIcon";
import { verdictText } from "./words";

const FORECAST_TONE: Record<"pass" | "fail" | "neutral", string> = {
  pass: "text-verdict-pass dark:text-green-300",
  fail: "text-verdict-leak dark:text-orange-300",
  neutral: "text-fg",
};

interface Props {
  analysis: AnalysisResult;
  /** Heading level of the verdict line (1 on the test page, 2 inside the new-test flow). */
  level?: 1 | 2;
  className?: string;
}

/**
 * The test in two statements, never merged: what the curve shows (headline, meaning, confidence in
 * words and why) and whether the shop's acceptance profile was met (with the rule that failed);
 * then the hold in one sentence, the early call of a short hold (made by the verdict's own rules)
 * or what was measured at the profile's hold time, the reasons and the usual next step.
 */
export function VerdictBanner({ analysis, level = 2, className = "" }: Props) {
  const t = verdictText(analysis.verdict);
  const story = storyOf(analysis);
  const H = level === 1 ? "h1" : "h2";
  const c = story.confidence;
  return (
    <section aria-label="Verdict" data-testid="verdict" className={`overflow-hidden rounded-card border-2 ${t.accent} bg-surface-raised shadow-card ${className}`}>
      <div className={`flex items-start gap-3 px-4 py-4 ${t.solid}`}>
        <VerdictIcon verdict={analysis.verdict} className="mt-0.5 h-9 w-9 shrink-0" />
        <div className="min-w-0">
          <p className="text-caption font-semibold uppercase tracking-wide opacity-90">The curve</p>
          <H className="text-headline" data-testid="verdict-headline">{story.curve.headline}</H>
          <p className="text-body opacity-95">{story.curve.meaning}</p>
        </div>
      </div>
      <div className="space-y-3 px-4 py-4">
        <dl className="grid gap-3 sm:grid-cols-2">
          <div>
            <dt className="text-caption text-fg-soft">Confidence in the curve’s reading</dt>
            <dd className="text-title" data-testid="confidence">
              {c ? (
                <>
                  {c.percent} % <span className="font-normal">— {c.words}</span>
                </>
              ) : (
                "Not judged yet"
              )}
            </dd>
            {c && c.why.length > 0 && (
              <dd className="mt-1 text-body text-fg-soft" data-testid="confidence-why">
                {c.words === "unsure" ? "Unsure because: " : "Not sure because: "}
                {c.why.join(" ")}
              </dd>
            )}
          </div>
          <div data-testid="profile-statement">
            <dt className="text-caption text-fg-soft">The shop’s profile “{story.profile.name}”</dt>
            <dd className="flex items-center gap-1.5 text-title">
              {story.profile.met ? (
                <><span aria-hidden="true">✓</span> Met</>
              ) : (
                <><span aria-hidden="true">✕</span> Not met</>
              )}
            </dd>
            {story.profile.failed.length > 0 && (
              <dd>
                <ul className="mt-1 space-y-1">
                  {story.profile.failed.map((r) => (
                    <li key={r.rule} className="text-body" data-testid={`rule-${r.rule}`}>
                      <span className="font-semibold">✕ {r.label}:</span> {r.detail}
                    </li>
                  ))}
                </ul>
              </dd>
            )}
          </div>
        </dl>
        {story.holdSentence && <p className="text-body" data-testid="hold-sentence">{story.holdSentence}</p>}
        {story.forecast && (
          <div className="rounded-lg border border-surface-line px-3 py-2" data-testid="forecast">
            <p className={`text-lead font-semibold ${FORECAST_TONE[story.forecast.tone]}`} data-testid="early-call" data-kind={story.forecast.kind}>
              {story.forecast.headline}
            </p>
            <p className="text-body text-fg-soft">{story.forecast.note}</p>
          </div>
        )}
        {analysis.reasons.length > 0 && (
          <ul className="list-disc space-y-1 pl-5 text-body text-fg-soft" data-testid="reasons">
            {analysis.reasons.map((r, i) => (
              <li key={i}>{r}</li>
            ))}
          </ul>
        )}
        <p className="rounded-lg bg-surface-sunken px-3 py-2 text-body">
          <span className="font-semibold">Next: </span>
          {story.curve.next}
          {!story.profile.met && analysis.verdict === "pass" ? " The profile was missed: the lead decides whether it may stand." : ""}
        </p>
      </div>
    </section>
  );
}
