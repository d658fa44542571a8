/**
 * Simulator of gauge logs with known truth: physically shaped pull-down, isolation and hold
 * (see curve.ts for the model), gauge noise, display resolution, spikes, over-range markers,
 * sensor faults, rendered in every layout the importer reads; on request the layouts and artifacts of
 * field exports (render-field.ts, artifacts.ts) and their scenarios (typed minutes, a gross leak out of
 * range). Feeds fixtures, the demo seed, property tests and the evaluation. All data invented.
 *
 *   simulateLog({ scenario: "leak", seed: 7 })            // named scenario
 *   simulateFromParams(params)                             // every knob by hand
 */
import { simulateFromParams } from "./build";
import { scenarioParams, type ScenarioOptions } from "./scenarios";
import type { SimulatedLog } from "./params";

export { simulateFromParams, truthVerdict } from "./build";
export { FIELD_SCENARIOS, SCENARIOS, scenarioParams, type BaseScenario, type FieldScenario, type Scenario, type ScenarioOptions } from "./scenarios";
export { FIELD_LAYOUTS, FIELD_LAYOUT_UNITS, LAYOUTS, UNITS, renderLog, type BaseLayout, type FieldLayout, type Layout, type RenderRow } from "./render";
export { FIELD_ARTIFACTS, type FieldArtifact } from "./artifacts";
export { makeRng, type Rng } from "./prng";
export { holdMicrons, makePulldownCurve } from "./curve";
export { simulatedAsImported } from "./imported";
export type * from "./params";

/** Simulate one log of a named scenario; the same options and seed always give the same log. */
export function simulateLog(options: ScenarioOptions): SimulatedLog {
  const { params, findings } = scenarioParams(options);
  return simulateFromParams(params, options.scenario, findings);
}
