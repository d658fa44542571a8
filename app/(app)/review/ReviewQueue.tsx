"use client";

import Link from "next/link";
import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import type { Verdict } from "@/analysis/decay/types";
import { Alert, Badge, Button, EmptyState, Select, Spinner } from "@/components/ui";
import { VerdictBadge } from "@/components/verdict/VerdictBadge";
import { Sparkline } from "@/components/review/Sparkline";
import { apiFetch } from "@/lib/client/api";
import { signOffNeedsReason } from "@/lib/review/state";
import type { Sparkline as SparklineData } from "@/lib/review/sparkline";

interface QueueItem {
  id: string;
  title: string;
  verdict: Verdict | null;
  helpRequested: boolean;
  testedAt: string;
  technicianName: string;
  siteName: string | null;
  systemName: string | null;
  meetsProfile: boolean | null;
  endMicrons: number | null;
  waitingSince: string | null;
  sparkline: SparklineData | null;
}

function waited(iso: string | null): string {
  if (!iso) return "";
  const min = Math.max(0, Math.round((Date.now() - Date.parse(iso)) / 60000));
  if (min < 60) return `waiting ${min} min`;
  const h = Math.round(min / 60);
  return h < 48 ? `waiting ${h} h` : `waiting ${Math.round(h / 24)} days`;
}

const VERDICTS: { value: string; label: string }[] = [
  { value: "", label: "Any verdict" },
  { value: "leak", label: "Leak" },
  { value: "moisture", label: "Moisture" },
  { value: "leak_and_moisture", label: "Leak + moisture" },
  { value: "inconclusive", label: "Can't tell" },
  { value: "pass", label: "Tight and dry" },
];

export function ReviewQueue({ technicians }: { technicians: { id: string; name: string }[] }) {
  const [verdict, setVerdict] = useState("");
  const [technicianId, setTechnicianId] = useState("");
  const [help, setHelp] = useState(false);
  const qs = new URLSearchParams({ ...(verdict ? { verdict } : {}), ...(technicianId ? { technicianId } : {}), ...(help ? { help: "1" } : {}) }).toString();
  const q = useQuery({ queryKey: ["review-queue", qs], queryFn: ({ signal }) => apiFetch<{ items: QueueItem[] }>(`/api/review${qs ? `?${qs}` : ""}`, {}, { signal }), refetchInterval: 60_000 });

  return (
    <div className="space-y-4">
      <div className="grid gap-3 sm:grid-cols-3">
        <Select label="Verdict" value={verdict} onChange={(e) => setVerdict(e.target.value)} options={VERDICTS} />
        <Select label="Technician" value={technicianId} onChange={(e) => setTechnicianId(e.target.value)} options={[{ value: "", label: "Everyone" }, ...technicians.map((t) => ({ value: t.id, label: t.name }))]} />
        <label className="flex min-h-tap items-center gap-2 self-end text-body">
          <input type="checkbox" className="h-5 w-5" checked={help} onChange={(e) => setHelp(e.target.checked)} /> Only help requests
        </label>
      </div>
      {q.isPending ? (
        <Spinner label="Loading the queue" />
      ) : q.isError ? (
        <Alert tone="error" action={<Button onClick={() => q.refetch()}>Retry</Button>}>{(q.error as Error).message}</Alert>
      ) : q.data.items.length === 0 ? (
        <EmptyState title="Nothing waiting for review">When a technician asks, or a test fails, it shows up here.</EmptyState>
      ) : (
        <ul className="space-y-2" data-testid="review-queue">
          {q.data.items.map((t) => (
            <li key={t.id}>
              <Link href={`/vacuum-tests/${t.id}`} className="flex items-center gap-3 rounded-card border border-surface-line bg-surface-raised p-3 hover:border-tide-600" data-testid="queue-item">
                <Sparkline data={t.sparkline} width={96} height={40} className="shrink-0 text-fg" />
                <div className="min-w-0 flex-1">
                  <p className="truncate text-body font-semibold">{t.title}</p>
                  <p className="truncate text-caption text-fg-soft">
                    {t.technicianName}
                    {t.siteName ? ` · ${t.siteName}` : ""}
                    {t.systemName ? ` · ${t.systemName}` : ""} · {waited(t.waitingSince)}
                  </p>
                  <div className="mt-1 flex flex-wrap gap-1.5">
                    <VerdictBadge verdict={t.verdict} meetsProfile={t.meetsProfile} />
                    {t.meetsProfile === false && t.verdict !== "pass" && <Badge tone="attention">Misses profile</Badge>}
                    {t.helpRequested && <Badge tone="attention">Help asked</Badge>}
                    {signOffNeedsReason(t.verdict, t.meetsProfile) && <Badge tone="attention">Sign-off needs a reason</Badge>}
                    {t.endMicrons != null && <Badge>last reading {Math.round(t.endMicrons).toLocaleString("en-US")} microns</Badge>}
                  </div>
                </div>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
