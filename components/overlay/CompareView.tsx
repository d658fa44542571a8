"use client";

/**
 * The overlay page's body: fetches /api/overlay for the ids in the URL, draws the curves aligned
 * at isolation (absolute microns on a log axis, or the rise above the start of the hold on a
 * linear axis), and sets their numbers side by side. The URL is the share: same ids, same view.
 */
import { useMemo, useState } from "react";
import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { Alert, Button, Card, Spinner } from "@/components/ui";
import { VerdictBadge } from "@/components/verdict/VerdictBadge";
import { durationWords, microns } from "@/components/curve/model";
import type { OverlayResult } from "@/lib/casebook/overlay";
import { LazySeriesChart } from "./LazySeriesChart";
import { SERIES_COLOURS } from "./colours";

async function fetchOverlay(ids: string[], signal: AbortSignal): Promise<OverlayResult> {
  const res = await fetch(`/api/overlay?tests=${ids.join(",")}`, { signal, headers: { accept: "application/json" } });
  const body = await res.json().catch(() => null);
  if (!res.ok) throw Object.assign(new Error(body?.error?.message ?? `Error ${res.status}`), { status: res.status });
  return body as OverlayResult;
}

function rate(v: number | null | undefined): string {
  return v == null || !Number.isFinite(v) ? "—" : `${v.toFixed(v < 10 ? 1 : 0)}`;
}

// The chart's code starts loading with this view, beside the page's own, not after the data.
if (typeof window !== "undefined") void import("./SeriesChart");

