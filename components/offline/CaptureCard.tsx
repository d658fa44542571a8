"use client";

/** One capture in the "Waiting to send" list: its state in words, the verdicts and what to do. */
import type { Capture } from "@/lib/offline/outbox";
import type { CaptureStatus } from "@/lib/offline/rules";
import { LazyDecayChart } from "@/components/curve/LazyDecayChart";
import { VerdictBanner } from "@/components/verdict/VerdictBanner";
import { verdictText } from "@/components/verdict/words";
import { Badge, Button, LinkButton, type BadgeTone } from "@/components/ui";

const STATUS: Record<CaptureStatus, { words: string; tone: BadgeTone }> = {
  saved: { words: "Saved on phone", tone: "neutral" },
  sending: { words: "Sending…", tone: "brand" },
  sent: { words: "Sent", tone: "brand" },
  confirmed: { words: "Confirmed", tone: "pass" },
  failed: { words: "Not sent", tone: "leak" },
  waiting_sign_in: { words: "Waiting for sign-in", tone: "attention" },
};

/** "just now", "4 min ago", "3 h ago", "2 days ago". */
export function ageWords(ms: number): string {
  const min = Math.floor(ms / 60_000);
  if (min < 1) return "just now";
  if (min < 60) return `${min} min ago`;
  const h = Math.floor(min / 60);
  if (h < 48) return `${h} h ago`;
  return `${Math.floor(h / 24)} days ago`;
}

export function CaptureCard({ c, now, onRetry, onDiscard }: { c: Capture; now: number; onRetry: () => void; onDiscard: () => void }) {
  const s = STATUS[c.status];
  return (
    <li className="space-y-3 rounded-card border border-surface-line bg-surface-raised p-4" data-testid="outbox-item" data-status={c.status} data-key={c.idempotencyKey}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <div className="min-w-0">
          <p className="truncate text-body font-semibold">{c.label}</p>
          <p className="text-caption text-fg-soft">Captured {ageWords(now - c.createdAt)}</p>
        </div>
        <Badge tone={s.tone}>
          <span data-testid="outbox-status">{s.words}</span>
        </Badge>
      </div>
      {c.lastError && c.status !== "confirmed" && c.status !== "sent" && (
        <p className="text-caption text-fg-soft" data-testid="outbox-reason">{c.lastError}{c.status === "saved" && c.attempts > 0 ? ` Next try by itself (try ${c.attempts} so far).` : ""}</p>
      )}
      {c.confirmed ? (
        <div className="space-y-2" data-testid="confirmed-verdict" data-verdict={c.confirmed.summary.verdict} data-engine={c.confirmed.summary.engineVersion}>
          <p className="text-body">
            <span className="font-semibold">Confirmed by Riseline:</span> {verdictText(c.confirmed.summary.verdict as never).headline} (engine {c.confirmed.summary.engineVersion})
          </p>
          {c.confirmed.changes.length ? (
            <ul className="list-disc pl-5 text-body" data-testid="outbox-changes">
              {c.confirmed.changes.map((x) => <li key={x}>{x}</li>)}
            </ul>
          ) : (
            <p className="text-caption text-fg-soft" data-testid="outbox-same">Same as on this phone.</p>
          )}
          <LinkButton href={`/vacuum-tests/${c.confirmed.testId}`} variant="secondary">Open the test page</LinkButton>
        </div>
      ) : c.provisional ? (
        <div className="space-y-2" data-testid="provisional-verdict" data-verdict={c.provisional.result.verdict} data-engine={c.provisional.result.engineVersion} data-ms={c.provisional.elapsedMs}>
          <p className="text-caption font-semibold uppercase tracking-wide text-flare-700 dark:text-flare-300">On this phone — not yet confirmed</p>
          <VerdictBanner analysis={c.provisional.result} />
          <LazyDecayChart analysis={c.provisional.result} series={c.provisional.series} />
        </div>
      ) : c.provisionalError ? (
        <p className="text-body" data-testid="provisional-error">This phone could not read the log: {c.provisionalError} It is still sent; Riseline will say more.</p>
      ) : (
        <p className="text-caption text-fg-soft" role="status">Working out the verdict on this phone…</p>
      )}
      {c.status !== "confirmed" && c.status !== "sent" && (
        <div className="flex flex-wrap gap-2">
          {(c.status === "failed" || c.status === "saved") && <Button variant="secondary" onClick={onRetry}>Send now</Button>}
          <Button variant="quiet" onClick={onDiscard}>Discard</Button>
        </div>
      )}
    </li>
  );
}
