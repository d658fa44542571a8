/** Reading one analysis version of a test (GET /api/vacuum-tests/:id?analysisId=) from the browser. */
import { apiFetch, getTest, type TestDetail } from "@/lib/client/api";

/** Which version the page shows, as the server marks it. */
export interface ShownAnalysis {
  analysisId: string;
  version: number;
  versionCount: number;
  isCurrent: boolean;
}

export type TestDetailView = TestDetail & { shown?: ShownAnalysis };

/** The page's address for a version: the bare test page for the current one. */
export function versionHref(testId: string, analysisId: string | null): string {
  return analysisId ? `/vacuum-tests/${testId}?analysis=${encodeURIComponent(analysisId)}` : `/vacuum-tests/${testId}`;
}

export const testViewKey = (testId: string, analysisId: string | null) => (analysisId ? (["test", testId, "analysis", analysisId] as const) : (["test", testId] as const));

/** The current analysis, or the version `analysisId` with `shown` set. */
export function getTestView(testId: string, analysisId: string | null, signal?: AbortSignal): Promise<TestDetailView> {
  if (!analysisId) return getTest(testId, signal);
  return apiFetch<TestDetailView>(`/api/vacuum-tests/${encodeURIComponent(testId)}?analysisId=${encodeURIComponent(analysisId)}`, {}, { signal });
}
