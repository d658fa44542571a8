/**
 * Hand-typed logs made from the project's simulator: the simulated hold read off once a minute from
 * the isolation, whole microns, written as the typed-readings screen writes them (lib/vacuum-tests/typed.ts)
 * and analysed with the same options. For calibrating and evaluating typed logs as the product reads them.
 */
import { simulateLog, type Scenario } from "../../analysis/decay/simulate";
import type { AnalyzeOptions, Verdict } from "../../analysis/decay/types";
import { typedReadingsToCsv } from "../../lib/vacuum-tests/typed";

export const TYPED_SCENARIOS: Scenario[] = ["tight_dry", "moisture", "leak", "leak_and_moisture", "short_hold", "target_not_reached"];

export interface TypedSimLog {
  text: string;
  options: AnalyzeOptions;
  truth: { verdict: Verdict; scenario: Scenario };
}

/** One typed log from a simulated one (null when the simulated hold has fewer than 5 minute readings). */
export function typedFromSimulator(scenario: Scenario, seed: number): TypedSimLog | null {
  const sim = simulateLog({ scenario, seed, sampleSeconds: 5 });
  const iso = sim.truth.isolationAtSeconds;
  if (iso === null) return null;
  const h = sim.truth.holds[sim.truth.primary];
  const readings: { time: number; microns: number }[] = [];
  let i = 0;
  for (let m = 0; iso + m * 60 <= h.endSeconds; m++) {
    const at = iso + m * 60;
    while (i + 1 < sim.tSeconds.length && Math.abs(sim.tSeconds[i + 1] - at) <= Math.abs(sim.tSeconds[i] - at)) i++;
    const v = sim.microns[i];
    if (v === null) break; // over range: a technician stops writing
    readings.push({ time: m, microns: Math.max(1, Math.round(v)) });
  }
  if (readings.length < 5) return null;
  const { text, importDefaults, isolationAtSeconds } = typedReadingsToCsv({ timeMode: "minutes", readings });
  return { text, options: { import: importDefaults, isolationAtSeconds }, truth: { verdict: sim.truth.verdict, scenario } };
}
