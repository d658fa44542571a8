/**
 * The browser's way to Riseline's API: typed responses, typed errors in plain words, and
 * retries that reuse the same Idempotency-Key, so a retry on a weak signal never creates a
 * second test. Uploads go through XMLHttpRequest for progress.
 */
import type { AnalysisResult, PressureUnit, UnsureReason } from "@/analysis/decay/types";
import type { JobsAnswer, JobItem, MembersAnswer, ProfileItem, ProfilesAnswer, SiteItem, SitesAnswer, SystemItem, SystemsAnswer } from "@/lib/contracts/records";
import type { AnalysisHistoryEntry, VacuumTestDetail, VacuumTestDto, VacuumTestListItem, TestPage, VacuumTestSummary } from "@/lib/contracts/vacuum-tests";

// The shapes the server answers with, declared once in lib/contracts/ (word lists in db/vocabulary.ts).
export type { TestStatus } from "@/db/vocabulary";
export type { JobItem, ProfileItem, SiteItem, SystemItem, VacuumTestDetail, VacuumTestDto, VacuumTestListItem, TestPage };
/** A new test with its verdict — or an apprentice's practice test, whose verdict waits for their call at `practiceCallUrl`. */
export type CreatedTest = VacuumTestSummary;
export type HistoryEntry = AnalysisHistoryEntry;

export interface ImportPreview {
  columns: string[];
  rows: string[][];
  detected: {
    timeColumn: string | null;
    pressureColumn: string | null;
    unit: PressureUnit | null;
    timeFormat: string | null;
    unsure: boolean;
    /** Each guess behind `unsure` by topic (older servers send none); decimal_mark carries the two readings to choose from. */
    unsureReasons?: UnsureReason[];
    assumptions: string[];
  };
}

export interface ReanalyseBody {
  isolationAtSeconds?: number;
  holdWindow?: { startSeconds: number; endSeconds: number };
  unit?: PressureUnit;
  timeUnit?: "s" | "min";
  decimalMark?: "point" | "comma";
  profileId?: string;
  reason?: string;
}

export interface TypedReadingsBody {
  readings: { time: string | number; microns: number }[];
  timeMode: "clock" | "minutes";
  [metadata: string]: unknown;
}

/** A failed call: `code` from the server (or "offline" / "network"), message in plain words. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details?: Record<string, unknown>;
  constructor(status: number, code: string, message: string, details?: Record<string, unknown>) {
    super(message);
    this.name = "ApiError";
    this.status = status;
    this.code = code;
    this.details = details;
  }
  /** Worth trying again with the same key: no answer, or the server said it saved nothing. */
  get retryable(): boolean {
    return this.status === 0 || this.status === 502 || this.status === 503 || this.status === 504;
  }
}

const FALLBACK_MESSAGE: Record<number, string> = {
  0: "No answer from Riseline. Check the signal and try again; nothing is sent twice.",
  401: "Your session ended. Sign in again.",
  403: "Your role does not allow this.",
  404: "Not found. It may have been removed.",
  413: "The file is too large for one test.",
  415: "That file is not a CSV or text log. Export the log from the gauge as CSV.",
  422: "The log could not be read.",
  500: "Something went wrong on our side. Please try again.",
  503: "Riseline could not store this just now. Nothing was saved; try again.",
};

