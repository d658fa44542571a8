"use client";

/**
 * A plan against a real pull-down, ready to drop on a test page: the gas-only plan curve shifted
 * to where the real log first reads, the real curve, and findings when the real one is much slower.
 *
 * Usage: <PlanOverlay plannerInput={...} real={{ tSeconds, microns }} /> (the pull-down part, before isolation).
 */
import { useMemo } from "react";
import { planPullDown, type PlannerInput } from "@/analysis/planner";
import { comparePlanWithPullDown } from "@/analysis/planner-compare";
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
      ...(comparison.planOnRealTime ? [{ label: "Plan (gas only)", ...comparison.planOnRealTime, kind: "plan" as const }] : []),
    ],
    [real, comparison],
  );
  return (
    <div className="space-y-3" data-testid="plan-overlay">
      <LazyPlanChart
        series={series}
        targetMicrons={plan.input.targetMicrons}
        summary={`Real pull-down against the plan; the plan reaches ${plan.input.targetMicrons} microns in ${durationWords(plan.timeToTargetSeconds)}.`}
      />
      {comparison.slowdownFactor !== null && (
        <p className="text-body text-fg-soft">
          From {Math.round(comparison.alignedAtMicrons ?? 0).toLocaleString("en-US")} microns the real pull-down took {comparison.slowdownFactor.toFixed(1)}× the plan.
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
      <p className="text-caption text-fg-soft">{plan.caveat}</p>
    </div>
  );
}
