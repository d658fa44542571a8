"use client";

/**
 * The evacuation and decay curve: microns on a log axis against minutes from the first row,
 * with the pull-down and the hold shaded, the isolation marker, the fitted hold model, the
 * forecast band, and the profile's limit and target lines. Loaded with next/dynamic only.
 * react-chartjs-2 owns the chart's life (create, update, destroy); the drawing on top of it is
 * our plugin, which gets what it draws as its options (`options.plugins.riselinePhases`).
 */
import { useEffect, useMemo, useRef, useState, type MouseEvent } from "react";
import {
  Chart,
  Filler,
  LinearScale,
  LineController,
  LineElement,
  LogarithmicScale,
  PointElement,
  Tooltip,
  type ChartData,
  type ChartOptions,
  type ChartType,
  type Plugin,
} from "chart.js";
import { getRelativePosition } from "chart.js/helpers";
import { Line } from "react-chartjs-2";
import type { AnalysisResult } from "@/analysis/decay/types";
import { buildCurve, curveSummary, durationWords, microns, type CurveModel } from "./model";
import { CurveLegend } from "./CurveLegend";

Chart.register(LineController, LineElement, PointElement, LinearScale, LogarithmicScale, Filler, Tooltip);

export interface DecayChartProps {
  analysis: AnalysisResult;
  series: { t: number[]; p: number[] };
  /** Called with seconds from the first row when the user taps the chart (re-analysis). */
  onPickSeconds?: (seconds: number) => void;
  /** A chosen (not yet analysed) isolation point, seconds from the first row. */
  pickedSeconds?: number | null;
  /** What the picked line is called on the chart: what the tap was for (default "New isolation"). */
  pickLabel?: string;
  /** Points people refer to (comments at a time on the curve), seconds from the first row. */
  markers?: { seconds: number; label: string }[];
  /** A marker to emphasise (e.g. the comment just tapped). */
  highlightSeconds?: number | null;
  className?: string;
}

interface Palette {
  fg: string;
  soft: string;
  grid: string;
  measured: string;
  fit: string;
  band: string;
  bandLine: string;
  pulldown: string;
  hold: string;
  limit: string;
  target: string;
  pick: string;
}

function palette(): Palette {
  const dark = document.documentElement.classList.contains("dark");
  const css = getComputedStyle(document.documentElement);
  return {
    fg: css.getPropertyValue("--rl-fg").trim() || (dark ? "#e8f0ee" : "#14232b"),
    soft: css.getPropertyValue("--rl-fg-soft").trim() || (dark ? "#b3c2c0" : "#46565f"),
    grid: dark ? "rgba(232,240,238,0.12)" : "rgba(20,35,43,0.10)",
    measured: dark ? "#72cbbf" : "#0b6e69",
    fit: dark ? "#ffffff" : "#14232b",
    band: dark ? "rgba(247,205,107,0.20)" : "rgba(232,163,23,0.20)",
    bandLine: dark ? "rgba(247,205,107,0.7)" : "rgba(168,109,5,0.6)",
    pulldown: dark ? "rgba(114,203,191,0.10)" : "rgba(11,110,105,0.07)",
    hold: dark ? "rgba(99,150,220,0.16)" : "rgba(37,99,168,0.08)",
    limit: dark ? "#fb8a5c" : "#c2410c",
    target: dark ? "#5fd39a" : "#1d7f4e",
    pick: "#e8a317",
  };
}

type Marks = { markers: { seconds: number; label: string }[]; highlight: number | null };

