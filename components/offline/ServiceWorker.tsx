"use client";

/**
 * Registers Riseline's service worker (production builds only: public/sw.js is written by
 * `serwist build`), asks it to keep the offline pages, and sends the phone's outbox on every open
 * and whenever the connection returns (the fallback where Background Sync is missing).
 * W3C Service Workers (register, ready, controller).
 */
import { useEffect } from "react";

let timer: ReturnType<typeof setTimeout> | null = null;

/** Drains now, then again when the outbox says; stops while offline (the `online` event restarts it). */
async function drainSoon(): Promise<void> {
  if (timer) clearTimeout(timer);
  timer = null;
  if (!navigator.onLine) return;
  const { drainOutbox } = await import("@/lib/offline/drain");
  const report = await drainOutbox();
  if (report.nextAt != null) timer = setTimeout(() => void drainSoon().catch(() => undefined), Math.max(500, report.nextAt - Date.now()));
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
    // Background Sync fired while this page is open: the worker hands the sending to the page.
    const fromWorker = (e: MessageEvent) => {
      if (e.data === "riseline-drain") online();
    };
    if (navigator.onLine) online();
    window.addEventListener("online", online);
    navigator.serviceWorker.addEventListener("message", fromWorker);
    return () => {
      stopped = true;
      window.removeEventListener("online", online);
      navigator.serviceWorker.removeEventListener("message", fromWorker);
    };
  }, []);
  return null;
}
