"use client";

import dynamic from "next/dynamic";
import type { PlanChartProps } from "./PlanChart";

const PlanChart = dynamic(() => import("./PlanChart"), {
  ssr: false,
  loading: () => (
    <div className="flex h-72 items-center justify-center rounded-card border border-surface-line bg-surface-raised text-fg-soft sm:h-96" role="status">
      Drawing the curves…
    </div>
  ),
});

/** The plan chart, loaded on demand. */
export function LazyPlanChart(props: PlanChartProps) {
  return <PlanChart {...props} />;
}
