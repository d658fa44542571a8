/**
 * Capturing a test on the phone when there is no signal: the capture is stored first (nothing is
 * lost if the tab closes), its Idempotency-Key made now, a Background Sync asked for, and then the
 * engine runs on the phone for the provisional verdict.
 */
import type { AcceptanceProfile, AnalyzeOptions } from "@/analysis/decay/types";
import { newIdempotencyKey } from "@/lib/client/api";
import { typedReadingsToCsv } from "@/lib/vacuum-tests/typed";
import { SYNC_TAG } from "./constants";
import { analyseOnPhone } from "./engine-client";
import { addCapture, updateCapture, type Capture } from "./outbox";

export type CaptureInput =
  | { source: "file"; file: File }
  | { source: "typed"; readings: { time: string | number; microns: number }[]; timeMode: "clock" | "minutes" };

const PROFILE_KEY = (userId: string) => `riseline-profile:${userId}`;

/** Remembers the shop's default profile while there is signal, so the phone judges by it offline. */
export async function rememberShopProfile(userId: string): Promise<void> {
  try {
    const res = await fetch("/api/profiles", { headers: { accept: "application/json" }, credentials: "same-origin" });
    if (!res.ok) return;
    const { items } = (await res.json()) as { items: (AcceptanceProfile & { isDefault?: boolean })[] };
    const d = items.find((p) => p.isDefault) ?? items[0];
    if (d) {
      const { name, targetMicrons, holdMinutes, limitMicrons, leakRateMicronsPerMinute } = d;
      localStorage.setItem(PROFILE_KEY(userId), JSON.stringify({ name, targetMicrons, holdMinutes, limitMicrons, leakRateMicronsPerMinute }));
    }
  } catch {
    // no signal: keep the last one remembered
  }
}

function shopProfile(userId: string): AcceptanceProfile | undefined {
  try {
    const s = localStorage.getItem(PROFILE_KEY(userId));
    return s ? (JSON.parse(s) as AcceptanceProfile) : undefined;
  } catch {
    return undefined;
  }
}

/** The engine options the server would build from the same fields (lib/tests/upload.ts). */
function optionsOf(userId: string, fields: Capture["fields"], typed?: ReturnType<typeof typedReadingsToCsv>): AnalyzeOptions {
  const o: AnalyzeOptions = {};
  const profile = shopProfile(userId);
  if (profile) o.profile = profile;
  if (typeof fields.ambientC === "number") o.ambientC = fields.ambientC;
  if (typeof fields.volumeLitres === "number") o.volume = { litres: fields.volumeLitres };
  else if (typeof fields.lineSetFeet === "number" && typeof fields.liquidOd === "string" && typeof fields.suctionOd === "string")
    o.volume = { lineSet: [{ lengthFeet: fields.lineSetFeet, liquidOd: fields.liquidOd, suctionOd: fields.suctionOd }] };
  if (typed) {
    o.import = typed.importDefaults;
    if (typed.isolationAtSeconds !== undefined) o.isolationAtSeconds = typed.isolationAtSeconds;
  }
  return o;
}

async function askForSync(): Promise<void> {
  try {
    const reg = (await navigator.serviceWorker?.ready) as (ServiceWorkerRegistration & { sync?: { register(tag: string): Promise<void> } }) | undefined;
    await reg?.sync?.register(SYNC_TAG);
  } catch {
    // no Background Sync here: the page sends on `online` and on the next open
  }
}

/** Stores the capture, then works out the provisional verdict; resolves with the stored capture. */
export async function captureOffline(userId: string, input: CaptureInput, fields: Capture["fields"]): Promise<Capture> {
  const typed = input.source === "typed" ? typedReadingsToCsv({ readings: input.readings, timeMode: input.timeMode }) : undefined;
  const text = input.source === "file" ? await input.file.text() : typed!.text;
  const c: Capture = {
    id: crypto.randomUUID(),
    userId,
    idempotencyKey: newIdempotencyKey(),
    createdAt: Date.now(),
    source: input.source,
    label: input.source === "file" ? input.file.name : `Typed readings (${input.readings.length})`,
    ...(input.source === "file" ? { file: input.file, fileName: input.file.name } : { readings: input.readings, timeMode: input.timeMode }),
    fields,
    status: "saved",
    attempts: 0,
    nextTryAt: Date.now(),
    bytes: input.source === "file" ? input.file.size : text.length,
  };
  await addCapture(c);
  void askForSync();
  try {
    const provisional = await analyseOnPhone(text, optionsOf(userId, fields, typed));
    return (await updateCapture(userId, c.id, (x) => ({ ...x, provisional, bytes: x.bytes + JSON.stringify(provisional).length }))) ?? c;
  } catch (e) {
    return (await updateCapture(userId, c.id, (x) => ({ ...x, provisionalError: (e as Error).message }))) ?? c;
  }
}
