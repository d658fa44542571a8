/** Words for practice calls, safe for client components (no database imports). */
export const CALL_CHOICES = ["pass", "leak", "moisture", "leak_and_moisture", "inconclusive"] as const;
export type CallChoice = (typeof CALL_CHOICES)[number];

export const PRACTICE_CALL_WORDS: Record<CallChoice, string> = {
  pass: "Tight and dry (pass)",
  leak: "Leak",
  moisture: "Moisture",
  leak_and_moisture: "Leak and moisture",
  /** The curve does not say: an honest answer, matched when the analysis could not tell either. */
  inconclusive: "Can't tell",
};
