/** Words for practice calls, safe for client components (no database imports). */
import { PRACTICE_CALLS } from "@/db/vocabulary";

export const CALL_CHOICES = PRACTICE_CALLS;
export type CallChoice = (typeof CALL_CHOICES)[number];

export const PRACTICE_CALL_WORDS: Record<CallChoice, string> = {
  pass: "Tight and dry (pass)",
  leak: "Leak",
  moisture: "Moisture",
  leak_and_moisture: "Leak and moisture",
  /** The curve does not say: an honest answer, matched when the analysis could not tell either. */
  inconclusive: "Can't tell",
};
