/**
 * The labelled verdicts confidence is calibrated and evaluated on: simulated gauge logs (the same
 * mix of scenarios, starts in the hold and broken vacuums as `npm run eval:analysis`) and typed logs
 * made from the simulator, each analysed as the product would and marked right or wrong against
 * the simulator's truth. Seed ranges keep the fitting set apart from the held-out ones.
 */
import { analyzeLog } from "../../analysis";
import { SCENARIOS, simulateLog } from "../../analysis/decay/simulate";
import type { AnalysisResult, Verdict } from "../../analysis/decay/types";
import { TYPED_SCENARIOS, typedFromSimulator } from "./typed-sim";
import { drawFieldLog } from "../evaluate-field";

export interface Labelled {
  verdict: Verdict;
  truth: Verdict;
  right: boolean;
  confidence: number;
  evidence: Record<string, number>;
  source: "file" | "typed" | "field";
}

function labelled(r: AnalysisResult, truth: Verdict, source: Labelled["source"]): Labelled {
  return { verdict: r.verdict, truth, right: r.verdict === truth, confidence: r.confidence, evidence: r.certainty?.evidence ?? {}, source };
}

/** Gauge logs of every scenario, as the evaluation draws them; an unreadable log is left out (it has no verdict). */
export function simulatedSet(count: number, firstSeed: number): Labelled[] {
  const out: Labelled[] = [];
  for (let k = 0; k < count; k++) {
    const seed = firstSeed + k;
    const sim = simulateLog({ scenario: SCENARIOS[k % SCENARIOS.length], seed, startInHold: seed % 5 === 0, breakAtEnd: seed % 7 === 0 });
    try {
      out.push(labelled(analyzeLog(sim.text), sim.truth.verdict, "file"));
    } catch {
      /* no verdict to calibrate */
    }
  }
  return out;
}

/** Typed minute logs made from the simulator's holds. */
export function typedSet(count: number, firstSeed: number): Labelled[] {
  const out: Labelled[] = [];
  for (let k = 0; out.length < count && k < count * 3; k++) {
    const log = typedFromSimulator(TYPED_SCENARIOS[k % TYPED_SCENARIOS.length], firstSeed + k);
    if (!log) continue;
    try {
      out.push(labelled(analyzeLog(log.text, log.options), log.truth.verdict, "typed"));
    } catch {
      /* no verdict */
    }
  }
  return out;
}

/** Field logs drawn as the evaluation's field part draws them (every layout, artifacts, typed and out-of-range scenarios). */
export function fieldSet(count: number, firstSeed: number): Labelled[] {
  const out: Labelled[] = [];
  for (let k = 0; k < count; k++) {
    const { sim } = drawFieldLog(k, firstSeed + k);
    try {
      out.push(labelled(analyzeLog(sim.text), sim.truth.verdict, "field"));
    } catch {
      /* no verdict */
    }
  }
  return out;
}
