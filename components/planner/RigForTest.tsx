"use client";

/**
 * Which rig a vacuum test was made with, and that rig's recent upkeep, for the test page:
 * when the target was not reached, the pump's oil and blank-off history is the first place to look.
 * Usage: <RigForTest testId={test.id} targetNotReached={hasFinding("target_not_reached")} />.
 * Talks to GET/PUT /api/rigs/by-test/[testId] and GET /api/rigs.
 */
import Link from "next/link";
import { useEffect, useState } from "react";
import { Alert, Button, Card, Select } from "@/components/ui";
import { apiFetch, ApiError } from "@/lib/client/api";

interface ByTest {
  rig: { id: string; name: string; truck: string | null; keeperName: string | null } | null;
  events?: { id: string; kind: string; occurredOn: string; lowestMicrons: number | null; oilReason: string | null }[];
  blankOffTrend?: { occurredOn: string; lowestMicrons: number }[];
  reminders?: { code: string; itemId: string; title: string; message: string; severity: string }[];
}

const EVENT_WORDS: Record<string, string> = {
  oil_changed: "Oil changed",
  blank_off: "Blank-off test",
  gauge_cleaned: "Gauge cleaned",
  gauge_checked: "Gauge checked",
  hose_gaskets_replaced: "Hose gaskets replaced",
  pump_hours: "Pump hours",
};

function fetchRigForTest(testId: string) {
  return Promise.all([apiFetch<ByTest>(`/api/rigs/by-test/${testId}`), apiFetch<{ rigs: { id: string; name: string }[] }>("/api/rigs")]);
}

export function RigForTest({ testId, targetNotReached = false }: { testId: string; targetNotReached?: boolean }) {
  const [data, setData] = useState<ByTest | null>(null);
  const [rigs, setRigs] = useState<{ id: string; name: string }[]>([]);
  const [choice, setChoice] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  function load(): Promise<void> {
    return fetchRigForTest(testId).then(
      ([byTest, list]) => {
        setData(byTest);
        setRigs(list.rigs);
      },
      (e) => setError(e instanceof ApiError ? e.message : String(e)),
    );
  }
  useEffect(() => {
    let live = true;
    fetchRigForTest(testId).then(
      ([byTest, list]) => {
        if (!live) return;
        setData(byTest);
        setRigs(list.rigs);
      },
      (e) => live && setError(e instanceof ApiError ? e.message : String(e)),
    );
    return () => {
      live = false;
    };
  }, [testId]);

  async function record() {
    setBusy(true);
    setError(null);
    try {
      await apiFetch(`/api/rigs/by-test/${testId}`, { method: "PUT", body: JSON.stringify({ rigId: choice }) });
      await load();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  }

  if (!data) return error ? <Alert tone="error">{error}</Alert> : null;
  return (
    <Card title="Rig used" data-testid="rig-for-test">
      {data.rig ? (
        <div className="space-y-2">
          <p className="text-body">
            <Link href={`/tools/rigs/${data.rig.id}`} className="font-medium text-tide-700 underline dark:text-tide-300">
              {data.rig.name}
            </Link>
            {data.rig.keeperName && <span className="text-fg-soft"> · kept by {data.rig.keeperName}</span>}
          </p>
          {targetNotReached && <p className="text-body">The target was not reached: check this rig’s pump oil and blank-off first.</p>}
          {data.reminders?.map((r) => (
            <Alert key={`${r.code}-${r.itemId}`} tone={r.severity === "warning" ? "warning" : "info"} title={r.title}>
              {r.message}
            </Alert>
          ))}
          {data.events && data.events.length > 0 && (
            <ul className="text-caption text-fg-soft">
              {data.events.slice(0, 5).map((e) => (
                <li key={e.id}>
                  {e.occurredOn} · {EVENT_WORDS[e.kind] ?? e.kind}
                  {e.lowestMicrons !== null && ` · ${Math.round(e.lowestMicrons)} microns`}
                </li>
              ))}
            </ul>
          )}
        </div>
      ) : (
        <p className="text-body text-fg-soft">No rig recorded for this test.</p>
      )}
      {rigs.length > 0 && (
        <div className="mt-3 flex flex-col gap-2 sm:flex-row sm:items-end">
          <Select label="Record the rig" value={choice} onChange={(e) => setChoice(e.target.value)} options={[{ value: "", label: "Choose a rig" }, ...rigs.map((r) => ({ value: r.id, label: r.name }))]} className="flex-1" />
          <Button variant="secondary" busy={busy} disabled={!choice} onClick={record}>
            Save
          </Button>
        </div>
      )}
      {error && <Alert tone="error" className="mt-2">{error}</Alert>}
    </Card>
  );
}
