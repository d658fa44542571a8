/**
 * The outbox on the phone: tests captured without signal, kept in IndexedDB (through `idb`) until
 * Riseline has stored them. Used by the page and by the service worker alike (no DOM-only API).
 * Each capture carries the id of the person who captured it; every read here filters by it.
 */
import { openDB, type DBSchema, type IDBPDatabase } from "idb";
import type { AnalysisResult } from "@/analysis/decay/types";
import type { CaptureStatus, VerdictSummary } from "./rules";

export interface ProvisionalVerdict {
  result: AnalysisResult;
  series: { t: number[]; p: number[] };
  /** Milliseconds the engine took on this phone, worker start included. */
  elapsedMs: number;
}

export interface Capture {
  id: string;
  userId: string;
  /** Made once at capture; every try sends it. */
  idempotencyKey: string;
  createdAt: number;
  source: "file" | "typed";
  /** What the list shows: the file name, or "Typed readings". */
  label: string;
  file?: Blob;
  fileName?: string;
  readings?: { time: string | number; microns: number }[];
  timeMode?: "clock" | "minutes";
  /** The test's job, notes, ambient and other fields, as the API takes them. */
  fields: Record<string, string | number | boolean>;
  status: CaptureStatus;
  attempts: number;
  nextTryAt: number;
  lastError?: string;
  provisional?: ProvisionalVerdict;
  provisionalError?: string;
  confirmed?: { testId: string; summary: VerdictSummary; title: string; changes: string[] };
  sentAt?: number;
  /** Approximate bytes this capture takes on the phone. */
  bytes: number;
}

interface OutboxDb extends DBSchema {
  captures: { key: string; value: Capture; indexes: { byUser: string } };
}

const DB_NAME = "riseline-outbox";
let opened: Promise<IDBPDatabase<OutboxDb>> | null = null;

function db(): Promise<IDBPDatabase<OutboxDb>> {
  opened ??= openDB<OutboxDb>(DB_NAME, 1, {
    upgrade(d) {
      const s = d.createObjectStore("captures", { keyPath: "id" });
      s.createIndex("byUser", "userId");
    },
  });
  return opened;
}

/** Tells every open page (and the service worker) that the outbox changed. */
export const OUTBOX_CHANNEL = "riseline-outbox";
function announce(): void {
  if (typeof BroadcastChannel === "undefined") return;
  const ch = new BroadcastChannel(OUTBOX_CHANNEL);
  ch.postMessage("changed");
  ch.close();
}

export async function addCapture(c: Capture): Promise<void> {
  await (await db()).put("captures", c);
  announce();
}

export async function listCaptures(userId: string): Promise<Capture[]> {
  const all = await (await db()).getAllFromIndex("captures", "byUser", userId);
  return all.sort((a, b) => a.createdAt - b.createdAt);
}

export async function getCapture(userId: string, id: string): Promise<Capture | undefined> {
  const c = await (await db()).get("captures", id);
  return c && c.userId === userId ? c : undefined;
}

/** Changes one capture of this person in one transaction; a capture of someone else is left alone. */
export async function updateCapture(userId: string, id: string, change: (c: Capture) => Capture): Promise<Capture | undefined> {
  const tx = (await db()).transaction("captures", "readwrite");
  const c = await tx.store.get(id);
  if (!c || c.userId !== userId) {
    await tx.done;
    return undefined;
  }
  const next = change(c);
  await tx.store.put(next);
  await tx.done;
  announce();
  return next;
}

export async function deleteCapture(userId: string, id: string): Promise<void> {
  const c = await getCapture(userId, id);
  if (c) await (await db()).delete("captures", id);
  announce();
}

/** Every capture on this phone, whoever made it (sign-out clears them all). */
export async function listAllCaptures(): Promise<Capture[]> {
  return (await db()).getAll("captures");
}

export async function clearOutbox(): Promise<void> {
  await (await db()).clear("captures");
  announce();
}

/** Bytes the outbox's captures take, and what the browser says this site uses and may use. */
export async function storageUsed(userId: string): Promise<{ outboxBytes: number; usage: number | null; quota: number | null }> {
  const list = await listCaptures(userId);
  const outboxBytes = list.reduce((s, c) => s + c.bytes, 0);
  const est = typeof navigator !== "undefined" && navigator.storage?.estimate ? await navigator.storage.estimate() : null;
  return { outboxBytes, usage: est?.usage ?? null, quota: est?.quota ?? null };
}