/** A small flag at the top of the plot for each comment's time (numbered like the thread). */
function drawMarkers(chart: Chart, marks: Marks, colors: Palette) {
  const { ctx, chartArea, scales } = chart;
  marks.markers.forEach((m, i) => {
    const x = scales.x.getPixelForValue(m.seconds / 60);
    if (x < chartArea.left || x > chartArea.right) return;
    const on = marks.highlight != null && Math.abs(marks.highlight - m.seconds) < 0.5;
    ctx.save();
    ctx.strokeStyle = colors.pick;
    ctx.globalAlpha = on ? 1 : 0.6;
    ctx.lineWidth = on ? 2.5 : 1.5;
    ctx.setLineDash([2, 3]);
    ctx.beginPath();
    ctx.moveTo(x, chartArea.top + 18);
    ctx.lineTo(x, chartArea.bottom);
    ctx.stroke();
    ctx.setLineDash([]);
    ctx.fillStyle = colors.pick;
    ctx.beginPath();
    ctx.arc(x, chartArea.top + 10, on ? 9 : 8, 0, Math.PI * 2);
    ctx.fill();
    ctx.fillStyle = "#ffffff";
    ctx.font = "600 11px 'IBM Plex Sans', system-ui, sans-serif";
    const label = String(i + 1);
    ctx.fillText(label, x - ctx.measureText(label).width / 2, chartArea.top + 14);
    ctx.restore();
  });
}

/** A labelled vertical line at a time, in minutes. */
function drawVline(chart: Chart, colors: Palette, xMinutes: number, color: string, label: string, dash: number[]) {
  const { ctx, chartArea, scales } = chart;
  const x = scales.x.getPixelForValue(xMinutes);
  if (x < chartArea.left || x > chartArea.right) return;
  ctx.save();
  ctx.strokeStyle = color;
  ctx.lineWidth = 2;
  ctx.setLineDash(dash);
  ctx.beginPath();
  ctx.moveTo(x, chartArea.top);
  ctx.lineTo(x, chartArea.bottom);
  ctx.stroke();
  ctx.setLineDash([]);
  ctx.fillStyle = color;
  ctx.font = "600 12px 'IBM Plex Sans', system-ui, sans-serif";
  const w = ctx.measureText(label).width;
  const tx = x + 4 + w > chartArea.right ? x - 4 - w : x + 4;
  ctx.fillText(label, tx, chartArea.top + 14);
  ctx.restore();
}

/** What the phases plugin draws: passed as its options, so a change is an ordinary chart update. */
interface PhasesOptions {
  model: CurveModel;
  colors: Palette;
  picked: number | null;
  pickLabel: string;
  marks: Marks;
}

declare module "chart.js" {
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface PluginOptionsByType<TType extends ChartType> {
    riselinePhases?: PhasesOptions | false;
  }
}

/** Phase bands, limit and target labels, the isolation and picked lines, and the comment flags. */
const phasesPlugin: Plugin<"line", PhasesOptions> = {
  id: "riselinePhases",
  beforeDatasetsDraw(chart, _args, opts) {
    if (!opts?.model) return;
    const { model, colors } = opts;
    const { ctx, chartArea, scales } = chart;
    const band = (range: [number, number] | null, color: string, label: string) => {
      if (!range) return;
      const x0 = Math.max(chartArea.left, scales.x.getPixelForValue(range[0]));
      const x1 = Math.min(chartArea.right, scales.x.getPixelForValue(range[1]));
      if (x1 <= x0) return;
      ctx.save();
      ctx.fillStyle = color;
      ctx.fillRect(x0, chartArea.top, x1 - x0, chartArea.bottom - chartArea.top);
      ctx.fillStyle = colors.soft;
      ctx.font = "500 12px 'IBM Plex Sans', system-ui, sans-serif";
      if (x1 - x0 > ctx.measureText(label).width + 8) ctx.fillText(label, x0 + 4, chartArea.bottom - 6);
      ctx.restore();
    };
    band(model.pulldown, colors.pulldown, "Pull-down");
    for (const other of model.otherHolds) band(other.range, colors.pulldown, other.earlier ? "Earlier hold" : "Later hold");
    band(model.hold, colors.hold, "Hold");
  },
  afterDatasetsDraw(chart, _args, opts) {
    if (!opts?.model) return;
    const { model, colors, picked, pickLabel, marks } = opts;
    const vline = (xMinutes: number, color: string, label: string, dash: number[]) => drawVline(chart, colors, xMinutes, color, label, dash);
    const { ctx, chartArea, scales } = chart;
    const hline = (micronsValue: number, color: string, label: string) => {
      const y = scales.y.getPixelForValue(micronsValue);
      if (y < chartArea.top || y > chartArea.bottom) return;
      ctx.save();
      ctx.fillStyle = color;
      ctx.font = "600 12px 'IBM Plex Sans', system-ui, sans-serif";
      const w = ctx.measureText(label).width;
      ctx.fillText(label, chartArea.right - w - 4, y - 4);
      ctx.restore();
    };
    hline(model.limitMicrons, colors.limit, `Limit ${microns(model.limitMicrons)}`);
    hline(model.targetMicrons, colors.target, `Target ${microns(model.targetMicrons)}`);
    if (model.isolationMinutes != null) vline(model.isolationMinutes, colors.soft, "Isolated", [6, 4]);
    if (picked != null) vline(picked / 60, colors.pick, pickLabel, []);
    drawMarkers(chart, marks, colors);
  },
};

