/**
 * One source for every number of a hold: the figures the engine returns are the ones its rules and
 * reasons quote, each with what it is (invented data, analysis/decay/simulate).
 */
import { describe, expect, it } from "vitest";
import { analyzeLog } from "@/analysis";
import { judgedHighest } from "@/analysis/decay/figures";
import { groupedInteger } from "@/analysis/shared/format";
import { SCENARIOS, simulateLog } from "@/analysis/decay/simulate";

const fmt = (x: number) => groupedInteger(Math.round(x));

describe("hold figures", () => {
  it("takes the highest as a 5-reading running median and keeps the single highest reading beside it (Tukey 1977 running median)", () => {
    const t = Array.from({ length: 20 }, (_, i) => i * 10);
    const p = t.map((_, i) => 400 + i * 5);
    p[10] = 2000; // one wild reading
    const h = judgedHighest(t, p, 0, 19, 1e9);
    expect(h.rawMicrons).toBe(2000);
    expect(h.rawAtSeconds).toBe(100);
    // At the end the window shrinks to the last three readings, whose median is the middle one.
    expect(h.smoothedMicrons).toBe(p[18]);
  });

  for (const scenario of SCENARIOS) {
    it(`${scenario}: start, last reading, highest and rise are quoted the same in the figures, the decay, the rules and the reasons`, () => {
      for (const seed of [1, 2, 3]) {
        let r;
        try {
          r = analyzeLog(simulateLog({ scenario, seed }).text);
        } catch {
          continue;
        }
        const f = r.figures;
        if (!f) {
          expect(r.phases.primary).toBeNull();
          continue;
        }
        const hold = r.phases.holds[r.phases.primary!];
        expect(f.startMicrons.value).toBe(hold.startMicrons);
        expect(f.lastMicrons.value).toBe(hold.endMicrons);
        expect(f.lastMicrons.atSeconds).toBe(hold.endSeconds);
        expect(r.decay!.endMicrons).toBe(f.lastMicrons.value);
        expect(f.riseMicrons.value).toBeCloseTo(f.lastMicrons.value - f.startMicrons.value, 9);
        expect(f.rateMicronsPerMinute.value).toBeGreaterThanOrEqual(r.decay!.leakRateMicronsPerMinute - 1e-9);
        expect(r.profileRules.find((x) => x.rule === "limit")!.detail).toContain(`highest ${fmt(f.highestMicrons.value)} microns`);
        for (const reason of r.reasons) {
          const m = /highest ([\d,]+) microns/.exec(reason);
          if (m) expect(m[1]).toBe(fmt(f.highestMicrons.value));
        }
        if (f.holdSeconds.value >= r.profile.holdMinutes * 60) {
          // measured at the hold time: never above the highest of the whole hold, which the limit rule judges
          expect(f.atHoldTime!.highestMicrons.value).toBeLessThanOrEqual(f.highestMicrons.value);
          expect(f.atHoldTime!.readingMicrons.atSeconds! - f.startMicrons.atSeconds!).toBeLessThanOrEqual(r.profile.holdMinutes * 60);
          expect(r.forecast).toBeNull();
        } else expect(f.atHoldTime).toBeNull();
        for (const fig of [f.startMicrons, f.lastMicrons, f.highestMicrons, f.riseMicrons, f.rateMicronsPerMinute, f.holdSeconds]) expect(fig.definition.length).toBeGreaterThan(10);
      }
    });
  }
});
