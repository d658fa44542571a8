import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeLog, analyzeReadings, downsampleForChart, ENGINE_VERSION } from "@/analysis";
import { LogError } from "@/analysis/shared/errors";
import { simulateLog } from "@/analysis/decay/simulate";
import { simulatedAsImported } from "./helpers";

const golden = (f: string) => readFileSync(path.resolve(import.meta.dirname, "../../fixtures/golden", f), "utf8");

describe("analyzeLog", () => {
  it("returns every field of AnalysisResult", () => {
    const r = analyzeLog(golden("scenario-leak.csv"));
    expect(r.engineVersion).toBe(ENGINE_VERSION);
    for (const key of ["verdict", "confidence", "reasons", "isolationAt", "decay", "meetsProfile", "profile", "profileRules", "forecast", "holds", "phases", "leakRate", "findings", "import", "figures", "certainty"]) {
      expect(r).toHaveProperty(key);
    }
    expect(r.profileRules.map((x) => x.rule)).toEqual(["target", "hold_time", "limit", "leak_rate"]);
    // The hold ran past the profile's 10 minutes: what was measured then stands, no forecast looks back.
    expect(r.forecast).toBeNull();
    expect(r.figures!.atHoldTime!.holdSeconds).toBe(600);
    expect(r.certainty!.confidence).toBe(r.confidence);
    expect(r.holds[r.phases.primary!].fit).not.toBeNull();
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
  });

  it("throws LogError invalid_option on bad options, naming the field", () => {
    const text = golden("scenario-leak.csv");
    const bad = [{ profile: { limitMicrons: -1 } }, { holdWindow: { startSeconds: 50, endSeconds: 10 } }, { nonsense: 1 }, { profile: { targetMicrons: 2000, limitMicrons: 1000 } }];
    for (const options of bad) {
      try {
        analyzeLog(text, options as never);
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(LogError);
        expect((e as LogError).code).toBe("invalid_option");
      }
    }
  });

  it("applies a stricter profile: a 30-minute hold turns a long pass into hold_time not met", () => {
    const r = analyzeLog(golden("scenario-tight_dry.csv"), { profile: { holdMinutes: 30 } });
    expect(r.profile.holdMinutes).toBe(30);
    expect(r.profileRules.find((x) => x.rule === "hold_time")!.met).toBe(false);
    expect(r.meetsProfile).toBe(false);
  });

  it("gives the leak rate in physical units from the volume: Q = V·dp/dt (Roth, Vacuum Technology)", () => {
    const r = analyzeLog(golden("scenario-leak.csv"), { volume: { litres: 10 } });
    const rate = r.decay!.leakRateMicronsPerMinute;
    // 1 micron = 0.133322 Pa; 10 L = 0.01 m³: Pa·m³/s = rate/60 · 0.133322 · 0.01, to 0.1 %
    expect(r.leakRate!.paM3PerSecond).toBeCloseTo(((rate / 60) * 0.133322368 * 0.01), 6);
  });

  it("takes typed readings through analyzeReadings with the same verdict as the text", () => {
    const s = simulateLog({ scenario: "moisture", seed: 2 });
    expect(analyzeReadings(simulatedAsImported(s)).verdict).toBe("moisture");
  });

  it("leaves zero readings out and reports the sensor", () => {
    const s = simulateLog({ scenario: "leak", seed: 3, sampleSeconds: 10 });
    const log = simulatedAsImported(s);
    log.microns[50] = 0;
    log.microns[51] = -3;
    const r = analyzeReadings(log);
    expect(r.verdict).toBe("leak");
    expect(r.findings.find((f) => f.code === "suspect_sensor")!.evidence.nonPositiveReadings).toBe(2);
  });
});

describe("downsampleForChart", () => {
  it("keeps the extremes, the first and last points and the isolation", () => {
    const t = Array.from({ length: 10000 }, (_, i) => i);
    const p = t.map((x) => 500 + 100 * Math.sin(x / 300));
    p[4321] = 5; // a dip that must survive
    const d = downsampleForChart(t, p, 400, [7777]);
    expect(d.tSeconds.length).toBeLessThanOrEqual(400);
    expect(d.tSeconds).toContain(4321);
    expect(d.tSeconds).toContain(7777);
    expect(d.tSeconds[0]).toBe(0);
    expect(d.tSeconds[d.tSeconds.length - 1]).toBe(9999);
    expect(Math.max(...d.microns)).toBe(Math.max(...p));
  });
});