/** A fresh key per attempt. Falls back to getRandomValues outside secure contexts. */
export function newIdempotencyKey(): string {
  if (typeof crypto !== "undefined" && typeof crypto.randomUUID === "function") return crypto.randomUUID();
  const b = new Uint8Array(16);
  crypto.getRandomValues(b);
  b[6] = (b[6] & 0x0f) | 0x40;
  b[8] = (b[8] & 0x3f) | 0x80;
  const h = Array.from(b, (x) => x.toString(16).padStart(2, "0")).join("");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

export function isOffline(): boolean {
  return typeof navigator !== "undefined" && navigator.onLine === false;
}

function errorFrom(status: number, text: string): ApiError {
  let body: { error?: { code?: string; message?: string; details?: Record<string, unknown> } } | null = null;
  try {
    body = JSON.parse(text);
  } catch {
    body = null;
  }
  const e = body?.error;
  const message = e?.message || FALLBACK_MESSAGE[status] || FALLBACK_MESSAGE[status >= 500 ? 500 : 0] || `Request failed (${status}).`;
  return new ApiError(status, e?.code ?? `http_${status}`, message, e?.details);
}

function networkError(): ApiError {
  if (isOffline()) return new ApiError(0, "offline", "You are offline. Nothing was sent. Retry when you have signal.");
  return new ApiError(0, "network", FALLBACK_MESSAGE[0]);
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

interface CallOptions {
  /** Automatic retries for retryable failures (network, 502–504). Default 2 for reads, 0 for writes without a key. */
  retries?: number;
  idempotencyKey?: string;
  signal?: AbortSignal;
}

/** JSON call with typed errors. Retries reuse the same Idempotency-Key header. */
export async function apiFetch<T>(path: string, init: RequestInit = {}, opts: CallOptions = {}): Promise<T> {
  const method = (init.method ?? "GET").toUpperCase();
  const retries = opts.retries ?? (method === "GET" || opts.idempotencyKey ? 2 : 0);
  const headers = new Headers(init.headers);
  headers.set("accept", "application/json");
  if (init.body && typeof init.body === "string" && !headers.has("content-type")) headers.set("content-type", "application/json");
  if (opts.idempotencyKey) headers.set("idempotency-key", opts.idempotencyKey);
  for (let attempt = 0; ; attempt++) {
    let res: Response;
    try {
      res = await fetch(path, { ...init, headers, signal: opts.signal, credentials: "same-origin" });
    } catch (err) {
      if ((err as Error).name === "AbortError") throw err;
      const e = networkError();
      if (attempt < retries && e.code !== "offline") {
        await sleep(800 * 2 ** attempt);
        continue;
      }
      throw e;
    }
    const text = await res.text();
    if (res.ok) return (text ? JSON.parse(text) : undefined) as T;
    const e = errorFrom(res.status, text);
    if (attempt < retries && e.retryable) {
      await sleep(800 * 2 ** attempt);
      continue;
    }
    throw e;
  }
}

export interface UploadOptions {
  idempotencyKey: string;
  onProgress?: (fraction: number) => void;
  retries?: number;
  signal?: AbortSignal;
}

/** One multipart POST through XMLHttpRequest, for upload progress. */
function xhrPost<T>(path: string, form: FormData, opts: UploadOptions): Promise<T> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", path);
    xhr.setRequestHeader("accept", "application/json");
    xhr.setRequestHeader("idempotency-key", opts.idempotencyKey);
    xhr.upload.onprogress = (ev) => {
      if (ev.lengthComputable && opts.onProgress) opts.onProgress(ev.loaded / ev.total);
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        try {
          resolve(JSON.parse(xhr.responseText) as T);
        } catch {
          reject(new ApiError(xhr.status, "bad_response", "Riseline answered with something unreadable. Try again."));
        }
      } else reject(errorFrom(xhr.status, xhr.responseText));
    };
    xhr.onerror = () => reject(networkError());
    xhr.ontimeout = () => reject(networkError());
    xhr.onabort = () => reject(new DOMException("aborted", "AbortError"));
    opts.signal?.addEventListener("abort", () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

async function withRetries<T>(run: () => Promise<T>, retries: number): Promise<T> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await run();
    } catch (err) {
      if (!(err instanceof ApiError) || !err.retryable || err.code === "offline" || attempt >= retries) throw err;
      await sleep(1000 * 2 ** attempt);
    }
  }
}

/** POST /api/vacuum-tests with a gauge file; the key is sent on every retry. */
export function uploadTest(form: FormData, opts: UploadOptions): Promise<CreatedTest> {
  return withRetries(() => xhrPost<CreatedTest>("/api/vacuum-tests", form, opts), opts.retries ?? 2);
}

/** POST /api/vacuum-tests with typed readings (JSON body). */
export function createTestFromReadings(body: TypedReadingsBody, idempotencyKey: string): Promise<CreatedTest> {
  return apiFetch<CreatedTest>("/api/vacuum-tests", { method: "POST", body: JSON.stringify(body) }, { idempotencyKey });
}

/** POST /api/imports/preview: the columns and what the importer would assume. */
export function previewImport(file: Blob, filename: string): Promise<ImportPreview> {
  const form = new FormData();
  form.set("file", file, filename);
  return apiFetch<ImportPreview>("/api/imports/preview", { method: "POST", body: form }, { retries: 2 });
}

export interface TestFilters {
  verdict?: string;
  technicianId?: string;
  siteId?: string;
  from?: string;
  to?: string;
  isPractice?: string;
  cursor?: string;
  limit?: number;
}

export function listTests(filters: TestFilters, signal?: AbortSignal): Promise<TestPage> {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(filters)) if (v !== undefined && v !== "") q.set(k, String(v));
  return apiFetch<TestPage>(`/api/vacuum-tests?${q}`, {}, { signal });
}

export function getTest(id: string, signal?: AbortSignal): Promise<VacuumTestDetail> {
  return apiFetch<VacuumTestDetail>(`/api/vacuum-tests/${encodeURIComponent(id)}`, {}, { signal });
}

export function getRawLink(id: string): Promise<{ url: string; expiresInSeconds: number }> {
  return apiFetch(`/api/vacuum-tests/${encodeURIComponent(id)}/raw`);
}

export function reanalyse(id: string, body: ReanalyseBody, idempotencyKey: string): Promise<{ analysis: AnalysisResult; version: number; analysisId: string }> {
  return apiFetch(`/api/vacuum-tests/${encodeURIComponent(id)}/analyses`, { method: "POST", body: JSON.stringify(body) }, { idempotencyKey });
}

export async function listSites(): Promise<SiteItem[]> {
  return (await apiFetch<SitesAnswer>("/api/sites")).items;
}
export async function listSystems(siteId: string): Promise<SystemItem[]> {
  return (await apiFetch<SystemsAnswer>(`/api/systems?siteId=${encodeURIComponent(siteId)}`)).items;
}
export async function listJobs(): Promise<JobItem[]> {
  return (await apiFetch<JobsAnswer>("/api/jobs")).items;
}
export async function listProfiles(): Promise<ProfileItem[]> {
  return (await apiFetch<ProfilesAnswer>("/api/profiles")).items;
}
/** The shop's members as the technician filter shows them. */
export async function listMembers(): Promise<{ id: string; name: string }[]> {
  return (await apiFetch<MembersAnswer>("/api/members")).members.map((m) => ({ id: m.userId, name: m.name }));
}
