"use client";

/**
 * Registers Riseline's service worker (production builds only: public/sw.js is written by
 * `serwist build`), asks it to keep the offline pages, and sends the phone's outbox on every open
 * and whenever the connection returns (the fallback where Background Sync is missing).
 * W3C Service Workers (register, ready, controller).
 */
import { useEffect } from "react";

async function drainSoon(): Promise<void> {
  const { drainOutbox } = await import("@/lib/offline/drain");
  const report = await drainOutbox();
  if (report?.nextAt != null) {
    const wait = Math.max(500, report.nextAt - Date.now());
    setTimeout(() => void drainSoon(), wait);
  }
}

export function ServiceWorker() {
  useEffect(() => {
    if (!("serviceWorker" in navigator) || process.env.NODE_ENV !== "production") return;
    let stopped = false;
    navigator.serviceWorker
      .register("/sw.js", { scope: "/" })
      .then(() => navigator.serviceWorker.ready)
      .then((reg) => {
        if (!stopped && navigator.onLine) reg.active?.postMessage("riseline-warm");
      })
      .catch(() => undefined);
    const online = () => void drainSoon().catch(() => undefined);
    if (navigator.onLine) online();
    window.addEventListener("online", online);
    return () => {
      stopped = true;
      window.removeEventListener("online", online);
    };
  }, []);
  return null;
}
