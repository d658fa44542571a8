/** The comparable part of an analysis result (lib/offline/rules.ts compares two of them). */
import type { AnalysisResult } from "@/analysis/decay/types";
import type { VerdictSummary } from "./rules";

export function summaryOf(r: AnalysisResult): VerdictSummary {
  return {
    verdict: r.verdict,
    earlyCall: r.forecast?.earlyCall ?? null,
    meetsProfile: r.meetsProfile,
    leakRateMicronsPerMinute: r.decay ? r.decay.leakRateMicronsPerMinute : null,
    engineVersion: r.engineVersion,
  };
}
