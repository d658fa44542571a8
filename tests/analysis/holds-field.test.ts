import { describe, expect, it } from "vitest";
import { analyzeLog, analyzeReadings } from "@/analysis";
import type { ImportedLog } from "@/analysis/decay/types";
import { calibratedConfidence, type ConfidenceEvidence } from "@/analysis/decay/confidence";

// Holds as field logs carry them. Gauge behaviour: common practice, no published source. The curves are
// p_iso + A(1 − e^(−t/τ)) + L·t after a pull-down (outgassing levels off, a leak climbs linearly;
// K. Zapfe, "Leak Detection", CERN Accelerator School 2006).

/** A seeded ±1 % wobble (Park–Miller LCG), so every run sees the same readings. */
function wobble(seed = 7): () => number {
  let s = seed;
  return () => 1 + 0.01 * (((s = (s * 48271) % 2147483647) / 2147483647) * 2 - 1);
}

/** Pull-down from 20,000 to about 300 microns over `pulldownS` seconds, then the hold; readings every `step` s. */
function curve(opts: { step?: number; pulldownS?: number; holdS?: number; plateau?: number; tau?: number; leak?: number }) {
  const { step = 10, pulldownS = 1200, holdS = 1200, plateau = 3200, tau = 150, leak = 0 } = opts;
  const noise = wobble();
  const t: number[] = [];
  const p: number[] = [];
  for (let s = 0; s <= pulldownS + holdS; s += step) {
    const v = s <= pulldownS ? 300 + 19700 * Math.exp(-s / 150) : 300 + (plateau - 300) * (1 - Math.exp(-(s - pulldownS) / tau)) + (leak / 60) * (s - pulldownS);
    t.push(s);
    p.push(Math.round(v * noise()));
  }
  return { t, p, isolation: pulldownS };
}

function readings(t: number[], p: number[], overRangeSeconds: number[] = []): ImportedLog {
  return {
    tSeconds: t, microns: p, overRangeSeconds, temperatureC: null, startedAt: null, findings: [],
    summary: { rows: t.length, skipped: 0, overRange: overRangeSeconds.length, unit: "micron", timeFormat: "typed", delimiter: ",", decimalComma: false, headerLine: 0, columns: ["t", "p"], timeColumn: "t", pressureColumn: "p", temperatureColumn: null, unsure: false, assumptions: [] },
  };
}

