"use client";

/**
 * Predicted pull-down curves (and optionally a real one) on a log micron axis against minutes.
 * Loaded with next/dynamic only (LazyPlanChart), so chart.js stays out of first loads;
 * react-chartjs-2 owns the chart's life.
 */
import { useMemo } from "react";
import { durationWords } from "@/analysis/shared/format";
import { Chart, LinearScale, LineController, LineElement, LogarithmicScale, PointElement, Tooltip, Legend, type ChartData, type ChartOptions } from "chart.js";
import { Line } from "react-chartjs-2";

Chart.register(LineController, LineElement, PointElement, LinearScale, LogarithmicScale, Tooltip, Legend);

export interface PlanChartSeries {
  label: string;
  tSeconds: number[];
  microns: number[];
  /** "plan" lines are drawn dashed; "real" solid and thicker. */
  kind: "plan" | "real";
}

export interface PlanChartProps {
  series: PlanChartSeries[];
  targetMicrons: number;
  /** Words for screen readers (what the chart shows, in one sentence). */
  summary: string;
  className?: string;
}

const COLOURS_LIGHT = ["#0b6e69", "#a86d05", "#2563a8", "#8a3fb8", "#c2410c", "#1d7f4e", "#50616b"];
const COLOURS_DARK = ["#72cbbf", "#f7cd6b", "#8fb8ec", "#d2a3f0", "#fb8a5c", "#5fd39a", "#b3c2c0"];

function logTick(value: number | string): string {
  const v = Number(value);
  const mant = v / 10 ** Math.floor(Math.log10(v) + 1e-9);
  return [1, 2, 5].some((m) => Math.abs(mant - m) < 1e-6) ? v.toLocaleString("en-US") : "";
}

/** The datasets and options for the plans, the real curve and the target line. */
function chartConfig(series: PlanChartSeries[], targetMicrons: number) {
    const dark = document.documentElement.classList.contains("dark");
    const colours = dark ? COLOURS_DARK : COLOURS_LIGHT;
    const fg = dark ? "#e8f0ee" : "#14232b";
    const grid = dark ? "rgba(232,240,238,0.12)" : "rgba(20,35,43,0.10)";
    const maxMinutes = Math.max(1, ...series.map((s) => (s.tSeconds[s.tSeconds.length - 1] ?? 0) / 60));
    const data: ChartData<"line", { x: number; y: number }[]> = {
        datasets: [
          ...series.map((s, i) => ({
            label: s.label,
            data: s.tSeconds.map((t, k) => ({ x: t / 60, y: s.microns[k] })),
            borderColor: colours[i % colours.length],
            backgroundColor: colours[i % colours.length],
            borderWidth: s.kind === "real" ? 3 : 2,
            borderDash: s.kind === "plan" && i > 0 ? [6, 4] : [],
            pointRadius: 0,
            tension: 0,
          })),
          {
            label: `Target ${targetMicrons.toLocaleString("en-US")}`,
            data: [{ x: 0, y: targetMicrons }, { x: maxMinutes, y: targetMicrons }],
            borderColor: dark ? "#5fd39a" : "#1d7f4e",
            backgroundColor: dark ? "#5fd39a" : "#1d7f4e",
            borderWidth: 1.5,
            borderDash: [2, 3],
            pointRadius: 0,
          },
        ],
      };
    const options: ChartOptions<"line"> = {
        responsive: true,
        maintainAspectRatio: false,
        animation: false,
        parsing: false,
        interaction: { mode: "nearest", intersect: false },
        scales: {
          x: { type: "linear", min: 0, max: maxMinutes, title: { display: true, text: "minutes", color: fg }, ticks: { color: fg }, grid: { color: grid } },
          y: { type: "logarithmic", title: { display: true, text: "microns", color: fg }, ticks: { color: fg, callback: logTick, autoSkip: false }, grid: { color: grid } },
        },
        plugins: {
          legend: { position: "bottom", labels: { color: fg, boxWidth: 18, font: { family: "'IBM Plex Sans', system-ui, sans-serif" } } },
          tooltip: { callbacks: { label: (c) => `${c.dataset.label}: ${Math.round(c.parsed.y ?? 0).toLocaleString("en-US")} microns at ${durationWords((c.parsed.x ?? 0) * 60)}` } },
        },
    };
    return { data, options };
}

export default function PlanChart({ series, targetMicrons, summary, className = "" }: PlanChartProps) {
  const { data, options } = useMemo(() => chartConfig(series, targetMicrons), [series, targetMicrons]);
  return (
    <figure className={`relative h-72 sm:h-96 ${className}`}>
      <Line data={data} options={options} role="img" aria-label={summary} />
      <figcaption className="sr-only">{summary}</figcaption>
    </figure>
  );
}
