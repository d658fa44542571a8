import Link from "next/link";
import type { Verdict } from "@/analysis/decay/types";
import { VerdictBadge } from "@/components/verdict/VerdictBadge";
import type { VacuumTestListItem } from "@/lib/client/api";

const STATUS_CHIP: Record<string, { text: string; cls: string } | undefined> = {
  sent_back: { text: "Sent back", cls: "bg-flare-100 text-ink border-flare-500 dark:bg-flare-700 dark:text-white" },
  waiting_review: { text: "Waiting for review", cls: "bg-surface-sunken text-fg border-surface-line" },
  signed_off: { text: "Signed off", cls: "bg-surface-sunken text-fg border-surface-line" },
};

function shortDate(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : d.toLocaleString("en-US", { month: "short", day: "numeric", hour: "numeric", minute: "2-digit" });
}

const n = (v: number | null) => (v == null ? "—" : Math.round(v).toLocaleString("en-US"));

/** One test in a list: the whole row is a link, at least 48 px tall. */
export function TestRow({ item, showTechnician = true }: { item: VacuumTestListItem; showTechnician?: boolean }) {
  const chip = STATUS_CHIP[item.status];
  const where = [item.site?.name, item.systemName].filter(Boolean).join(" · ");
  return (
    <Link
      href={`/vacuum-tests/${item.id}`}
      data-testid="test-row"
      className="block rounded-card border border-surface-line bg-surface-raised px-4 py-3 shadow-card hover:border-tide-400"
    >
      <div className="flex flex-wrap items-center justify-between gap-2">
        <VerdictBadge verdict={item.verdict as Verdict | null} meetsProfile={item.meetsProfile} />
        <span className="text-caption text-fg-soft">{shortDate(item.testedAt)}</span>
      </div>
      <p className="mt-1 break-words text-lead font-semibold text-fg">{item.title}</p>
      {(where || showTechnician) && (
        <p className="text-body text-fg-soft">
          {[where, showTechnician ? item.technician.name : ""].filter(Boolean).join(" · ")}
        </p>
      )}
      <div className="mt-1 flex flex-wrap items-center gap-x-4 gap-y-1 text-body tabular-nums">
        {item.startMicrons != null && (
          <span>
            {n(item.startMicrons)} µ at isolation, last {n(item.endMicrons)} µ
          </span>
        )}
        {item.leakRateMicronsPerMinute != null && item.leakRateMicronsPerMinute > 0 && <span>{Number(item.leakRateMicronsPerMinute.toPrecision(3))} µ/min climb</span>}
        {item.isPractice && <span className="rounded-full border border-surface-line px-2 text-caption">Practice</span>}
        {chip && <span className={`rounded-full border px-2 text-caption font-semibold ${chip.cls}`}>{chip.text}</span>}
      </div>
    </Link>
  );
}
