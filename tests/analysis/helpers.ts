/** Test helpers for the analysis tests. */
export { simulatedAsImported } from "@/analysis/decay/simulate";

/** Isolation tolerance of the product goal: max(3 sampling intervals, 45 s). */
export function isolationTolerance(sampleSeconds: number): number {
  return Math.max(3 * sampleSeconds, 45);
}
