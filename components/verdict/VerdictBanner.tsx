import type { AnalysisResult } from "@/analysis/types";
import { VerdictIcon } from "./VerdictIcon";
import { RULE_LABELS, confidenceWords, verdictText } from "./words";

interface Props {
  analysis: AnalysisResult;
  /** Heading level of the verdict line (1 on the test page, 2 inside the new-test flow). */
  level?: 1 | 2;
  className?: string;
}

/**
 * The verdict in plain words: headline, what the curve did, confidence, whether the shop's
 * acceptance profile was met and which rule failed, and the usual next step.
 */
export function VerdictBanner({ analysis, level = 2, className = "" }: Props) {
  const t = verdictText(analysis.verdict);
  const failed = analysis.profileRules.filter((r) => !r.met);
  const H = level === 1 ? "h1" : "h2";
  return (
    <section aria-label="Verdict" data-testid="verdict" className={`overflow-hidden rounded-card border-2 ${t.accent} bg-surface-raised shadow-card ${className}`}>
      <div className={`flex items-start gap-3 px-4 py-4 ${t.solid}`}>
        <VerdictIcon verdict={analysis.verdict} className="mt-0.5 h-9 w-9 shrink-0" />
        <div className="min-w-0">
          <H className="text-headline" data-testid="verdict-headline">{t.headline}</H>
          <p className="text-body opacity-95">{t.meaning}</p>
        </div>
      </div>
      <div className="space-y-3 px-4 py-4">
        <dl className="grid grid-cols-2 gap-3">
          <div>
            <dt className="text-caption text-fg-soft">Confidence</dt>
            <dd className="text-title">{confidenceWords(analysis.confidence)}</dd>
          </div>
          <div>
            <dt className="text-caption text-fg-soft">Profile “{analysis.profile.name}”</dt>
            <dd className="flex items-center gap-1.5 text-title">
              {analysis.meetsProfile ? (
                <><span aria-hidden="true">✓</span> Met</>
              ) : (
                <><span aria-hidden="true">✕</span> Not met</>
              )}
            </dd>
          </div>
        </dl>
        {failed.length > 0 && (
          <div>
            <p className="text-caption font-semibold text-fg-soft">Rules not met</p>
            <ul className="mt-1 space-y-1">
              {failed.map((r) => (
                <li key={r.rule} className="text-body">
                  <span className="font-semibold">✕ {RULE_LABELS[r.rule] ?? r.rule}:</span> {r.detail}
                </li>
              ))}
            </ul>
          </div>
        )}
        {analysis.reasons.length > 0 && (
          <ul className="list-disc space-y-1 pl-5 text-body text-fg-soft">
            {analysis.reasons.map((r, i) => (
              <li key={i}>{r}</li>
            ))}
          </ul>
        )}
        <p className="rounded-lg bg-surface-sunken px-3 py-2 text-body">
          <span className="font-semibold">Next: </span>
          {t.next}
        </p>
      </div>
    </section>
  );
}
