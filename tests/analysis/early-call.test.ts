/**
 * The forecast against the verdict on every scenario of the simulator (invented data): an early call
 * never contradicts the verdict printed beside it, and at minute 4 it agrees with the verdict the
 * whole log gets. Thresholds are Riseline's own bars: common practice, no published source.
 */
import { describe, expect, it } from "vitest";
import { analyzeLog } from "@/analysis";
import { SCENARIOS, simulateLog } from "@/analysis/decay/simulate";
import { contradicts, truncateSimulated } from "@/scripts/eval/early-call";

describe("early call against the verdict, every simulator scenario (common practice, no published source)", () => {
  for (const scenario of SCENARIOS) {
    it(`${scenario}: no early call contradicts its verdict, cut at minute 2, 4 and 7 or whole; a call at minute 4 agrees with the whole log's verdict`, () => {
      let calls = 0;
      let disagree = 0;
      for (let k = 0; k < 6; k++) {
        const sim = simulateLog({ scenario, seed: 4400 + k, holdMinutes: scenario === "short_hold" || scenario === "gross_leak" || scenario === "sparse" ? undefined : 12 });
        let whole;
        try {
          whole = analyzeLog(sim.text);
        } catch {
          continue; // an unreadable log has no verdict to contradict
        }
        expect(contradicts(whole)).toBe(false);
        // A forecast only looks ahead: a hold past the hold time has none.
        if (whole.figures && whole.figures.holdSeconds.value >= whole.profile.holdMinutes * 60) expect(whole.forecast).toBeNull();
        const iso = sim.truth.isolationAtSeconds;
        if (iso === null) continue;
        for (const minute of [2, 4, 7]) {
          let cut;
          try {
            cut = analyzeLog(truncateSimulated(sim, iso + minute * 60));
          } catch {
            continue;
          }
          expect(contradicts(cut)).toBe(false);
          if (cut.verdict === "leak" || cut.verdict === "moisture" || cut.verdict === "leak_and_moisture") expect(cut.forecast?.earlyCall ?? "fail").toBe("fail");
          if (minute === 4 && cut.forecast?.earlyCall && whole.verdict !== "inconclusive" && whole.phases.holds.length === 1) {
            calls++;
            if (cut.forecast.earlyCall !== (whole.verdict === "pass" ? "pass" : "fail")) disagree++;
          }
        }
      }
      // At most one of the (up to six) calls may disagree with the whole log; most scenarios have none.
      expect(disagree).toBeLessThanOrEqual(calls > 0 ? 1 : 0);
    });
  }
});
