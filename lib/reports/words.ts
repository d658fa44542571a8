/** Words the report, the PDF and the e-mails share, built on the product's verdict words. */
import type { Verdict } from "@/analysis/types";
import { VERDICT_TEXT } from "@/components/verdict/words";

export function verdictLabel(verdict: string | null | undefined): string {
  if (!verdict) return "not analysed";
  return VERDICT_TEXT[verdict as Verdict]?.headline ?? verdict;
}

/** The cautions every report carries (see the trade primer); the verdict never replaces them. */
export const REPORT_CAUTIONS: readonly string[] = [
  "Pressure-test with dry nitrogen only through a regulator, and never above the lowest rated test pressure of the system.",
  "Never energise a compressor while the system is in deep vacuum.",
  "Isolate the micron gauge before breaking the vacuum with refrigerant.",
  "Refrigerant handling requires certification where the law asks for it (for example EPA Section 608 in the US) and follows local codes and the equipment maker's instructions. This report supports the technician's judgement; it never replaces the manufacturer's procedure or licensed practice.",
];
