/** The report curve's log axis, shared by the PDF and the on-screen SVG. Pure. */
import type { ReportCurve } from "./model";

/** Decades of microns the y axis spans: from the decade below the lowest reading (≥ 10) to above the highest. */
export function logAxisOf(curve: ReportCurve): { minLog: number; maxLog: number } {
  const values = [...curve.microns.filter((v) => v > 0), curve.limitMicrons];
  const lo = Math.max(1, Math.floor(Math.log10(Math.max(10, Math.min(...values)))));
  const hi = Math.ceil(Math.log10(Math.max(...values) * 1.05));
  return { minLog: lo, maxLog: Math.max(hi, lo + 1) };
}
