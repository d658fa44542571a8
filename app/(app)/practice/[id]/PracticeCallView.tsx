"use client";

import { useMemo, useState } from "react";
import Link from "next/link";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { Alert, Button, Card, Spinner, Textarea } from "@/components/ui";
import { VerdictBanner } from "@/components/verdict/VerdictBanner";
import { LazySeriesChart } from "@/components/overlay/LazySeriesChart";
import { LazyDecayChart } from "@/components/curve/LazyDecayChart";
import type { PracticeTestView } from "@/lib/practice/view";
import { CALL_CHOICES, PRACTICE_CALL_WORDS, type CallChoice } from "@/lib/practice/words";
import { sendJson } from "../../casebook/send";

async function fetchPractice(id: string, signal: AbortSignal): Promise<PracticeTestView> {
  const res = await fetch(`/api/practice/tests/${id}`, { signal, headers: { accept: "application/json" } });
  const body = await res.json().catch(() => null);
  if (!res.ok) throw Object.assign(new Error(body?.error?.message ?? `Error ${res.status}`), { status: res.status });
  return body;
}

/** The curve alone; the apprentice calls it with a reason; then the analysis appears beside the call. */
export function PracticeCallView({ id, canCall }: { id: string; canCall: boolean }) {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ["practice", id], queryFn: ({ signal }) => fetchPractice(id, signal) });
  const [choice, setChoice] = useState<CallChoice | null>(null);
  const [reason, setReason] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const series = useMemo(() => (q.data ? [{ label: "Reading", t: q.data.series.t, p: q.data.series.p }] : []), [q.data]);

  if (q.isPending) return <div className="flex items-center gap-3 py-10 text-fg-soft" role="status"><Spinner label="" /> Loading…</div>;
  if (q.isError) return <Alert tone="error" title="Practice test not found">{(q.error as Error).message}</Alert>;
  const v = q.data;
  return (
    <div className="space-y-5">
      <header className="space-y-1">
        <p className="text-body text-fg-soft">Practice · <Link className="underline" href="/practice">all practice calls</Link></p>
        <h1 className="text-headline break-words">{v.test.title}</h1>
      </header>
      <Card title="The curve">
        {v.state === "revealed" && v.analysis ? (
          // After the call: the same curve with the analysis drawn on it (fit, isolation, the profile's limit).
          <div data-testid="practice-chart-revealed">
            <LazyDecayChart analysis={v.analysis} series={v.series} />
          </div>
        ) : (
          <LazySeriesChart series={series} xTitle="minutes from the first reading" ariaLabel="The readings of this test, without the analysis." testId="practice-chart" />
        )}
      </Card>
      {v.state === "awaiting_call" ? (
        canCall ? (
          <Card title="Your call">
            <form
              className="space-y-4"
              onSubmit={async (e) => {
                e.preventDefault();
                if (!choice) return setError("Choose what you think the curve shows.");
                setBusy(true);
                setError(null);
                try {
                  const revealed = await sendJson<PracticeTestView>("POST", `/api/practice/tests/${id}/call`, { call: choice, reason });
                  qc.setQueryData(["practice", id], revealed);
                } catch (err) {
                  setError((err as Error).message);
                } finally {
                  setBusy(false);
                }
              }}
            >
              <fieldset className="grid gap-2 sm:grid-cols-2">
                <legend className="mb-2 text-body font-medium">What does the hold show?</legend>
                {CALL_CHOICES.map((c) => (
                  <label key={c} className={`flex min-h-tap cursor-pointer items-center gap-3 rounded-xl border-2 px-3 ${choice === c ? "border-tide-600" : "border-surface-line"}`}>
                    <input type="radio" name="call" value={c} className="h-5 w-5 accent-tide-600" checked={choice === c} onChange={() => setChoice(c)} />
                    {PRACTICE_CALL_WORDS[c]}
                  </label>
                ))}
              </fieldset>
              <Textarea label="Why? (a few words)" value={reason} onChange={(e) => setReason(e.target.value)} rows={2} maxLength={1000} required minLength={3} />
              <Button type="submit" busy={busy} size="lg">Make my call</Button>
              {error && <Alert tone="error">{error}</Alert>}
            </form>
          </Card>
        ) : (
          <Alert tone="info">The analysis is shown once the apprentice has made their call.</Alert>
        )
      ) : (
        <div className="grid gap-5 lg:grid-cols-2">
          {v.call && (
            <Card title="Your call" data-testid="my-call">
              <p className="text-lead font-semibold">{PRACTICE_CALL_WORDS[v.call.call as CallChoice] ?? v.call.call}</p>
              <p className="text-body text-fg-soft">“{v.call.reason}”</p>
              <p className={`mt-2 text-body font-semibold ${v.call.matched ? "text-verdict-pass" : "text-verdict-leak dark:text-flare-300"}`} data-testid="call-match">
                {v.call.matched ? "✓ Your call matches the analysis." : "× Your call differs from the analysis — compare the curve with the reasons beside it."}
              </p>
            </Card>
          )}
          {v.analysis && (
            <div className="space-y-3" data-testid="practice-analysis">
              <VerdictBanner analysis={v.analysis} />
              <Link className="text-body underline" href={`/vacuum-tests/${v.test.id}`}>Open the full test</Link>
            </div>
          )}
        </div>
      )}
    </div>
  );
}
