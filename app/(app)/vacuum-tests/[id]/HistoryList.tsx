import { Card, LinkButton } from "@/components/ui";
import { VerdictBadge } from "@/components/verdict/VerdictBadge";
import { confidenceWords } from "@/components/verdict/words";
import { certaintyWordsOf } from "@/analysis/decay/confidence";
import type { HistoryEntry } from "@/lib/client/api";
import { dateTimeWords, durationWords } from "./format";
import { versionHref } from "./version";

/** The overrides a version was run with, in words. */
export function optionsWords(options: object | null): string[] {
  if (!options) return [];
  const out: string[] = [];
  const o = options as {
    isolationAtSeconds?: number;
    holdWindow?: { startSeconds: number; endSeconds: number };
    import?: { unit?: string; timeUnit?: string; timeColumn?: string | number; pressureColumn?: string | number };
    unit?: string;
    timeUnit?: string;
    profile?: { name?: string };
    profileId?: string;
  };
  if (o.isolationAtSeconds != null) out.push(`Isolation set to ${durationWords(o.isolationAtSeconds)} from the start`);
  if (o.holdWindow) out.push(`Hold window ${durationWords(o.holdWindow.startSeconds)} – ${durationWords(o.holdWindow.endSeconds)}`);
  const unit = o.import?.unit ?? o.unit;
  if (unit) out.push(`Pressure read as ${unit}`);
  const timeUnit = o.import?.timeUnit ?? o.timeUnit;
  if (timeUnit) out.push(`Elapsed time in ${timeUnit === "min" ? "minutes" : "seconds"}`);
  if (o.import?.timeColumn != null) out.push(`Time column ${o.import.timeColumn}`);
  if (o.import?.pressureColumn != null) out.push(`Pressure column ${o.import.pressureColumn}`);
  if (o.profile?.name) out.push(`Profile “${o.profile.name}”`);
  return out;
}

function byName(createdBy: HistoryEntry["createdBy"]): string {
  return createdBy.name || "—";
}

/**
 * Every analysis of the test, newest first; each opens to show how it was run. With `testId`,
 * each version not shown above gets a "View" link (`shownId`: the version on the page, else the current).
 */
export function HistoryList({ history, currentId, testId, shownId }: { history: HistoryEntry[]; currentId: string | null | undefined; testId?: string; shownId?: string | null }) {
  const sorted = [...history].sort((a, b) => b.version - a.version);
  const currentVersion = sorted.find((h) => h.id === (shownId ?? currentId))?.version ?? sorted[0]?.version;
  return (
    <Card title="History">
      <ol className="space-y-2" data-testid="history">
        {sorted.map((h) => {
          const words = optionsWords(h.options);
          return (
            <li key={h.id} data-testid="history-entry" data-version={h.version}>
              <details className="rounded-xl border border-surface-line" open={sorted.length === 1}>
                <summary className="flex min-h-tap cursor-pointer flex-wrap items-center gap-2 px-3 py-2">
                  <span className="font-semibold">Version {h.version}</span>
                  <VerdictBadge verdict={h.verdict} meetsProfile={h.meetsProfile} />
                  {h.verdict !== "inconclusive" && <span className="text-caption text-fg-soft">{confidenceWords(h.confidence)} — {certaintyWordsOf(h.confidence)}</span>}
                  {h.version === currentVersion && <span className="rounded-full bg-tide-50 px-2 py-0.5 text-caption font-semibold text-tide-800 dark:bg-tide-900 dark:text-tide-100">shown above</span>}
                </summary>
                <div className="space-y-1 border-t border-surface-line px-3 py-2 text-body">
                  <p className="text-fg-soft">
                    {dateTimeWords(h.createdAt)} by {byName(h.createdBy)}
                  </p>
                  {h.reason && <p>Reason: {h.reason}</p>}
                  {words.length > 0 ? (
                    <ul className="list-disc pl-5">
                      {words.map((w) => <li key={w}>{w}</li>)}
                    </ul>
                  ) : (
                    <p className="text-fg-soft">Run as detected, no overrides.</p>
                  )}
                </div>
              </details>
              {testId && sorted.length > 1 && h.version !== currentVersion && (
                <LinkButton variant="quiet" className="mt-1" href={versionHref(testId, h.id === currentId ? null : h.id)}>
                  {h.id === currentId ? `View version ${h.version} (current)` : `View version ${h.version}`}
                </LinkButton>
              )}
            </li>
          );
        })}
      </ol>
    </Card>
  );
}
