/**
 * The phone's provisional verdict and the server's confirmed one agree on the project's own
 * evaluation set: the 500 simulated logs of `npm run eval:analysis` (seeds 900001–900500), its 500
 * field logs (seeds 1000001–1000500) and 300 typed minute logs, each analysed by the function the
 * phone's Web Worker runs (lib/offline/phone-engine.ts) and by the server's (lib/vacuum-tests/engine.ts)
 * with the same options: same engine version, verdict, confidence, isolation, figures and chart.
 * (The Worker wrapper itself is exercised in tests/journeys/offline.test.ts.)
 */
import { describe, expect, it } from "vitest";
import { SCENARIOS, simulateLog } from "@/analysis/decay/simulate";
import { DEFAULT_PROFILE } from "@/analysis/decay/profile";
import type { AnalyzeOptions } from "@/analysis/decay/types";
import { analyseOnThisDevice } from "@/lib/offline/phone-engine";
import { runAnalysis } from "@/lib/vacuum-tests/engine";
import { drawFieldLog } from "../scripts/evaluate-field";
import { TYPED_SCENARIOS, typedFromSimulator } from "../scripts/eval/typed-sim";

type Case = { name: string; text: string; options: AnalyzeOptions };

function evaluationSet(): Case[] {
  const cases: Case[] = [];
  const profile = { profile: { ...DEFAULT_PROFILE } };
  for (let k = 0; k < 500; k++) {
    const seed = 900001 + k;
    const sim = simulateLog({ scenario: SCENARIOS[k % SCENARIOS.length], seed, startInHold: seed % 5 === 0, breakAtEnd: seed % 7 === 0 });
    cases.push({ name: `simulated ${seed}`, text: sim.text, options: profile });
  }
  for (let k = 0; k < 500; k++) {
    const { sim } = drawFieldLog(k, 1000001 + k);
    cases.push({ name: `field ${1000001 + k}`, text: sim.text, options: profile });
  }
  for (let k = 0; cases.length < 1300 && k < 1000; k++) {
    const typed = typedFromSimulator(TYPED_SCENARIOS[k % TYPED_SCENARIOS.length], 300001 + k);
    if (typed) cases.push({ name: `typed ${300001 + k}`, text: typed.text, options: { ...typed.options, ...profile } });
  }
  return cases;
}

/** Either side's answer as data: the result and chart, or the error's message. */
function outcome(run: () => { result: unknown; series: unknown }): unknown {
  try {
    const { result, series } = run();
    return JSON.parse(JSON.stringify({ result, series }));
  } catch (e) {
    return { error: e instanceof Error ? e.message : String(e) };
  }
}

describe("provisional (on the phone) and confirmed (on the server) verdicts agree on the evaluation set", () => {
  it("gives the same engine version, verdict, confidence, isolation, figures and chart on all 1,300 logs", () => {
    const cases = evaluationSet();
    expect(cases.length).toBe(1300);
    const differing: string[] = [];
    let verdicts = 0;
    for (const c of cases) {
      const phone = outcome(() => analyseOnThisDevice(c.text, c.options)) as { result?: { verdict: string; engineVersion: string } };
      const server = outcome(() => runAnalysis(c.text, c.options)) as { result?: { verdict: string; engineVersion: string } };
      if (JSON.stringify(phone) !== JSON.stringify(server)) differing.push(c.name);
      if (phone.result) verdicts++;
    }
    expect(differing).toEqual([]);
    expect(verdicts).toBeGreaterThan(1250); // nearly every log has a verdict (a few field logs may be refused alike)
  }, 240_000);
});
