"use client";

/**
 * A plan against a real pull-down, ready to drop on a test page: the likely plan curve shifted
 * to where the real log first reads, the real curve, the plan's range over the same span, and
 * findings when the real one is slower than the plan's slow end.
 *
 * Usage: <PlanOverlay plannerInput={...} real={{ tSeconds, microns }} /> (the pull-down part, before isolation).
 */
import { useMemo } from "react";
import { planPullDown, type PlannerInput } from "@/analysis/calculators/planner";
import { comparePlanWithPullDown } from "@/analysis/calculators/planner-compare";
import { Alert } from "@/components/ui";
import { LazyPlanChart } from "./LazyPlanChart";
import { durationWords } from "./format";

export interface PlanOverlayProps {
  plannerInput: PlannerInput;
  real: { tSeconds: number[]; microns: number[] };
}

export function PlanOverlay({ plannerInput, real }: PlanOverlayProps) {
  const { plan, comparison } = useMemo(() => {
    const p = planPullDown(plannerInput);
    return { plan: p, comparison: comparePlanWithPullDown(p, real) };
  }, [plannerInput, real]);
  const series = useMemo(
    () => [
      { label: "Real pull-down", tSeconds: real.tSeconds, microns: real.microns, kind: "real" as const },
      ...(comparison.planOnRealTime ? [{ label: "Plan (likely)", ...comparison.planOnRealTime, kind: "plan" as const }] : []),
    ],
    [real, comparison],
  );
  return (
    <div className="space-y-3" data-testid="plan-overlay">
      <LazyPlanChart
        series={series}
        targetMicrons={plan.input.targetMicrons}
        summary={`Real pull-down against the plan; the plan reaches ${plan.input.targetMicrons} microns in ${durationWords(plan.range.fastSeconds)} to ${durationWords(plan.range.slowSeconds)}.`}
      />
      {comparison.slowdownFactor !== null && (
        <p className="text-body text-fg-soft">
          From {Math.round(comparison.alignedAtMicrons ?? 0).toLocaleString("en-US")} microns: recorded {durationWords(comparison.realSecondsToTarget)}, plan {durationWords(comparison.planSecondsToTarget.fast)} – {durationWords(comparison.planSecondsToTarget.slow)} (likely {durationWords(comparison.planSecondsToTarget.likely)}), {comparison.slowdownFactor.toFixed(1)}× the likely plan.
        </p>
      )}
      {comparison.findings.map((f) => (
        <Alert key={f.code} tone="warning" title={f.title}>
          <p>{f.message}</p>
          <ul className="mt-1 list-disc pl-5">
            {f.checks.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        </Alert>
      ))}
      <ul className="list-disc pl-5 text-caption text-fg-soft">
        {plan.assumptions.map((a) => (
          <li key={a}>{a}</li>
        ))}
      </ul>
      <p className="text-caption text-fg-soft">{plan.caveat}</p>
    </div>
  );
}
