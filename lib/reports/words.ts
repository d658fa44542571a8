/** Words the report, the PDF and the e-mails share, built on the product's one vocabulary (lib/verdict). */
import { curveWords, outcomeOf } from "@/lib/verdict/words";

/** The curve statement's headline ("Steady climb: leak likely"), or "not analysed". */
export function verdictLabel(verdict: string | null | undefined): string {
  if (!verdict) return "not analysed";
  return curveWords(verdict).headline;
}

/** Both statements in one line for a message: "Tight and dry. The shop's profile was not met." ("Passed." only for both). */
export function storyLine(verdict: string | null | undefined, meetsProfile: boolean | null | undefined): string {
  if (!verdict) return "Not analysed yet.";
  const profile = meetsProfile === true ? "was met" : meetsProfile === false ? "was not met" : null;
  const outcome = outcomeOf(verdict, meetsProfile);
  return `${verdictLabel(verdict)}.${profile ? ` The shop's profile ${profile}.` : ""}${outcome.label === "Passed" ? " Passed." : ""}`;
}

/** The cautions every report carries (see the trade primer); the verdict never replaces them. */
export const REPORT_CAUTIONS: readonly string[] = [
  "Pressure-test with dry nitrogen only through a regulator, and never above the lowest rated test pressure of the system.",
  "Never energise a compressor while the system is in deep vacuum.",
  "Isolate the micron gauge before breaking the vacuum with refrigerant.",
  "Refrigerant handling requires certification where the law asks for it (for example EPA Section 608 in the US) and follows local codes and the equipment maker's instructions. This report supports the technician's judgement; it never replaces the manufacturer's procedure or licensed practice.",
];