/** 1, 2, 5 × 10^k ticks with thousands separators; other log ticks are hidden. */
function logTick(value: number | string): string {
  const v = Number(value);
  const mant = v / 10 ** Math.floor(Math.log10(v) + 1e-9);
  return [1, 2, 5].some((m) => Math.abs(mant - m) < 1e-6) ? v.toLocaleString("en-US") : "";
}

type Points = { x: number; y: number }[];

/**
 * The chart's datasets and options for one curve, palette and scale (`_themeTick` only makes a
 * theme change build them again with the new palette).
 */
function chartConfig(model: CurveModel, _themeTick: number, logScale: boolean) {
  const colors = palette();
  const line = (data: Points, extra: Record<string, unknown>) => ({
    data,
    pointRadius: 0,
    pointHitRadius: 0,
    borderWidth: 2,
    tension: 0,
    ...extra,
  });
  const xMin = 0;
  const xMax = model.xMaxMinutes;
  const data: ChartData<"line", Points> = {
    datasets: [
      line(model.band.high, { label: "Forecast high", borderColor: colors.bandLine, borderWidth: 1, borderDash: [3, 3], fill: "+1", backgroundColor: colors.band }),
      line(model.band.low, { label: "Forecast low", borderColor: colors.bandLine, borderWidth: 1, borderDash: [3, 3], fill: false }),
      line([{ x: xMin, y: model.limitMicrons }, { x: xMax, y: model.limitMicrons }], { label: "Limit", borderColor: colors.limit, borderDash: [8, 5], borderWidth: 2 }),
      line([{ x: xMin, y: model.targetMicrons }, { x: xMax, y: model.targetMicrons }], { label: "Target", borderColor: colors.target, borderDash: [2, 4], borderWidth: 2 }),
      line(model.measured, { label: "Reading", borderColor: colors.measured, borderWidth: 2.5, pointHitRadius: 6 }),
      line(model.fitted, { label: "Fitted hold", borderColor: colors.fit, borderWidth: 2 }),
    ],
  };
  const options: ChartOptions<"line"> = {
    animation: false,
    responsive: true,
    maintainAspectRatio: false,
    parsing: false,
    normalized: true,
    interaction: { mode: "nearest", axis: "x", intersect: false },
    layout: { padding: { right: 4 } },
    scales: {
      x: {
        type: "linear",
        min: xMin,
        max: xMax,
        title: { display: true, text: "minutes from the first reading", color: colors.soft, font: { size: 12 } },
        ticks: { color: colors.soft, font: { size: 12 }, maxTicksLimit: 7 },
        grid: { color: colors.grid },
      },
      y: {
        type: logScale ? "logarithmic" : "linear",
        min: logScale ? model.yMinMicrons : 0,
        max: logScale ? model.yMaxMicrons : undefined,
        suggestedMax: logScale ? undefined : model.limitMicrons * 1.1,
        title: { display: true, text: "microns", color: colors.soft, font: { size: 12 } },
        ticks: { color: colors.soft, font: { size: 12 }, callback: logScale ? logTick : (v) => Number(v).toLocaleString("en-US"), autoSkip: !logScale },
        grid: { color: colors.grid },
      },
    },
    plugins: {
      tooltip: {
        filter: (item) => item.dataset.label === "Reading" || item.dataset.label === "Fitted hold",
        callbacks: {
          title: (items) => (items[0] ? `${durationWords(items[0].parsed.x! * 60)} from start` : ""),
          label: (item) => `${item.dataset.label}: ${microns(item.parsed.y)} microns`,
        },
      },
    },
  };
  return { colors, data, options };
}

