"use client";

/**
 * The decay chart loaded on demand, so chart.js stays out of a page's first load
 * (the new-test page only needs it once a verdict is shown).
 */
import dynamic from "next/dynamic";
import type { DecayChartProps } from "./DecayChart";

const DecayChart = dynamic(() => import("./DecayChart"), {
  ssr: false,
  loading: () => (
    <div className="flex h-72 items-center justify-center rounded-card border border-surface-line bg-surface-raised text-fg-soft sm:h-96" role="status">
      Drawing the curve…
    </div>
  ),
});

export function LazyDecayChart(props: DecayChartProps) {
  return <DecayChart {...props} />;
}
