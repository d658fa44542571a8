"use client";

/**
 * Curves on one chart for the trainer's bench: one or more series (minutes on x, microns on y,
 * log or linear), optional vertical markers (isolation at zero, pins with their notes), and a
 * tap that reports the time (for pinning). Loaded with next/dynamic only (LazySeriesChart).
 * react-chartjs-2 owns the chart's life; the markers are our plugin, given them as its options.
 */
import { useMemo, useRef, type MouseEvent } from "react";
import { Chart, LinearScale, LineController, LineElement, LogarithmicScale, PointElement, Tooltip, type ChartData, type ChartOptions, type ChartType, type Plugin } from "chart.js";
import { getRelativePosition } from "chart.js/helpers";
import { Line } from "react-chartjs-2";
import { labelRows } from "@/components/curve/label-rows";
import { logTickLabel, logTicks125, roundLinearTicks } from "@/components/curve/log-ticks";
import { decimateMinMax, durationWords, microns } from "@/components/curve/model";
import { SERIES_COLOURS, SERIES_DASHES } from "./colours";

Chart.register(LineController, LineElement, PointElement, LinearScale, LogarithmicScale, Tooltip);

export interface ChartSeries {
  label: string;
  /** Seconds (from the first reading, or from isolation when aligned). */
  t: number[];
  p: number[];
}

export interface ChartMarker {
  atSeconds: number;
  label: string;
  kind: "isolation" | "pin";
}

export interface SeriesChartProps {
  series: ChartSeries[];
  markers?: ChartMarker[];
  yScale?: "log" | "linear";
  xTitle: string;
  yTitle?: string;
  onPickSeconds?: (seconds: number) => void;
  ariaLabel: string;
  testId?: string;
  heightClass?: string;
}

/** The axes' tick values written on the canvas element (data-x-ticks, data-y-ticks), for people's tools and the journeys. */
const TICKS_ON_CANVAS: Plugin<"line"> = {
  id: "riselineTicksOnCanvas",
  afterUpdate(chart) {
    chart.canvas.dataset.xTicks = chart.scales.x.ticks.map((t) => t.value).join(",");
    chart.canvas.dataset.yTicks = chart.scales.y.ticks.map((t) => t.value).join(",");
  },
};

interface MarkersOptions {
  markers: ChartMarker[];
  soft: string;
  pinColour: string;
}

declare module "chart.js" {
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface PluginOptionsByType<TType extends ChartType> {
    riselineMarkers?: MarkersOptions | false;
  }
}

/** Vertical lines at the isolation and at each pin (numbered), drawn over the curves. */
const markersPlugin: Plugin<"line", MarkersOptions> = {
    id: "riselineMarkers",
    afterDatasetsDraw(chart, _args, opts) {
      if (!opts?.markers) return;
      const { markers, soft, pinColour } = opts;
      const { ctx, chartArea, scales } = chart;
      ctx.save();
      ctx.font = "600 12px 'IBM Plex Sans', system-ui, sans-serif";
      // Where each label goes: a pin's numbered disc centred on its line, another label beside its
      // line; then rows so that no two labels overlap (labelRows).
      const placed = markers.map((m, i) => {
        const x = scales.x.getPixelForValue(m.atSeconds / 60);
        const label = m.kind === "pin" ? `${i + 1}` : m.label;
        const w = ctx.measureText(label).width;
        const textX = m.kind === "pin" ? x - w / 2 : x + 4 + w > chartArea.right ? x - 4 - w : x + 4;
        const span = m.kind === "pin" ? { x0: x - 10, x1: x + 10 } : { x0: textX, x1: textX + w };
        return { m, x, label, w, textX, span, inside: x >= chartArea.left && x <= chartArea.right };
      });
      const shown = placed.filter((p) => p.inside);
      const rows = labelRows(shown.map((p) => p.span));
      shown.forEach((p, k) => {
        const { m, x, label, w, textX } = p;
        const colour = m.kind === "pin" ? pinColour : soft;
        ctx.strokeStyle = colour;
        ctx.lineWidth = 2;
        ctx.setLineDash(m.kind === "pin" ? [] : [6, 4]);
        ctx.beginPath();
        ctx.moveTo(x, chartArea.top);
        ctx.lineTo(x, chartArea.bottom);
        ctx.stroke();
        ctx.setLineDash([]);
        const y = chartArea.top + 14 + 20 * rows[k];
        if (m.kind === "pin") {
          ctx.fillStyle = colour;
          ctx.beginPath();
          ctx.arc(x, y - 4, 9, 0, Math.PI * 2);
          ctx.fill();
          ctx.fillStyle = "#14232b";
          ctx.fillText(label, x - w / 2, y);
        } else {
          ctx.fillStyle = colour;
          ctx.fillText(label, textX, y);
        }
      });
      ctx.restore();
    },
};
const PLUGINS = [markersPlugin, TICKS_ON_CANVAS];
const NO_MARKERS: ChartMarker[] = [];

