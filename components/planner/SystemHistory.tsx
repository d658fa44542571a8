"use client";

/**
 * A system's recorded pull-downs beside the plan for each (its kit, volume and condition), from
 * GET /api/planner/history: both numbers shown, and whether the recorded one fell inside the
 * plan's range. Usage: <SystemHistory systemId={id} onSuggestion={(s) => …} />.
 */
import { useEffect, useState } from "react";
import type { PlannerHistory } from "@/lib/planner/history";
import { Alert, Card } from "@/components/ui";
import { apiFetch, ApiError } from "@/lib/client/api";
import { durationWords } from "./format";

function verdictOfRatio(r: PlannerHistory["pullDowns"][number]): string {
  if (r.recordedSeconds === null) return r.plan ? "never reached the target" : "—";
  if (!r.plan) return "—";
  const { fastSeconds, slowSeconds } = r.plan;
  if (slowSeconds !== null && r.recordedSeconds > slowSeconds) return "slower than the slow end";
  if (fastSeconds !== null && r.recordedSeconds < fastSeconds) return "faster than the fast end";
  return "inside the range";
}

export function SystemHistory({ systemId, onSuggestion }: { systemId: string; onSuggestion?: (s: PlannerHistory["suggestion"]) => void }) {
  const [data, setData] = useState<PlannerHistory | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    apiFetch<PlannerHistory>(`/api/planner/history?systemId=${systemId}`).then(
      (d) => {
        if (!live) return;
        setData(d);
        onSuggestion?.(d.suggestion);
      },
      (e) => live && setError(e instanceof ApiError ? e.message : String(e)),
    );
    return () => {
      live = false;
    };
    // onSuggestion is a fresh closure each render; the history depends on the system only.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [systemId]);
  if (error) return <Alert tone="error">{error}</Alert>;
  if (!data) return <p className="text-body text-fg-soft" role="status">Reading this system&apos;s tests…</p>;
  const w = (s: number | null | undefined) => (s === null || s === undefined ? "—" : durationWords(s));
  return (
    <Card title={`Recorded pull-downs on ${data.system.name}`} data-testid="system-history">
      {data.pullDowns.length === 0 ? (
        <p className="text-body text-fg-soft">No vacuum tests recorded on this system yet.</p>
      ) : (
        <>
          <p className="text-body">
            Each test&apos;s own pull-down, from the first reading at or below 20,000 microns to its target, beside the plan for the kit, volume and condition of that test.
            {data.summary.compared > 0 && ` ${data.summary.withinFactorTwo} of ${data.summary.compared} within a factor of 2 of the likely plan.`}
          </p>
          <ul className="mt-3 divide-y divide-surface-line">
            {data.pullDowns.map((r) => (
              <li key={r.testId} className="py-2">
                <p className="font-medium">
                  {r.testedAt.slice(0, 10)} · {r.title}
                </p>
                <p className="text-caption text-fg-soft">
                  {r.technicianName}
                  {r.rigName ? ` · ${r.rigName}` : ""}
                  {r.condition ? ` · ${r.condition}` : ""}
                </p>
                {r.notPlanned ? (
                  <p className="text-body text-fg-soft">{r.notPlanned}</p>
                ) : (
                  <p className="text-body" data-testid="recorded-vs-plan">
                    Recorded <strong>{w(r.recordedSeconds)}</strong> · plan {w(r.plan?.fastSeconds)} – {w(r.plan?.slowSeconds)} (likely {w(r.plan?.likelySeconds)}) · {verdictOfRatio(r)}
                  </p>
                )}
                {r.assumptions.length > 0 && (
                  <details className="text-caption text-fg-soft">
                    <summary className="min-h-tap cursor-pointer py-1">What the plan for this test assumed</summary>
                    <ul className="list-disc pl-5">
                      {r.assumptions.map((a) => (
                        <li key={a}>{a}</li>
                      ))}
                    </ul>
                  </details>
                )}
              </li>
            ))}
          </ul>
        </>
      )}
    </Card>
  );
}
