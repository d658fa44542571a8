/**
 * Riseline's service worker (built by `serwist build`, see serwist.config.mjs, into public/sw.js).
 *  - Precaches the build's static files: the app shell's scripts and styles, every screen's
 *    chunks (the typed-readings screen, the chart), the fonts and the engine worker's chunk.
 *  - The pages a technician needs without signal (/vacuum-tests/new) are kept network-first: the live
 *    page when there is signal, the last one seen when there is none. The page asks for them to be
 *    stored as soon as this worker controls it ("warm").
 *  - Background Sync (WHATWG draft): a `sync` tagged "riseline-outbox" sends the outbox.
 * W3C Service Workers; Serwist's own guide for its options.
 */
import { NetworkFirst, Serwist, type PrecacheEntry } from "serwist";
import { drainOutbox } from "../drain";
import { OFFLINE_PAGES, PAGES_CACHE, SYNC_TAG } from "../constants";

declare const self: ServiceWorkerGlobalScope & { __SW_MANIFEST: (PrecacheEntry | string)[] | undefined };

interface SyncEvent extends ExtendableEvent {
  readonly tag: string;
}

const pages = new NetworkFirst({ cacheName: PAGES_CACHE, networkTimeoutSeconds: 6 });

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  skipWaiting: true,
  clientsClaim: true,
  navigationPreload: false,
  runtimeCaching: [
    {
      matcher: ({ request, url }) => url.origin === self.location.origin && request.mode === "navigate" && OFFLINE_PAGES.includes(url.pathname),
      handler: pages,
    },
  ],
});

/**
 * A Web Worker's bootstrap (the phone's engine) reads its chunk list from its own URL's fragment
 * (`#params=`). A response taken from the cache as it is would give the worker the cached URL, without
 * the fragment, as its location; a new Response carries no URL, so the worker keeps the one it was
 * started with. Registered before Serwist's listener, which then leaves the request alone.
 */
const WORKER_BOOTSTRAP = /^\/_next\/static\/chunks\/turbopack-worker-[\w-]+\.js$/;
self.addEventListener("fetch", (event: FetchEvent) => {
  const url = new URL(event.request.url);
  if (url.origin !== self.location.origin || !WORKER_BOOTSTRAP.test(url.pathname)) return;
  event.stopImmediatePropagation();
  event.respondWith(
    (async () => {
      const res: Response = (await caches.match(`${url.origin}${url.pathname}`)) ?? (await fetch(event.request));
      return new Response(await res.blob(), { status: res.status, statusText: res.statusText, headers: res.headers });
    })(),
  );
});

serwist.addEventListeners();

/** Stores the offline pages now, with the person's cookie; a redirect (signed out) is not kept. */
async function warm(): Promise<void> {
  const cache = await caches.open(PAGES_CACHE);
  for (const path of OFFLINE_PAGES) {
    const res = await fetch(path, { credentials: "same-origin", redirect: "manual" }).catch(() => null);
    if (res && res.ok && res.type === "basic") await cache.put(path, res);
  }
}

self.addEventListener("message", (event: ExtendableMessageEvent) => {
  if (event.data === "riseline-warm") event.waitUntil(warm());
  if (event.data === "riseline-drain") event.waitUntil(drainOutbox());
});

self.addEventListener("sync", (event) => {
  const e = event as SyncEvent;
  if (e.tag !== SYNC_TAG) return;
  e.waitUntil(
    (async () => {
      // An open page sends and shows the progress itself; with none open, this worker sends.
      const windows = await self.clients.matchAll({ type: "window" });
      if (windows.length) {
        for (const w of windows) w.postMessage("riseline-drain");
        return;
      }
      const r = await drainOutbox();
      // Something still waits for a retry: a rejected sync is retried later by the browser.
      if (r.nextAt !== null) throw new Error("outbox not empty yet");
    })(),
  );
});
