"use client";

import { useMemo, useState } from "react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { Alert, Button, Card, Input, Textarea } from "@/components/ui";
import { VerdictBadge } from "@/components/verdict/VerdictBadge";
import { durationWords, microns } from "@/components/curve/model";
import { LazySeriesChart } from "@/components/overlay/LazySeriesChart";
import type { ChartMarker } from "@/components/overlay/SeriesChart";
import type { CasebookEntryDto } from "@/lib/casebook/dto";
import { sendJson } from "../send";

/** One casebook curve: title, the trainer's notes, the chart with its pins, and (for trainers) editing. */
export function EntryCard({ index, entry, curate, collectionId, picked, onTogglePick }: { index: number; entry: CasebookEntryDto; curate: boolean; collectionId: string; picked: boolean; onTogglePick: () => void }) {
  const router = useRouter();
  const [pinAt, setPinAt] = useState<number | null>(null);
  const [pinText, setPinText] = useState("");
  const [notes, setNotes] = useState(entry.notes ?? "");
  const [editing, setEditing] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const base = `/api/casebook/${collectionId}/entries/${entry.id}`;

  const markers = useMemo<ChartMarker[]>(() => {
    const m: ChartMarker[] = entry.pins.map((p) => ({ atSeconds: p.atSeconds, label: p.text, kind: "pin" }));
    if (entry.isolationAt != null) m.push({ atSeconds: entry.isolationAt, label: "Isolated", kind: "isolation" });
    if (pinAt != null) m.push({ atSeconds: pinAt, label: "New pin", kind: "isolation" });
    return m;
  }, [entry.pins, entry.isolationAt, pinAt]);
  const series = useMemo(() => [{ label: entry.title, t: entry.series.t, p: entry.series.p }], [entry.series, entry.title]);

  const run = async (fn: () => Promise<unknown>) => {
    setBusy(true);
    setError(null);
    try {
      await fn();
      router.refresh();
      return true;
    } catch (err) {
      setError((err as Error).message);
      return false;
    } finally {
      setBusy(false);
    }
  };

  const d = entry.details;
  return (
    <Card
      title={`${index}. ${entry.title}`}
      headingLevel={2}
      data-testid="casebook-entry"
      actions={
        <label className="flex min-h-tap cursor-pointer items-center gap-2 text-body">
          <input type="checkbox" className="h-5 w-5 accent-tide-600" checked={picked} onChange={onTogglePick} />
          Compare
        </label>
      }
    >
      <div className="space-y-3">
        <p className="flex flex-wrap items-center gap-2 text-caption text-fg-soft">
          {entry.analysisHidden ? <span>Make your practice call first</span> : <VerdictBadge verdict={entry.verdict} meetsProfile={entry.meetsProfile} />}
          <span>{new Date(entry.testedAt).toLocaleDateString("en-US", { dateStyle: "medium" })} · {entry.technicianName}{entry.refrigerant ? ` · ${entry.refrigerant}` : ""}</span>
          {entry.canOpenTest && <Link className="underline" href={`/vacuum-tests/${entry.testId}`}>Open the test</Link>}
        </p>
        {d && (
          <p className="text-caption text-fg-soft" data-testid="entry-details">
            From {[d.customerName, d.siteName, d.systemName, d.jobReference].filter(Boolean).join(" · ") || d.testTitle} (shown to owners and leads only)
          </p>
        )}
        {editing ? (
          <form
            className="space-y-2"
            onSubmit={async (e) => {
              e.preventDefault();
              if (await run(() => sendJson("PATCH", base, { notes }))) setEditing(false);
            }}
          >
            <Textarea label="Notes" value={notes} onChange={(e) => setNotes(e.target.value)} rows={3} maxLength={4000} />
            <div className="flex gap-2">
              <Button type="submit" busy={busy}>Save notes</Button>
              <Button variant="quiet" onClick={() => setEditing(false)}>Cancel</Button>
            </div>
          </form>
        ) : (
          entry.notes && <p className="whitespace-pre-line text-body">{entry.notes}</p>
        )}
        <LazySeriesChart
          series={series}
          markers={markers}
          xTitle="minutes from the first reading"
          ariaLabel={`Curve of ${entry.title}, with ${entry.pins.length} pinned note${entry.pins.length === 1 ? "" : "s"}.`}
          onPickSeconds={curate ? setPinAt : undefined}
          testId="entry-chart"
        />
        {entry.pins.length > 0 && (
          <ol className="space-y-1 text-body" aria-label="Pinned notes">
            {entry.pins.map((p, i) => (
              <li key={p.id} className="flex items-start gap-2">
                <span aria-hidden className="mt-0.5 inline-flex h-6 w-6 shrink-0 items-center justify-center rounded-full bg-flare-500 text-caption font-semibold text-ink">{i + 1}</span>
                <span className="flex-1">
                  <span className="font-medium">{p.text}</span> <span className="text-caption text-fg-soft">at {durationWords(p.atSeconds)}</span>
                </span>
                {curate && (
                  <Button variant="quiet" aria-label={`Remove pin “${p.text}”`} onClick={() => run(() => sendJson("DELETE", `${base}/pins/${p.id}`))}>
                    Remove
                  </Button>
                )}
              </li>
            ))}
          </ol>
        )}
        {!entry.analysisHidden && (entry.holdSentence || entry.profileSentence) && (
          <p className="text-caption text-fg-soft" data-testid="entry-story">
            {entry.holdSentence}
            {entry.decay && entry.decay.leakRateMicronsPerMinute > 0 ? ` Climbing ${entry.decay.leakRateMicronsPerMinute.toFixed(1)} microns/min.` : ""}
            {entry.decay?.plateauMicrons != null ? ` Levelling near ${microns(entry.decay.plateauMicrons)} microns.` : ""} {entry.profileSentence}
          </p>
        )}
        {curate && (
          <div className="space-y-2 border-t border-surface-line pt-3">
            <form
              className="grid gap-2 sm:grid-cols-[9rem_1fr_auto] sm:items-end"
              onSubmit={async (e) => {
                e.preventDefault();
                if (pinAt == null) return setError("Tap the chart where the note belongs, or type the minute.");
                if (await run(() => sendJson("POST", `${base}/pins`, { atSeconds: pinAt, text: pinText }))) {
                  setPinText("");
                  setPinAt(null);
                }
              }}
            >
              <Input
                label="Pin at minute"
                inputMode="decimal"
                value={pinAt == null ? "" : String(Math.round((pinAt / 60) * 10) / 10)}
                onChange={(e) => {
                  const v = Number(e.target.value.replace(",", "."));
                  setPinAt(e.target.value.trim() === "" || !Number.isFinite(v) ? null : Math.max(0, Math.round(v * 60)));
                }}
                hint="or tap the chart"
              />
              <Input label="Note to pin" value={pinText} onChange={(e) => setPinText(e.target.value)} maxLength={280} required />
              <Button type="submit" busy={busy}>Pin note</Button>
            </form>
            <div className="flex flex-wrap gap-2">
              {!editing && <Button variant="secondary" onClick={() => setEditing(true)}>Edit notes</Button>}
              <Button variant="quiet" onClick={() => run(() => sendJson("DELETE", base))}>Remove from collection</Button>
            </div>
          </div>
        )}
        {error && <Alert tone="error">{error}</Alert>}
      </div>
    </Card>
  );
}