describe("holds robust to the field (common practice, no published source)", () => {
  it("one or two wild readings (a bumped hose) never end a hold: a moisture hold stays moisture, the spikes are left out of the fit and listed", () => {
    for (const width of [1, 2]) {
      const c = curve({});
      const at = c.t.indexOf(1800);
      for (let k = 0; k < width; k++) c.p[at + k] = Math.round(c.p[at + k] * 1.6);
      const r = analyzeReadings(readings(c.t, c.p));
      expect(r.verdict).toBe("moisture");
      expect(r.holds).toHaveLength(1);
      expect(r.holds[0].endedBy).toBe("end_of_log");
      expect(r.holds[0].spikeSeconds).toEqual(c.t.slice(at, at + width));
      expect(r.findings.find((f) => f.code === "spikes_left_out")?.evidence.spikes).toBe(width);
      expect(Math.abs(r.decay!.plateauMicrons! - 3200) / 3200).toBeLessThan(0.1);
    }
  });

  it("a dip of two readings (a hand on the gauge) is a spike too, not a new isolation", () => {
    const c = curve({});
    const at = c.t.indexOf(1900);
    c.p[at] = Math.round(c.p[at] * 0.6);
    c.p[at + 1] = Math.round(c.p[at + 1] * 0.6);
    const r = analyzeReadings(readings(c.t, c.p));
    expect(r.holds).toHaveLength(1);
    expect(r.isolationAt).toBeGreaterThan(1100);
    expect(r.isolationAt).toBeLessThan(1300);
    expect(r.verdict).toBe("moisture");
  });

  it("a wireless drop-out of five minutes inside a hold is a gap, not a break", () => {
    const c = curve({ leak: 60, plateau: 600 });
    const keep = c.t.map((s) => !(s > 1500 && s < 1800));
    const r = analyzeReadings(readings(c.t.filter((_, i) => keep[i]), c.p.filter((_, i) => keep[i])));
    expect(r.holds).toHaveLength(1);
    expect(r.holds[0].endedBy).toBe("end_of_log");
    expect(r.verdict).toBe("leak"); // outgassing levels off at 600 microns, under the limit; the leak climbs on
    expect(Math.abs(r.decay!.leakRateMicronsPerMinute - 60) / 60).toBeLessThan(0.05);
  });

  it("repeated time stamps (a gauge logging faster than its clock) are kept and do not split the hold", () => {
    const c = curve({ plateau: 700 });
    const t: number[] = [];
    const p: number[] = [];
    c.t.forEach((s, i) => {
      t.push(s);
      p.push(c.p[i]);
      if (i % 7 === 0) {
        t.push(s);
        p.push(c.p[i] + 1);
      }
    });
    const text = "elapsed_s,microns\n" + t.map((s, i) => `${s},${p[i]}`).join("\n");
    const r = analyzeLog(text);
    expect(r.verdict).toBe("pass");
    expect(r.holds).toHaveLength(1);
    expect(r.findings.map((f) => f.code)).toContain("duplicate_timestamps");
  });

  it("a coarse gauge stepping in 100 microns still gives the verdict and the plateau within 10 %", () => {
    const c = curve({ plateau: 4200 });
    const r = analyzeReadings(readings(c.t, c.p.map((v) => Math.max(100, Math.round(v / 100) * 100))));
    expect(r.verdict).toBe("moisture");
    expect(Math.abs(r.decay!.plateauMicrons! - 4200) / 4200).toBeLessThan(0.1);
  });

  it("thermal drift of 4 % an hour over a long moisture hold is not a leak (sun on the line set)", () => {
    const c = curve({ holdS: 3600, plateau: 9000, tau: 300 });
    const p = c.p.map((v, i) => (c.t[i] > c.isolation ? Math.round(v * (1 + (0.04 * (c.t[i] - c.isolation)) / 3600)) : v));
    const r = analyzeReadings(readings(c.t, p));
    expect(r.verdict).toBe("moisture");
    expect(r.decay!.leakRateMicronsPerMinute).toBeLessThan(20);
  });

  it("hand-typed minute readings (11 of them) from the start of a leaking hold: leak, with its rate", () => {
    const text = "minute,reading\n" + Array.from({ length: 11 }, (_, m) => `${m},${Math.round(315 + 33 * m + (m % 2 ? 4 : -3))}`).join("\n");
    const r = analyzeLog(text);
    expect(r.verdict).toBe("leak");
    expect(r.isolationAt).toBeNull();
    expect(Math.abs(r.decay!.leakRateMicronsPerMinute - 33) / 33).toBeLessThan(0.05);
  });

  it("a re-pull gives several holds: the last complete one is judged, the earlier ones kept for the chart, and the reasons say so", () => {
    const first = curve({ holdS: 300, plateau: 2500, tau: 60 });
    const t = first.t.slice();
    const p = first.p.slice();
    const t0 = t[t.length - 1];
    const noise = wobble(11);
    for (let s = 10; s <= 2400; s += 10) {
      const v = s <= 900 ? 280 + (p[first.p.length - 1] - 280) * Math.exp(-s / 120) : 280 + 320 * (1 - Math.exp(-(s - 900) / 120));
      t.push(t0 + s);
      p.push(Math.round(v * noise()));
    }
    const r = analyzeReadings(readings(t, p));
    expect(r.holds).toHaveLength(2);
    expect(r.holds[0].complete).toBe(false);
    expect(r.holds[0].endedBy).toBe("pulldown");
    expect(r.phases.primary).toBe(1);
    expect(r.verdict).toBe("pass");
    expect(Math.abs(r.isolationAt! - (t0 + 900))).toBeLessThanOrEqual(45);
    expect(r.reasons.join(" ")).toMatch(/opened again after an earlier hold \(a re-pull, shown on the chart\); the verdict is on the last complete hold/);
  });

  it("a hold that climbs out of the gauge's range within a minute, with three readings in range, is a gross leak with its rate 'at least' the rise over the time to the first over-range row", () => {
    const c = curve({ holdS: 0 });
    const t = c.t.slice();
    const p = c.p.slice();
    const iso = t[t.length - 1];
    t.push(iso + 15, iso + 30);
    p.push(9000, 18000);
    const over = [iso + 45, iso + 60, iso + 75, iso + 90];
    const r = analyzeReadings(readings(t, p, over));
    expect(r.verdict).toBe("leak");
    expect(r.decay!.leakRateAtLeast).toBe(true);
    const bound = ((18000 - p[p.length - 3]) / 45) * 60;
    expect(r.decay!.leakRateMicronsPerMinute).toBeGreaterThanOrEqual(bound * 0.999);
    expect(r.reasons.join(" ")).toMatch(/climbed out of the gauge's range 45 seconds after isolation .*climbing at least/);
    expect(r.findings.find((f) => f.code === "gross_leak")?.severity).toBe("danger");
  });

  it("a gross leak's confidence is the calibration table's for its evidence (no fixed floor), sure for a climb far past the leak rate (common practice, no source)", () => {
    const c = curve({ holdS: 0 });
    const t = c.t.slice();
    const p = c.p.slice();
    const iso = t[t.length - 1];
    t.push(iso + 15, iso + 30);
    p.push(9000, 18000);
    const r = analyzeReadings(readings(t, p, [iso + 45, iso + 60]));
    expect(r.verdict).toBe("leak");
    const e = r.certainty!.evidence as unknown as ConfidenceEvidence;
    expect(e.margin).toBe(3);
    expect(r.confidence).toBe(calibratedConfidence("leak", e));
    expect(r.certainty!.words).toBe("sure");
  });

  it("a tight hold ended by breaking the vacuum (a jump straight out of range) is a break, not a gross leak", () => {
    const c = curve({ plateau: 600 });
    const last = c.t[c.t.length - 1];
    const over = [last + 10, last + 20, last + 30];
    const r = analyzeReadings(readings(c.t, c.p, over));
    expect(r.verdict).toBe("pass");
    expect(r.holds[0].endedBy).toBe("break");
    expect(r.holds[0].leftRangeAtSeconds).toBeNull();
  });

  it("over range written as nothing after a climb near the gauge's top counts as over range (blank cells)", () => {
    const lines = ["elapsed_s,Vacuum (microns)"];
    for (let s = 0; s <= 600; s += 10) lines.push(`${s},${Math.round(300 + 24000 * Math.exp(-s / 60))}`);
    lines.push("610,9000", "620,18000", "630,24500", "640,", "650,", "660,", "670,");
    const r = analyzeLog(lines.join("\n"));
    expect(r.import.overRange).toBe(4);
    expect(r.verdict).toBe("leak");
    expect(r.decay!.leakRateAtLeast).toBe(true);
  });
});

describe("never a pass on a hold whose readings pass the limit (common practice, no published source)", () => {
  it("a coarse gauge's floor flickering between 100 and 200 for half an hour, then a climb to 17,000 in the last minute and a half: a leak, not a pass", () => {
    const t: number[] = [];
    const p: number[] = [];
    for (let s = 0; s <= 1200; s += 2) {
      t.push(s);
      p.push(Math.max(100, Math.round((150 + 20000 * Math.exp(-s / 150)) / 100) * 100));
    }
    for (let s = 1202; s <= 3400; s += 2) {
      t.push(s);
      p.push(s % 10 < 4 ? 200 : 100);
    }
    for (let s = 3402; s <= 3480; s += 2) {
      t.push(s);
      p.push(Math.round((150 + 200 * (s - 3400)) / 100) * 100);
    }
    const r = analyzeReadings(readings(t, p));
    expect(r.verdict).not.toBe("pass");
    expect(r.verdict).toBe("leak");
    expect(Math.abs(r.isolationAt! - 3400)).toBeLessThanOrEqual(45);
  });

  it("a slow creep that passes the limit only after the profile's ten minutes is not a pass either", () => {
    const c = curve({ plateau: 600, tau: 100, leak: 15, holdS: 3600 });
    const r = analyzeReadings(readings(c.t, c.p));
    expect(r.profileRules.find((x) => x.rule === "limit")?.met).toBe(false);
    expect(r.verdict).not.toBe("pass");
  });
});

describe("phase helpers for field logs (common practice, no published source)", () => {
  it("a two-reading spike and a two-reading dip in a sparse log (one reading a minute) are taken out of the smoothed series; a turn of the curve is kept", async () => {
    const { removeShortExcursions } = await import("@/analysis/decay/phases/smooth");
    const y = Float64Array.from([3.36, 3.36, 3.87, 3.86, 3.36, 3.37, 3.0, 3.0, 3.37, 3.37].map((v) => v));
    expect(removeShortExcursions(y, 0.06)).toBe(4);
    for (const v of y) expect(v).toBeGreaterThan(3.3);
    const turn = Float64Array.from([4.3, 3.9, 3.4, 2.5, 2.6, 2.8, 3.0]);
    expect(removeShortExcursions(turn, 0.06)).toBe(0);
  });

  it("the display step of a coarse gauge is found from the readings below 1,000 microns: 100, 10 or 1", async () => {
    const { resolutionMicrons } = await import("@/analysis/decay/phases/smooth");
    const base = Array.from({ length: 200 }, (_, i) => 250 + 3 * Math.sin(i) + i);
    expect(resolutionMicrons(base.map((v) => Math.round(v / 100) * 100))).toBe(100);
    expect(resolutionMicrons(base.map((v) => Math.round(v / 10) * 10))).toBe(10);
    expect(resolutionMicrons(base.map((v) => Math.round(v)))).toBe(1);
  });

  it("on a coarse gauge whose pull-down was still falling at the valve-off, the isolation is one step's rise time before the run of equal readings ends (common practice, no source)", () => {
    const t: number[] = [];
    const p: number[] = [];
    for (let s = 0; s <= 3600; s += 10) {
      // valved off at 1500 s while still falling (about 340 microns); the rise needs minutes to cross a 100-micron step
      const v = s <= 1500 ? 120 + 20000 * Math.exp(-s / 300) : 120 + 20000 * Math.exp(-1500 / 300) + 700 * (1 - Math.exp(-(s - 1500) / 600));
      t.push(s);
      p.push(Math.max(100, Math.round(v / 100) * 100));
    }
    const r = analyzeReadings(readings(t, p));
    let runEnd = 0;
    for (let i = 0; i < t.length; i++) if (t[i] >= 1500 && p[i] === p[t.indexOf(1500)]) runEnd = t[i];
    expect(runEnd - 1500).toBeGreaterThan(60);
    expect(Math.abs(r.isolationAt! - 1500)).toBeLessThanOrEqual(60);
  });

  it("on a coarse gauge the isolation is the end of the run of equal readings at the floor, where the rise leaves it", () => {
    const t: number[] = [];
    const p: number[] = [];
    for (let s = 0; s <= 3600; s += 10) {
      const v = s <= 2400 ? 120 + 20000 * Math.exp(-s / 200) : 120 + 900 * (1 - Math.exp(-(s - 2400) / 300));
      t.push(s);
      p.push(Math.max(100, Math.round(v / 100) * 100));
    }
    const r = analyzeReadings(readings(t, p));
    expect(Math.abs(r.isolationAt! - 2400)).toBeLessThanOrEqual(60);
    expect(r.verdict).toBe("moisture");
  });
});