/** The datasets (decimated for the axis) and options of one set of curves. */
function chartConfig(series: ChartSeries[], markers: ChartMarker[], yScale: "log" | "linear", xTitle: string, yTitle: string) {
  const dark = document.documentElement.classList.contains("dark");
  const css = getComputedStyle(document.documentElement);
  const soft = css.getPropertyValue("--rl-fg-soft").trim() || "#46565f";
  const grid = dark ? "rgba(232,240,238,0.12)" : "rgba(20,35,43,0.10)";
  const floor = yScale === "log" ? 1 : -Infinity;
  const points = (s: ChartSeries) => {
    if (yScale === "log") return decimateMinMax(s.t, s.p, 500); // floors at 1 micron for the log axis
    const stride = Math.max(1, Math.ceil(s.t.length / 1000));
    return s.t.filter((_, k) => k % stride === 0).map((t, k) => ({ x: t / 60, y: s.p[k * stride] }));
  };
  const datasets = series.map((s, i) => ({
    label: s.label,
    data: points(s),
    borderColor: SERIES_COLOURS[i % SERIES_COLOURS.length][dark ? 1 : 0],
    borderDash: SERIES_DASHES[i % SERIES_DASHES.length],
    borderWidth: 2.25,
    pointRadius: 0,
    pointHitRadius: 6,
    tension: 0,
  }));
  const xs = datasets.flatMap((d) => d.data.map((v) => v.x));
  const ys = datasets.flatMap((d) => d.data.map((v) => v.y)).filter((y) => y > floor);
  const data: ChartData<"line", { x: number; y: number }[]> = { datasets };
  const options: ChartOptions<"line"> = {
      animation: false,
      responsive: true,
      maintainAspectRatio: false,
      parsing: false,
      interaction: { mode: "nearest", axis: "x", intersect: false },
      scales: {
        x: {
          type: "linear",
          min: xs.length ? Math.min(...xs) : 0,
          max: xs.length ? Math.max(...xs) : 1,
          title: { display: true, text: xTitle, color: soft, font: { size: 12 } },
          ticks: { color: soft, font: { size: 12 }, maxTicksLimit: 7 },
          afterBuildTicks: (axis) => {
            axis.ticks = roundLinearTicks(axis.min, axis.max).map((value) => ({ value }));
          },
          grid: { color: grid },
        },
        y:
          yScale === "log"
            ? { type: "logarithmic", min: ys.length ? Math.max(1, Math.min(...ys) * 0.7) : 1, max: ys.length ? Math.max(...ys) * 1.4 : 1000, title: { display: true, text: yTitle, color: soft }, ticks: { color: soft, callback: logTickLabel, autoSkip: false }, afterBuildTicks: (axis) => { axis.ticks = logTicks125(axis.min, axis.max).map((value) => ({ value })); }, grid: { color: grid } }
            : { type: "linear", title: { display: true, text: yTitle, color: soft }, ticks: { color: soft }, grid: { color: grid } },
      },
      plugins: {
        riselineMarkers: { markers, soft, pinColour: dark ? "#f7cd6b" : "#e8a317" },
        tooltip: {
          callbacks: {
            title: (items) => (items[0] ? durationWords(items[0].parsed.x! * 60) : ""),
            label: (item) => `${item.dataset.label}: ${microns(item.parsed.y)} microns`,
          },
        },
      },
    };
  return { data, options };
}

export default function SeriesChart({ series, markers = NO_MARKERS, yScale = "log", xTitle, yTitle = "microns", onPickSeconds, ariaLabel, testId = "series-chart", heightClass = "h-64 sm:h-80" }: SeriesChartProps) {
  const chartRef = useRef<Chart<"line"> | null>(null);
  const { data, options } = useMemo(() => chartConfig(series, markers, yScale, xTitle, yTitle), [series, markers, yScale, xTitle, yTitle]);

  /** A tap on the plot: the time under it, in seconds. */
  const onClick = (event: MouseEvent<HTMLCanvasElement>) => {
    const chart = chartRef.current;
    if (!onPickSeconds || !chart) return;
    const minutes = chart.scales.x.getValueForPixel(getRelativePosition(event.nativeEvent, chart as unknown as Chart).x);
    if (minutes != null && Number.isFinite(minutes)) onPickSeconds(Math.max(0, Math.round(minutes * 60)));
  };

  return (
    <div className={`relative w-full ${heightClass}`} data-testid={testId}>
      <Line ref={chartRef} data={data} options={options} plugins={PLUGINS} onClick={onClick} role="img" aria-label={ariaLabel} className={onPickSeconds ? "cursor-crosshair" : undefined} />
    </div>
  );
}
