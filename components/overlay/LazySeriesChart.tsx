"use client";

/** SeriesChart loaded on demand, so chart.js stays out of a page's first load. */
import dynamic from "next/dynamic";
import type { SeriesChartProps } from "./SeriesChart";

const SeriesChart = dynamic(() => import("./SeriesChart"), {
  ssr: false,
  loading: () => (
    <div className="flex h-64 items-center justify-center rounded-xl bg-surface-sunken text-fg-soft sm:h-80" role="status">
      Drawing the curve…
    </div>
  ),
});

export function LazySeriesChart(props: SeriesChartProps) {
  return <SeriesChart {...props} />;
}
