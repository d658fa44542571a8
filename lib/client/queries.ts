/**
 * The TanStack Query hooks the vacuum-test pages read through: one test's detail (the current
 * analysis or an earlier version); the list is in list-query.ts. Keys live here so a page
 * invalidates exactly what another one reads. The upload page calls uploadTest (api.ts) itself.
 * Tested against mocked answers in tests/client/queries.test.ts (msw).
 */
import { useQuery } from "@tanstack/react-query";
import { apiFetch, getTest, type VacuumTestDetail, type TestFilters } from "./api";

export const testKeys = {
  /** Everything about tests: invalidated after an upload. */
  all: ["tests"] as const,
  list: (filters: TestFilters) => ["tests", "list", filters] as const,
  /** One test's page: the current analysis, or the version `analysisId`. */
  detail: (testId: string, analysisId: string | null) => (analysisId ? (["test", testId, "analysis", analysisId] as const) : (["test", testId] as const)),
};

/** The current analysis, or the version `analysisId` with `shown` set (GET /api/vacuum-tests/:id?analysisId=). */
export function getTestView(testId: string, analysisId: string | null, signal?: AbortSignal): Promise<VacuumTestDetail> {
  if (!analysisId) return getTest(testId, signal);
  return apiFetch<VacuumTestDetail>(`/api/vacuum-tests/${encodeURIComponent(testId)}?analysisId=${encodeURIComponent(analysisId)}`, {}, { signal });
}

/** One test's page: test, analysis, series, history (404 and the practice gate arrive as ApiError). */
export function useTestDetail(testId: string, analysisId: string | null = null) {
  return useQuery({ queryKey: testKeys.detail(testId, analysisId), queryFn: ({ signal }) => getTestView(testId, analysisId, signal) });
}
