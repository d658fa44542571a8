"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import type { Reminder } from "@/lib/rigs/reminders";
import { Alert, Badge, Card } from "@/components/ui";
import { AddItemForm } from "./AddItemForm";
import { LogEventForm } from "./LogEventForm";

export interface RigItem {
  id: string;
  kind: "pump" | "gauge" | "hose" | "core_tool";
  label: string;
  freeAirCfm: number | null;
  blankOffRatingMicrons: number | null;
  oilEveryHours: number | null;
  oilEveryDays: number | null;
  checkEveryDays: number | null;
  insideDiameterIn: number | null;
  lengthFt: number | null;
}

export interface RigEvent {
  id: string;
  itemId: string | null;
  kind: string;
  occurredOn: string;
  oilReason: string | null;
  lowestMicrons: number | null;
  pumpHours: number | null;
  referenceMicrons: number | null;
  gaugeMicrons: number | null;
  note: string | null;
}

export interface RigDetailData {
  rig: { id: string; name: string; truck: string | null; keeperName: string | null; notes: string | null };
  canManage: boolean;
  items: RigItem[];
  events: RigEvent[];
  blankOffTrend: { occurredOn: string; itemId: string | null; lowestMicrons: number }[];
  reminders: Reminder[];
}

export const KIND_WORDS: Record<RigItem["kind"], string> = { pump: "Vacuum pump", gauge: "Micron gauge", hose: "Hose", core_tool: "Core-removal tool" };
export const EVENT_WORDS: Record<string, string> = {
  oil_changed: "Oil changed",
  blank_off: "Blank-off test",
  gauge_cleaned: "Gauge sensor cleaned",
  gauge_checked: "Gauge checked against a reference",
  hose_gaskets_replaced: "Hose gaskets replaced",
  pump_hours: "Pump hours read",
};
export const OIL_REASON_WORDS: Record<string, string> = { routine: "routine", after_burnout: "after a burnout job", cloudy_oil: "oil cloudy or yellow" };

function itemFacts(i: RigItem): string {
  if (i.kind === "pump")
    return [i.freeAirCfm && `${i.freeAirCfm} CFM`, i.blankOffRatingMicrons && `blank-off rated ${i.blankOffRatingMicrons} microns`, i.oilEveryDays && `oil every ${i.oilEveryDays} days`, i.oilEveryHours && `or ${i.oilEveryHours} h`]
      .filter(Boolean)
      .join(" · ");
  if (i.kind === "hose") return [i.insideDiameterIn && `${i.insideDiameterIn} in ID`, i.lengthFt && `${i.lengthFt} ft`].filter(Boolean).join(" · ");
  if (i.kind === "gauge") return i.checkEveryDays ? `check every ${i.checkEveryDays} days` : "";
  return "";
}

function eventFacts(e: RigEvent): string {
  return [
    e.oilReason && OIL_REASON_WORDS[e.oilReason],
    e.lowestMicrons !== null && `lowest ${Math.round(e.lowestMicrons)} microns`,
    e.pumpHours !== null && `${e.pumpHours} h`,
    e.referenceMicrons !== null && `reference ${e.referenceMicrons}, gauge ${e.gaugeMicrons ?? "?"} microns`,
    e.note,
  ]
    .filter(Boolean)
    .join(" · ");
}

export function RigDetail({ data, today }: { data: RigDetailData; today: string }) {
  const router = useRouter();
  const [, setTick] = useState(0);
  const refresh = () => {
    router.refresh();
    setTick((t) => t + 1);
  };
  const itemLabel = (id: string | null) => data.items.find((i) => i.id === id)?.label ?? "Rig";
  return (
    <>
      <div>
        <Link href="/tools/rigs" className="text-body text-tide-700 underline dark:text-tide-300">
          All rigs
        </Link>
        <h1 className="text-headline">{data.rig.name}</h1>
        <p className="text-body text-fg-soft">{[data.rig.truck, data.rig.keeperName && `kept by ${data.rig.keeperName}`].filter(Boolean).join(" · ")}</p>
      </div>
      <section aria-label="Reminders" className="space-y-2" data-testid="rig-reminders">
        {data.reminders.length === 0 ? (
          <Alert tone="success" title="Nothing due" />
        ) : (
          data.reminders.map((r) => (
            <Alert key={`${r.code}-${r.itemId}`} tone={r.severity === "warning" ? "warning" : "info"} title={r.title}>
              {r.message}
            </Alert>
          ))
        )}
      </section>
      <Card title="Equipment" flush>
        {data.items.length === 0 ? (
          <p className="px-4 pb-4 text-body text-fg-soft">No equipment yet.</p>
        ) : (
          <ul className="divide-y divide-surface-line">
            {data.items.map((i) => (
              <li key={i.id} className="px-4 py-3">
                <span className="flex items-center gap-2">
                  <Badge tone="brand">{KIND_WORDS[i.kind]}</Badge>
                  <span className="font-medium">{i.label}</span>
                </span>
                <span className="text-caption text-fg-soft">{itemFacts(i)}</span>
              </li>
            ))}
          </ul>
        )}
      </Card>
      {data.canManage && <LogEventForm rigId={data.rig.id} items={data.items} today={today} onSaved={refresh} />}
      {data.canManage && <AddItemForm rigId={data.rig.id} onSaved={refresh} />}
      {data.blankOffTrend.length > 0 && (
        <Card title="Blank-off trend">
          <ol className="flex flex-wrap gap-2" aria-label="Blank-off readings, oldest first">
            {data.blankOffTrend.map((b, k) => (
              <li key={k} className="rounded-lg border border-surface-line px-2 py-1 text-caption">
                {b.occurredOn}: <strong>{Math.round(b.lowestMicrons)}</strong> µ
              </li>
            ))}
          </ol>
        </Card>
      )}
      <Card title="History" flush>
        {data.events.length === 0 ? (
          <p className="px-4 pb-4 text-body text-fg-soft">Nothing logged yet.</p>
        ) : (
          <ul className="divide-y divide-surface-line" data-testid="rig-history">
            {data.events.map((e) => (
              <li key={e.id} className="px-4 py-3">
                <span className="block font-medium">
                  {e.occurredOn} · {EVENT_WORDS[e.kind] ?? e.kind}
                </span>
                <span className="text-caption text-fg-soft">
                  {itemLabel(e.itemId)}
                  {eventFacts(e) && ` · ${eventFacts(e)}`}
                </span>
              </li>
            ))}
          </ul>
        )}
      </Card>
    </>
  );
}
