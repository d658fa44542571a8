/** Addresses of one analysis version of a test; reading it is lib/client/queries.ts (useTestDetail). */
export type { ShownAnalysis } from "@/lib/contracts/vacuum-tests";

/** The page's address for a version: the bare test page for the current one. */
export function versionHref(testId: string, analysisId: string | null): string {
  return analysisId ? `/vacuum-tests/${testId}?analysis=${encodeURIComponent(analysisId)}` : `/vacuum-tests/${testId}`;
}
