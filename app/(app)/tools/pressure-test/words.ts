import type { NitrogenPressureUnit, NitrogenVerdict } from "@/analysis/calculators/nitrogen";

export const UNIT_WORDS: Record<NitrogenPressureUnit, string> = { psig: "psig", kpa_gauge: "kPa gauge", bar_gauge: "bar gauge" };
export const VERDICT_WORDS: Record<NitrogenVerdict, string> = {
  holds: "Holds",
  drops: "Drops: leak",
  rises: "Rises: check",
  stopped: "Stopped: above the rated test pressure",
};
/** Badge tone per verdict (a test above its rating is the worst outcome). */
export const VERDICT_TONE: Record<NitrogenVerdict, "pass" | "leak" | "attention"> = { holds: "pass", drops: "leak", rises: "attention", stopped: "leak" };
