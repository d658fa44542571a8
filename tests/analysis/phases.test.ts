import { describe, expect, it } from "vitest";
import { findPhases } from "@/analysis/decay/phases";
import { simulateLog } from "@/analysis/decay/simulate";
import { isolationTolerance, simulatedAsImported } from "./helpers";

function phasesOf(scenario: Parameters<typeof simulateLog>[0]) {
  const s = simulateLog(scenario);
  const log = simulatedAsImported(s);
  return { s, log, r: findPhases(log.tSeconds, log.microns, log.overRangeSeconds, { holdSeconds: 600 }) };
}

describe("phase finding", () => {
  it("reports every hold of multi-attempt logs, the last complete one primary, ≥ 90 % of isolations within max(3 samples, 45 s) (product goal 95 %)", () => {
    let within = 0;
    let total = 0;
    for (let seed = 1; seed <= 10; seed++) {
      const { s, r } = phasesOf({ scenario: "multi_attempt", seed });
      expect(r.phases.holds.length).toBe(s.truth.holds.length);
      expect(r.phases.primary).toBe(s.truth.holds.length - 1);
      s.truth.holds.forEach((h, k) => {
        total++;
        if (Math.abs(r.phases.holds[k].isolatedAtSeconds - h.isolationAtSeconds!) <= isolationTolerance(s.truth.sampleSeconds)) within++;
        expect(r.phases.holds[k].endedBy).toBe(h.endedBy);
      });
    }
    expect(within / total).toBeGreaterThanOrEqual(0.9);
  });

  it("puts a sparse log's isolation where the readings stop falling, not a reading early (a valved-off system does not fall; common practice, no source)", () => {
    // one reading every 4–5 minutes: the pull-down's last readings fall by hundreds of microns each
    const t = [0, 270, 540, 800, 1070, 1340, 1600, 1870, 2150, 2420, 2690, 2950, 3220];
    const p = [9000, 6100, 3820, 1190, 669, 477, 370, 487, 508, 518, 503, 530, 527];
    const r = findPhases(t, p, [], { holdSeconds: 600 });
    expect(r.phases.holds).toHaveLength(1);
    // the turn threshold grows with the scatter such a short log shows, so the last fall (477 → 370) may stay inside it
    expect(r.phases.holds[0].isolatedAtSeconds).toBeGreaterThanOrEqual(1340);
    expect(r.phases.holds[0].isolatedAtSeconds).toBeLessThanOrEqual(1600);
    expect(r.phases.holds[0].startMicrons).toBeLessThanOrEqual(477);
  });

  it("keeps the isolation on a reading that rose, when one low reading follows it (a spike, not the pull-down)", () => {
    const { s, r } = phasesOf({ scenario: "moisture", seed: 5 });
    const h = r.phases.holds[r.phases.primary!];
    expect(Math.abs(h.isolatedAtSeconds - s.truth.isolationAtSeconds!)).toBeLessThanOrEqual(isolationTolerance(s.truth.sampleSeconds));
  });

  it("starts the hold at the first reading when the log starts in the hold (no isolation seen)", () => {
    const { r } = phasesOf({ scenario: "leak", seed: 4, startInHold: true });
    expect(r.phases.holds.length).toBe(1);
    expect(r.ranges[0].startIndex).toBe(0);
    expect(r.ranges[0].isolationSeen).toBe(false);
    expect(r.phases.pulldown).toBeNull();
  });

  it("ends the hold at a break (over-range markers after the hold)", () => {
    const { s, r } = phasesOf({ scenario: "tight_dry", seed: 5, breakAtEnd: true, sampleSeconds: 5 });
    const h = r.phases.holds[r.phases.primary!];
    expect(h.endedBy).toBe("break");
    expect(r.phases.breakAtSeconds).not.toBeNull();
    // the hold ends at the last in-range reading before the markers (within one sample)
    expect(Math.abs(h.endSeconds - s.truth.holds[0].endSeconds)).toBeLessThanOrEqual(2 * s.truth.sampleSeconds);
  });

  it("ends the hold at a jump of thousands of microns far faster than the hold's rise (break with readings)", () => {
    const t: number[] = [];
    const p: number[] = [];
    for (let i = 0; i <= 60; i++) { t.push(i * 10); p.push(5000 * Math.exp(-i / 10) + 300); }
    for (let i = 61; i <= 140; i++) { t.push(i * 10); p.push(330 + (i - 60) * 0.5); }
    for (let i = 141; i <= 150; i++) { t.push(i * 10); p.push(20000); }
    const r = findPhases(t, p, [], { holdSeconds: 600 });
    const h = r.phases.holds[r.phases.primary!];
    expect(h.endedBy).toBe("break");
    expect(h.endSeconds).toBe(1400);
  });

  it("honours a forced isolation time and a hold window", () => {
    const { log } = phasesOf({ scenario: "leak", seed: 2, sampleSeconds: 10 });
    const forced = findPhases(log.tSeconds, log.microns, log.overRangeSeconds, { holdSeconds: 600, isolationAtSeconds: 900 });
    expect(forced.phases.holds[0].isolatedAtSeconds).toBeGreaterThanOrEqual(900);
    expect(forced.phases.holds[0].isolatedAtSeconds).toBeLessThan(920);
    const windowed = findPhases(log.tSeconds, log.microns, log.overRangeSeconds, { holdSeconds: 600, holdWindow: { startSeconds: 1000, endSeconds: 1300 } });
    expect(windowed.phases.holds.length).toBe(1);
    expect(windowed.phases.holds[0].isolatedAtSeconds).toBeGreaterThanOrEqual(1000);
    expect(windowed.phases.holds[0].endSeconds).toBeLessThanOrEqual(1300);
  });

  it("finds no hold in a log that only falls", () => {
    const t = Array.from({ length: 200 }, (_, i) => i * 5);
    const p = t.map((x) => 20000 * Math.exp(-x / 200) + 50);
    expect(findPhases(t, p, [], { holdSeconds: 600 }).phases.holds.length).toBe(0);
  });

  it("is linear in the readings: 1,000,000 readings in under 3 s (goal: O(n), a 1-hour 1 Hz log in < 100 ms)", () => {
    const n = 1_000_000;
    const t = new Array<number>(n);
    const p = new Array<number>(n);
    let seed = 1;
    const rand = () => ((seed = (seed * 16807) % 2147483647) / 2147483647 - 0.5);
    for (let i = 0; i < n; i++) {
      t[i] = i * 0.5;
      const s = i * 0.5 - 200000;
      const base = s < 0 ? 20000 * Math.exp((i * 0.5) / -20000) + 200 : 250 + 300 * (1 - Math.exp(-s / 600));
      p[i] = base * (1 + 0.02 * rand());
    }
    const start = performance.now();
    const r = findPhases(t, p, [], { holdSeconds: 600 });
    const ms = performance.now() - start;
    expect(r.phases.holds.length).toBe(1);
    expect(Math.abs(r.phases.holds[0].isolatedAtSeconds - 200000)).toBeLessThan(120);
    // 3 s on a shared 2-core machine; the real budget is checked by the benchmark
    expect(ms).toBeLessThan(3000);
  });
});