const PLUGINS = [phasesPlugin];
const NO_MARKERS: { seconds: number; label: string }[] = [];

export default function DecayChart({ analysis, series, onPickSeconds, pickedSeconds = null, pickLabel = "New isolation", markers = NO_MARKERS, highlightSeconds = null, className = "" }: DecayChartProps) {
  const chartRef = useRef<Chart<"line"> | null>(null);
  const [themeTick, setThemeTick] = useState(0);
  const [logScale, setLogScale] = useState(true);
  const model = useMemo(() => buildCurve(analysis, series), [analysis, series]);
  const summary = useMemo(() => curveSummary(analysis, series), [analysis, series]);

  useEffect(() => {
    const obs = new MutationObserver(() => setThemeTick((n) => n + 1));
    obs.observe(document.documentElement, { attributes: true, attributeFilter: ["class"] });
    return () => obs.disconnect();
  }, []);

  const base = useMemo(() => chartConfig(model, themeTick, logScale), [model, themeTick, logScale]);
  const options = useMemo<ChartOptions<"line">>(
    () => ({
      ...base.options,
      plugins: { ...base.options.plugins, riselinePhases: { model, colors: base.colors, picked: pickedSeconds, pickLabel, marks: { markers, highlight: highlightSeconds } } },
    }),
    [base, model, pickedSeconds, pickLabel, markers, highlightSeconds],
  );

  /** A tap on the plot: the time under it, in seconds from the first row, within the log. */
  const onClick = (event: MouseEvent<HTMLCanvasElement>) => {
    const chart = chartRef.current;
    if (!onPickSeconds || !chart) return;
    const { x } = getRelativePosition(event.nativeEvent, chart as unknown as Chart);
    const minutes = chart.scales.x.getValueForPixel(x);
    if (minutes == null || !Number.isFinite(minutes)) return;
    const lastSeconds = series.t.length ? series.t[series.t.length - 1] : 0;
    onPickSeconds(Math.round(Math.min(Math.max(0, minutes * 60), lastSeconds)));
  };

  return (
    <figure data-testid="decay-chart" className={`rounded-card border border-surface-line bg-surface-raised p-2 shadow-card sm:p-4 ${className}`}>
      <div className="mb-1 flex justify-end">
        <div role="group" aria-label="Pressure scale" className="inline-flex rounded-lg bg-surface-sunken p-0.5 text-caption font-semibold">
          {([
            [true, "Log scale"],
            [false, "Linear"],
          ] as const).map(([isLog, label]) => (
            <button
              key={label}
              type="button"
              aria-pressed={logScale === isLog}
              onClick={() => setLogScale(isLog)}
              className={`min-h-tap rounded-md px-3 ${logScale === isLog ? "bg-surface-raised text-fg shadow-card" : "text-fg-soft"}`}
            >
              {label}
            </button>
          ))}
        </div>
      </div>
      <div className="relative h-72 w-full sm:h-96">
        <Line ref={chartRef} data={base.data} options={options} plugins={PLUGINS} onClick={onClick} role="img" aria-label={`Decay curve. ${summary}`} className={onPickSeconds ? "cursor-crosshair" : undefined} />
      </div>
      <CurveLegend hasFit={model.fitted.length > 0} hasBand={model.band.mid.length > 0} hasIsolation={model.isolationMinutes != null} />
      <figcaption className="sr-only" data-testid="chart-summary">
        {summary}
        {markers.length > 0 && ` Comments at: ${markers.map((m, i) => `${i + 1}) minute ${(m.seconds / 60).toFixed(1)}`).join(", ")}.`}
      </figcaption>
    </figure>
  );
}
