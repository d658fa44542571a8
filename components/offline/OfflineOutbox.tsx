"use client";

/**
 * The new-test page's offline side: the offline banner, the "Waiting to send" list with each
 * capture's state, its provisional and confirmed verdicts, the storage used, retry and discard.
 * Reads the outbox of the signed-in person only.
 */
import { useCallback, useEffect, useState } from "react";
import { Alert } from "@/components/ui";
import { deleteCapture, listCaptures, OUTBOX_CHANNEL, storageUsed, updateCapture, type Capture } from "@/lib/offline/outbox";
import { drainOutbox } from "@/lib/offline/drain";
import { rememberShopProfile } from "@/lib/offline/capture";
import { CaptureCard } from "./CaptureCard";

function bytesWords(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(0)} KB`;
  return `${(n / 1048576).toFixed(1)} MB`;
}

export function OfflineOutbox({ userId }: { userId: string }) {
  const [items, setItems] = useState<Capture[]>([]);
  const [online, setOnline] = useState(true);
  const [storage, setStorage] = useState<{ outboxBytes: number; usage: number | null; quota: number | null } | null>(null);
  const [now, setNow] = useState(() => Date.now());

  const reload = useCallback(async () => {
    try {
      setItems(await listCaptures(userId));
      setStorage(await storageUsed(userId));
    } catch {
      setItems([]);
    }
    setNow(Date.now());
  }, [userId]);

  useEffect(() => {
    const first = setTimeout(() => void reload(), 0);
    const update = () => setOnline(navigator.onLine);
    update();
    if (navigator.onLine) void rememberShopProfile(userId);
    window.addEventListener("online", update);
    window.addEventListener("offline", update);
    const ch = typeof BroadcastChannel !== "undefined" ? new BroadcastChannel(OUTBOX_CHANNEL) : null;
    if (ch) ch.onmessage = () => void reload();
    const tick = setInterval(() => setNow(Date.now()), 30_000);
    return () => {
      window.removeEventListener("online", update);
      window.removeEventListener("offline", update);
      ch?.close();
      clearInterval(tick);
      clearTimeout(first);
    };
  }, [reload, userId]);

  const shown = items.filter((c) => c.status !== "confirmed" || now - (c.sentAt ?? 0) < 24 * 3600_000);
  const waiting = items.filter((c) => c.status !== "confirmed" && c.status !== "sent").length;

  return (
    <div className="space-y-4">
      {!online && (
        <div data-testid="offline-banner">
          <Alert tone="warning" title="No signal — working on this phone">
            Tests you capture now are kept on this phone, judged here, and sent by themselves when the connection returns.
          </Alert>
        </div>
      )}
      {shown.length > 0 && (
        <section aria-labelledby="outbox-title" className="space-y-3" data-testid="outbox">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h2 id="outbox-title" className="text-title">Waiting to send{waiting ? ` (${waiting})` : ""}</h2>
            {storage && (
              <p className="text-caption text-fg-soft" data-testid="storage-used">
                {bytesWords(storage.outboxBytes)} on this phone
                {storage.usage != null && storage.quota ? ` · Riseline uses ${bytesWords(storage.usage)} of ${bytesWords(storage.quota)} allowed` : ""}
              </p>
            )}
          </div>
          <ul className="space-y-3">
            {shown.map((c) => (
              <CaptureCard
                key={c.id}
                c={c}
                now={now}
                onRetry={async () => {
                  await updateCapture(userId, c.id, (x) => ({ ...x, status: "saved", nextTryAt: 0 }));
                  await drainOutbox();
                }}
                onDiscard={async () => {
                  const unsent = c.status !== "sent" && c.status !== "confirmed";
                  if (unsent && !window.confirm(`Discard ${c.label}? It was never sent; it is gone from this phone for good.`)) return;
                  await deleteCapture(userId, c.id);
                }}
              />
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
