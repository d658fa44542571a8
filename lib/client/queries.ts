/**
 * The TanStack Query hooks the vacuum-test pages read and write through: one test's detail (the
 * current analysis or an earlier version) and the upload; the list is in list-query.ts (apart, so
 * the upload page's first load carries no infinite-query code). Keys live here so a page
 * invalidates exactly what another one reads.
 * Tested against mocked answers in tests/client/queries.test.ts (msw).
 */
import { useMutation, useQuery } from "@tanstack/react-query";
import { apiFetch, getTest, uploadTest, type CreatedTest, type TestDetail, type TestFilters, type UploadOptions } from "./api";

export const testKeys = {
  /** Everything about tests: invalidated after an upload. */
  all: ["tests"] as const,
  list: (filters: TestFilters) => ["tests", "list", filters] as const,
  /** One test's page: the current analysis, or the version `analysisId`. */
  detail: (testId: string, analysisId: string | null) => (analysisId ? (["test", testId, "analysis", analysisId] as const) : (["test", testId] as const)),
};

/** The current analysis, or the version `analysisId` with `shown` set (GET /api/tests/:id?analysisId=). */
export function getTestView(testId: string, analysisId: string | null, signal?: AbortSignal): Promise<TestDetail> {
  if (!analysisId) return getTest(testId, signal);
  return apiFetch<TestDetail>(`/api/tests/${encodeURIComponent(testId)}?analysisId=${encodeURIComponent(analysisId)}`, {}, { signal });
}

/** One test's page: test, analysis, series, history (404 and the practice gate arrive as ApiError). */
export function useTestDetail(testId: string, analysisId: string | null = null) {
  return useQuery({ queryKey: testKeys.detail(testId, analysisId), queryFn: ({ signal }) => getTestView(testId, analysisId, signal) });
}

export interface UploadVariables extends UploadOptions {
  form: FormData;
}

/**
 * Send a gauge log (POST /api/tests). The mutation itself never retries: uploadTest retries a
 * dropped or 502–504 answer with the same Idempotency-Key, so a retry never makes a second test;
 * anything else arrives as an ApiError with the server's code, words and details.
 */
export function useUploadTest() {
  return useMutation<CreatedTest, Error, UploadVariables>({
    mutationFn: ({ form, ...opts }) => uploadTest(form, opts),
    retry: false,
  });
}
