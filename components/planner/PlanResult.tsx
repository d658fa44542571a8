"use client";

/**
 * A plan as a range (fast end – slow end, likely between), the what-ifs beside it in words that
 * never show a negative saving, the curves, and every assumption listed beside the numbers.
 */
import { useMemo } from "react";
import type { Plan, WhatIf } from "@/analysis/calculators/planner";
import { comparedWords } from "@/analysis/calculators/planner-whatifs";
import { Alert, Card } from "@/components/ui";
import { LazyPlanChart } from "./LazyPlanChart";
import { durationWords } from "./format";

/** "12 min – 45 min (likely 25 min)"; "more than 12 h" for a case that does not get there. */
export function rangeWords(plan: Plan): string {
  const w = (s: number | null) => (s === null ? "more than 12 h" : durationWords(s));
  const { fastSeconds, likelySeconds, slowSeconds } = plan.range;
  if (likelySeconds === null && fastSeconds === null) return plan.input.targetMicrons <= plan.input.pump.blankOffMicrons ? "never" : "more than 12 h";
  return `${w(fastSeconds)} – ${w(slowSeconds)}`;
}

export function PlanResult({ whatIfs, volumeLitres }: { whatIfs: WhatIf[]; volumeLitres: number }) {
  const main = whatIfs[0].plan;
  const series = useMemo(
    () => [
      ...main.cases.map((c) => ({ label: `As planned, ${c.key === "likely" ? "likely" : c.key === "fast" ? "fast end" : "slow end"}`, tSeconds: c.curve.tSeconds, microns: c.curve.microns, kind: "plan" as const })),
      ...whatIfs.slice(1).map((w) => ({ label: w.label, tSeconds: w.plan.curve.tSeconds, microns: w.plan.curve.microns, kind: "plan" as const })),
    ],
    [main, whatIfs],
  );
  const likely = main.range.likelySeconds;
  return (
    <Card title="Plan" data-testid="plan-result">
      <p className="text-body text-fg-soft">
        {volumeLitres.toFixed(2)} L system, pump {main.pumpSpeedLps.toFixed(2)} L/s, to {main.input.targetMicrons.toLocaleString("en-US")} microns.
      </p>
      <p className="text-figure" data-testid="time-to-target">
        {likely === null ? rangeWords(main) : durationWords(likely)}
      </p>
      <p className="text-body">
        likely; <strong data-testid="plan-range">{rangeWords(main)}</strong> between the fast and the slow end of the assumptions. The gas alone would take {durationWords(main.gasOnlySeconds)}. Slowest part: {main.bottleneck}.
      </p>
      <div className="mt-3 grid gap-4 lg:grid-cols-2">
        <table className="w-full text-left text-body" aria-label="What-ifs side by side">
          <thead>
            <tr className="border-b border-surface-line text-caption text-fg-soft">
              <th className="py-2 font-medium">Setup</th>
              <th className="py-2 font-medium">Likely</th>
              <th className="py-2 font-medium">Range</th>
              <th className="py-2 font-medium">Against as planned</th>
            </tr>
          </thead>
          <tbody>
            {whatIfs.map((w) => (
              <tr key={w.key} className="border-b border-surface-line align-top">
                <td className="py-2">{w.label}</td>
                <td className="py-2">{durationWords(w.plan.range.likelySeconds)}</td>
                <td className="py-2 text-caption">{rangeWords(w.plan)}</td>
                <td className="py-2">{w.key === "as_planned" ? "—" : comparedWords(w.plan.range.likelySeconds, likely)}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <section aria-label="Assumptions">
          <h3 className="text-body font-semibold">Assumptions</h3>
          <ul className="mt-1 list-disc space-y-1 pl-5 text-caption text-fg-soft" data-testid="plan-assumptions">
            {main.assumptions.map((a) => (
              <li key={a}>{a}</li>
            ))}
          </ul>
        </section>
      </div>
      <div className="mt-4">
        <LazyPlanChart series={series} targetMicrons={main.input.targetMicrons} summary={`Predicted pull-down curves; as planned reaches the target in ${rangeWords(main)}, likely ${durationWords(likely)}.`} />
      </div>
      <Alert tone="info" className="mt-3" title="A range, not a promise">
        {main.caveat} Never energise the compressor while the system is in deep vacuum.
      </Alert>
    </Card>
  );
}