export function CompareView({ ids, initial = null }: { ids: string[]; initial?: OverlayResult | null }) {
  const [mode, setMode] = useState<"absolute" | "rise">("absolute");
  const q = useQuery({
    queryKey: ["overlay", ids.join(",")],
    queryFn: ({ signal }) => fetchOverlay(ids, signal),
    enabled: ids.length > 0,
    initialData: initial ?? undefined,
    staleTime: initial ? 30_000 : 0,
  });

  const series = useMemo(() => {
    if (!q.data) return [];
    return q.data.tests.map((t, i) => {
      if (mode === "absolute") return { label: `${i + 1}. ${t.title}`, t: t.aligned.t, p: t.aligned.p };
      // rise above the reading at isolation, hold part only (t ≥ 0)
      const tt: number[] = [];
      const pp: number[] = [];
      t.aligned.t.forEach((s, k) => {
        if (s >= 0) {
          tt.push(s);
          pp.push(t.aligned.p[k] - t.zeroMicrons);
        }
      });
      return { label: `${i + 1}. ${t.title}`, t: tt, p: pp };
    });
  }, [q.data, mode]);

  if (ids.length === 0)
    return (
      <Alert tone="info" title="Nothing to compare yet">
        Pick tests in the <Link className="underline" href="/casebook">casebook</Link> and choose “Compare”.
      </Alert>
    );
  if (q.isPending)
    return (
      <div className="flex items-center gap-3 py-10 text-fg-soft" role="status">
        <Spinner label="" /> Loading the curves…
      </div>
    );
  if (q.isError) {
    const status = (q.error as { status?: number }).status;
    return (
      <Alert tone="error" title={status === 404 ? "None of these tests is visible to you" : "The curves could not be loaded"} action={status === 404 ? undefined : <Button onClick={() => q.refetch()}>Retry</Button>}>
        {status === 404 ? "They may have been removed, or they are not shared with you." : (q.error as Error).message}
      </Alert>
    );
  }
  const data = q.data;
  return (
    <div className="space-y-5">
      {data.note && <Alert tone="warning" title="Some tests are left out">{data.note}</Alert>}
      <Card
        title={`${data.tests.length} curve${data.tests.length === 1 ? "" : "s"}, aligned at isolation`}
        actions={
          <div role="group" aria-label="Pressure shown as" className="flex rounded-xl border-2 border-surface-line p-0.5">
            {(["absolute", "rise"] as const).map((m) => (
              <button
                key={m}
                type="button"
                aria-pressed={mode === m}
                onClick={() => setMode(m)}
                className={`min-h-tap rounded-lg px-3 text-body font-medium ${mode === m ? "bg-tide-600 text-white dark:bg-tide-500 dark:text-tide-900" : "text-fg"}`}
              >
                {m === "absolute" ? "Microns" : "Rise"}
              </button>
            ))}
          </div>
        }
      >
        <LazySeriesChart
          series={series}
          markers={[{ atSeconds: 0, label: "Isolated", kind: "isolation" }]}
          yScale={mode === "absolute" ? "log" : "linear"}
          xTitle="minutes from isolation"
          yTitle={mode === "absolute" ? "microns" : "rise above the start of the hold, microns"}
          ariaLabel={`${data.tests.length} decay curves aligned at isolation, ${mode === "absolute" ? "in microns" : "as the rise above the start of the hold"}.`}
          testId="overlay-chart"
          heightClass="h-72 sm:h-96"
        />
        <ul className="mt-3 flex flex-wrap gap-x-4 gap-y-1 text-caption text-fg-soft" aria-label="Chart key">
          {data.tests.map((t, i) => (
            <li key={t.id} className="flex items-center gap-2">
              <span aria-hidden className="inline-block h-1 w-6 rounded" style={{ background: SERIES_COLOURS[i % SERIES_COLOURS.length][0] }} />
              {i + 1}. {t.title}
            </li>
          ))}
        </ul>
        <p className="mt-2 text-caption text-fg-soft">A test whose log starts in the hold has zero at its first reading.</p>
      </Card>
      <Card title="Side by side" flush>
        <div className="overflow-x-auto">
          <table className="w-full min-w-[40rem] text-left text-body" data-testid="overlay-table">
            <thead className="text-caption text-fg-soft">
              <tr>
                <th scope="col" className="px-4 py-2">Test</th>
                <th scope="col" className="px-2 py-2">Verdict</th>
                <th scope="col" className="px-2 py-2 text-right">Start µ</th>
                <th scope="col" className="px-2 py-2 text-right">End µ</th>
                <th scope="col" className="px-2 py-2 text-right">Rise µ</th>
                <th scope="col" className="px-2 py-2 text-right">Rate µ/min</th>
                <th scope="col" className="px-2 py-2 text-right">Plateau µ</th>
                <th scope="col" className="px-4 py-2 text-right">τ</th>
              </tr>
            </thead>
            <tbody>
              {data.tests.map((t, i) => (
                <tr key={t.id} className="border-t border-surface-line">
                  <th scope="row" className="px-4 py-2 font-medium">
                    <Link href={`/vacuum-tests/${t.id}`} className="underline-offset-2 hover:underline">{i + 1}. {t.title}</Link>
                    <span className="block text-caption font-normal text-fg-soft">{t.technicianName}</span>
                  </th>
                  <td className="px-2 py-2">{t.analysisHidden ? <span className="text-caption text-fg-soft">Make your call first</span> : <VerdictBadge verdict={t.verdict} meetsProfile={t.meetsProfile} />}</td>
                  <td className="px-2 py-2 text-right tabular-nums">{microns(t.decay?.startMicrons)}</td>
                  <td className="px-2 py-2 text-right tabular-nums">{microns(t.decay?.endMicrons)}</td>
                  <td className="px-2 py-2 text-right tabular-nums">{microns(t.decay?.riseMicrons)}</td>
                  <td className="px-2 py-2 text-right tabular-nums">{rate(t.decay?.leakRateMicronsPerMinute)}</td>
                  <td className="px-2 py-2 text-right tabular-nums">{microns(t.decay?.plateauMicrons)}</td>
                  <td className="px-4 py-2 text-right tabular-nums">{t.decay?.timeConstantSeconds != null ? durationWords(t.decay.timeConstantSeconds) : "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Card>
    </div>
  );
}
