// @vitest-environment happy-dom
/**
 * The browser's query hooks (lib/client/queries.ts, list-query.ts) and the upload (lib/client/api.ts
 * uploadTest, which the upload page calls) against mocked answers: msw's node server answers the
 * fetch and XMLHttpRequest calls they make, in the shapes of lib/contracts/, and a
 * tiny React root renders each hook in happy-dom. The answers are invented; the server's own side
 * is tested against the real database in tests/contracts.test.ts.
 */
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { createElement, act, type ReactNode } from "react";
import { createRoot, type Root } from "react-dom/client";
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { http, HttpResponse } from "msw";
import { setupServer } from "msw/node";
import type { AnalysisResult } from "@/analysis/decay/types";
import type { VacuumTestDetail, VacuumTestDto, VacuumTestListItem } from "@/lib/contracts/vacuum-tests";
import { ApiError, uploadTest } from "@/lib/client/api";
import { TEST_PAGE_SIZE, useTestList } from "@/lib/client/list-query";
import { useTestDetail } from "@/lib/client/queries";

const ORIGIN = "http://127.0.0.1:3000";
const server = setupServer();

beforeAll(() => {
  (globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;
  (window as unknown as { happyDOM: { setURL(url: string): void } }).happyDOM.setURL(`${ORIGIN}/tests`);
  server.listen({ onUnhandledRequest: "error" });
});
afterEach(() => server.resetHandlers());
afterAll(() => server.close());

/** Renders `hook` inside a QueryClientProvider; `current` is its latest value. */
function renderHook<T>(hook: () => T) {
  // The app's defaults (components/providers.tsx) less retries, so a failure shows at once.
  const client = new QueryClient({ defaultOptions: { queries: { staleTime: 30_000, retry: false, refetchOnWindowFocus: false } } });
  const box: { current: T | undefined } = { current: undefined };
  function Probe() {
    box.current = hook();
    return null;
  }
  const container = document.createElement("div");
  let root: Root;
  act(() => {
    root = createRoot(container);
    root.render(createElement(QueryClientProvider, { client }, createElement(Probe) as ReactNode));
  });
  return {
    get current(): T {
      return box.current as T;
    },
    unmount: () => act(() => root.unmount()),
  };
}

async function waitFor(check: () => boolean, what: string, ms = 5_000) {
  const until = Date.now() + ms;
  while (!check()) {
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await act(() => new Promise((r) => setTimeout(r, 10)));
  }
}

const technician = { id: "u-1", name: "Tam Tech" };
function listItem(n: number): VacuumTestListItem {
  return {
    id: `t-${n}`, title: `Test ${n}`, verdict: "pass", confidence: 0.9, status: "submitted", testedAt: "2026-11-03T10:00:00.000Z", technician,
    site: null, systemName: null, isPractice: false, startMicrons: 420, endMicrons: 480, leakRateMicronsPerMinute: 4, meetsProfile: true, findingCodes: [],
  };
}
const testDto: VacuumTestDto = {
  id: "t-1", title: "Test 1", source: "file", status: "submitted", verdict: "leak", isPractice: false, helpRequested: false,
  testedAt: "2026-11-03T10:00:00.000Z", createdAt: "2026-11-03T10:05:00.000Z", technician, job: null, site: null, system: null,
  refrigerant: null, lineSetFeet: null, liquidOd: null, suctionOd: null, volumeLitres: null, ambientC: null, notes: null,
  customerNote: null, rigNote: null, currentAnalysisId: "a-1",
};
const analysis = { verdict: "leak" } as unknown as AnalysisResult;
const detail: VacuumTestDetail = { test: testDto, analysis, series: { t: [0, 30], p: [500, 520] }, history: [], upload: null };
const errorBody = (code: string, message: string, details?: Record<string, unknown>) => ({ error: { code, message, details } });

describe("useTestList (GET /api/vacuum-tests, cursor pages of 20)", () => {
  it("asks for the filters and 20 rows, then follows nextCursor and joins the pages", async () => {
    const asked: URLSearchParams[] = [];
    server.use(
      http.get(`${ORIGIN}/api/vacuum-tests`, ({ request }) => {
        const q = new URL(request.url).searchParams;
        asked.push(q);
        return q.get("cursor") === "c-2"
          ? HttpResponse.json({ items: [listItem(3)], nextCursor: null })
          : HttpResponse.json({ items: [listItem(1), listItem(2)], nextCursor: "c-2" });
      }),
    );
    const hook = renderHook(() => useTestList({ verdict: "pass" }));
    await waitFor(() => hook.current.isSuccess, "the first page");
    expect(hook.current.hasNextPage).toBe(true);
    await act(async () => {
      await hook.current.fetchNextPage();
    });
    await waitFor(() => hook.current.data?.pages.length === 2, "the second page");
    expect(hook.current.data!.pages.flatMap((p) => p.items).map((i) => i.id)).toEqual(["t-1", "t-2", "t-3"]);
    expect(hook.current.hasNextPage).toBe(false);
    expect(asked.map((q) => [q.get("verdict"), q.get("limit"), q.get("cursor")])).toEqual([
      ["pass", String(TEST_PAGE_SIZE), null],
      ["pass", String(TEST_PAGE_SIZE), "c-2"],
    ]);
    hook.unmount();
  });
});

describe("useTestDetail (GET /api/vacuum-tests/:id)", () => {
  it("reads the current analysis, and an earlier version through ?analysisId=", async () => {
    const asked: string[] = [];
    server.use(
      http.get(`${ORIGIN}/api/vacuum-tests/t-1`, ({ request }) => {
        const analysisId = new URL(request.url).searchParams.get("analysisId");
        asked.push(analysisId ?? "current");
        return HttpResponse.json(analysisId ? { ...detail, shown: { analysisId, version: 1, versionCount: 2, isCurrent: false } } : detail);
      }),
    );
    const current = renderHook(() => useTestDetail("t-1"));
    await waitFor(() => current.current.isSuccess, "the detail");
    expect(current.current.data!.test.verdict).toBe("leak");
    expect(current.current.data!.shown).toBeUndefined();
    current.unmount();
    const earlier = renderHook(() => useTestDetail("t-1", "a-0"));
    await waitFor(() => earlier.current.isSuccess, "the earlier version");
    expect(earlier.current.data!.shown).toEqual({ analysisId: "a-0", version: 1, versionCount: 2, isCurrent: false });
    expect(asked).toEqual(["current", "a-0"]);
    earlier.unmount();
  });

  it("gives a 404 as an ApiError with the server's words, asked once (RFC 9110 §15.5.5: not retryable)", async () => {
    let calls = 0;
    server.use(
      http.get(`${ORIGIN}/api/vacuum-tests/t-9`, () => {
        calls++;
        return HttpResponse.json(errorBody("not_found", "No such test."), { status: 404 });
      }),
    );
    const hook = renderHook(() => useTestDetail("t-9"));
    await waitFor(() => hook.current.isError, "the error");
    const e = hook.current.error as ApiError;
    expect(e).toBeInstanceOf(ApiError);
    expect([e.status, e.code, e.message, e.retryable]).toEqual([404, "not_found", "No such test.", false]);
    expect(calls).toBe(1);
    hook.unmount();
  });

  it("passes the practice gate's 403 details on, so the page can link to the call", async () => {
    server.use(
      http.get(`${ORIGIN}/api/vacuum-tests/t-p`, () =>
        HttpResponse.json(errorBody("forbidden", "Make your practice call first; the analysis shows once you have.", { practiceCallUrl: "/practice/t-p" }), { status: 403 }),
      ),
    );
    const hook = renderHook(() => useTestDetail("t-p"));
    await waitFor(() => hook.current.isError, "the gate");
    expect((hook.current.error as ApiError).details).toEqual({ practiceCallUrl: "/practice/t-p" });
    hook.unmount();
  });
});

describe("uploadTest (POST /api/vacuum-tests, multipart through XMLHttpRequest): the upload's error handling", () => {
  const form = () => {
    const f = new FormData();
    f.set("file", new File(["seconds,microns\n0,500\n"], "log.csv", { type: "text/csv" }));
    return f;
  };

  it("turns a 422 into an ApiError naming the line, sent once, with the Idempotency-Key", async () => {
    const keys: (string | null)[] = [];
    server.use(
      http.post(`${ORIGIN}/api/vacuum-tests`, ({ request }) => {
        keys.push(request.headers.get("idempotency-key"));
        return HttpResponse.json(errorBody("invalid_file", "Line 7: no number in the microns column.", { line: 7 }), { status: 422 });
      }),
    );
    const e = await uploadTest(form(), { idempotencyKey: "key-422" }).then(() => null, (err: unknown) => err as ApiError);
    expect(e).toBeInstanceOf(ApiError);
    expect([e!.status, e!.code, e!.message, e!.details, e!.retryable]).toEqual([422, "invalid_file", "Line 7: no number in the microns column.", { line: 7 }, false]);
    expect(keys).toEqual(["key-422"]);
  });

  it("retries a 503 with the same Idempotency-Key and ends with the created test (IETF httpapi Idempotency-Key draft)", async () => {
    const keys: (string | null)[] = [];
    server.use(
      http.post(`${ORIGIN}/api/vacuum-tests`, ({ request }) => {
        keys.push(request.headers.get("idempotency-key"));
        return keys.length === 1
          ? HttpResponse.json(errorBody("storage_unavailable", "Riseline could not store this just now. Nothing was saved; try again."), { status: 503 })
          : HttpResponse.json({ test: testDto, analysis }, { status: 201 });
      }),
    );
    const created = await uploadTest(form(), { idempotencyKey: "key-503", retries: 1 });
    expect(created.test.id).toBe("t-1");
    expect(keys).toEqual(["key-503", "key-503"]);
  });

  it("reports a dropped connection as retryable network trouble, not as the file's fault", async () => {
    server.use(http.post(`${ORIGIN}/api/vacuum-tests`, () => HttpResponse.error()));
    const e = await uploadTest(form(), { idempotencyKey: "key-net", retries: 0 }).then(() => null, (err: unknown) => err as ApiError);
    expect([e!.status, e!.code, e!.retryable]).toEqual([0, "network", true]);
  });
});
