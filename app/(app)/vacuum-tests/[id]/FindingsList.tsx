import type { Finding, Severity } from "@/analysis/decay/types";
import { Card } from "@/components/ui";
import { durationWords } from "./format";

const SEVERITY: Record<Severity, { word: string; mark: string; cls: string }> = {
  danger: { word: "Danger", mark: "!!", cls: "bg-verdict-leak text-white" },
  warning: { word: "Warning", mark: "!", cls: "bg-flare-500 text-ink" },
  advice: { word: "Advice", mark: "→", cls: "bg-tide-600 text-white" },
  info: { word: "Note", mark: "i", cls: "bg-verdict-unsure text-white" },
};

const ORDER: Severity[] = ["danger", "warning", "advice", "info"];

function evidenceText(v: number | string | boolean | null): string {
  if (v === null) return "—";
  if (typeof v === "number") return Number.isInteger(v) ? v.toLocaleString("en-US") : Number(v.toPrecision(4)).toLocaleString("en-US");
  return String(v);
}

/** Each sign in the log: what it means, what to check, and its cautions shown prominently. */
export function FindingsList({ findings, cautionsInSafetyBox = false }: { findings: Finding[]; cautionsInSafetyBox?: boolean }) {
  if (findings.length === 0) return null;
  const sorted = [...findings].sort((a, b) => ORDER.indexOf(a.severity) - ORDER.indexOf(b.severity));
  return (
    <Card title="What the log shows">
      <ul className="space-y-4" data-testid="findings">
        {sorted.map((f, i) => {
          const s = SEVERITY[f.severity] ?? SEVERITY.info;
          return (
            <li key={`${f.code}-${i}`} className="rounded-xl border border-surface-line p-3" data-testid={`finding-${f.code}`}>
              <div className="flex flex-wrap items-center gap-2">
                <span className={`inline-flex items-center gap-1 rounded-full px-2 py-0.5 text-caption font-semibold ${s.cls}`}>
                  <span aria-hidden="true">{s.mark}</span>
                  {s.word}
                </span>
                <h3 className="text-lead font-semibold">{f.title}</h3>
              </div>
              <p className="mt-1 text-body">{f.message}</p>
              {f.atSeconds != null && <p className="text-caption text-fg-soft">At {durationWords(f.atSeconds)} from the start.</p>}
              {f.cautions.length > 0 && cautionsInSafetyBox && <p className="mt-1 text-caption font-medium">Its caution is in the Safety box.</p>}
              {f.cautions.length > 0 && !cautionsInSafetyBox && (
                <div className="mt-2 rounded-lg border-2 border-flare-500 bg-flare-100 px-3 py-2 text-ink dark:bg-surface-sunken dark:text-fg" role="note">
                  <p className="font-semibold">Caution</p>
                  <ul className="list-disc pl-5 text-body">
                    {f.cautions.map((c) => <li key={c}>{c}</li>)}
                  </ul>
                </div>
              )}
              {f.checks.length > 0 && (
                <>
                  <p className="mt-2 text-body font-semibold">Check, in this order</p>
                  <ol className="list-decimal space-y-1 pl-6 text-body">
                    {f.checks.map((c) => <li key={c}>{c}</li>)}
                  </ol>
                </>
              )}
              {Object.keys(f.evidence).length > 0 && (
                <details className="mt-2">
                  <summary className="inline-flex min-h-tap cursor-pointer items-center text-body text-tide-700 underline dark:text-tide-300">The numbers behind it</summary>
                  <dl className="grid grid-cols-2 gap-x-3 gap-y-1 text-caption">
                    {Object.entries(f.evidence).map(([k, v]) => (
                      <div key={k} className="contents">
                        <dt className="text-fg-soft">{k}</dt>
                        <dd className="tabular-nums">{evidenceText(v)}</dd>
                      </div>
                    ))}
                  </dl>
                </details>
              )}
            </li>
          );
        })}
      </ul>
    </Card>
  );
}
