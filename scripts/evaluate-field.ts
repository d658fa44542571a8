/**
 * The field-log part of `npm run eval:analysis`: simulated logs in every layout (the first ones and
 * the field exports') with up to three field artifacts each (spikes, drop-outs, repeated rows, coarse
 * steps, thermal drift, a long over-range start, blank over-range) and the field scenarios (typed
 * minutes, a gross leak out of range), and accuracy printed per artifact and per layout, so a weak spot
 * shows by name. Seeds apart from the main part's.
 */
import { DEFAULT_PROFILE } from "../analysis/decay/profile";
import {
  FIELD_ARTIFACTS,
  FIELD_LAYOUTS,
  FIELD_SCENARIOS,
  LAYOUTS,
  SCENARIOS,
  makeRng,
  simulateLog,
  type FieldArtifact,
  type Layout,
  type Scenario,
  type SimulatedLog,
} from "../analysis/decay/simulate";
import type { AnalysisResult } from "../analysis/decay/types";

interface Tally {
  n: number;
  verdict: number;
  isolation: number;
}

const median = (v: number[]) => {
  const s = v.slice().sort((a, b) => a - b);
  return s.length ? s[s.length >> 1] : NaN;
};
const pct = (a: number, b: number) => `${((100 * a) / Math.max(b, 1)).toFixed(1)} %`;

/** The highest noise-free reading of the judged hold (microns): isolation, the level-off part and the climb at its end. */
function trueHighest(sim: SimulatedLog): number {
  const t = sim.truth;
  const rise = t.plateauMicrons !== null ? (t.plateauMicrons - t.isolationMicrons) * (1 - Math.exp(-t.holdSeconds / (t.tauSeconds ?? 1))) : 0;
  return t.isolationMicrons + rise + (t.leakRateMicronsPerMinute * t.holdSeconds) / 60;
}

function bump(m: Map<string, Tally>, key: string, verdictRight: boolean, isolationRight: boolean): void {
  const t = m.get(key) ?? { n: 0, verdict: 0, isolation: 0 };
  t.n++;
  if (verdictRight) t.verdict++;
  if (isolationRight) t.isolation++;
  m.set(key, t);
}

function table(title: string, m: Map<string, Tally>): string[] {
  const rows = [`${title}:`];
  for (const [key, t] of [...m].sort((a, b) => a[0].localeCompare(b[0])))
    rows.push(`  ${key.padEnd(28)} n=${String(t.n).padStart(4)}   verdict ${pct(t.verdict, t.n).padStart(7)}   isolation ${pct(t.isolation, t.n).padStart(7)}`);
  return rows;
}

const FIELD_SCENARIO_MIX: Scenario[] = [...SCENARIOS, ...FIELD_SCENARIOS];
const FIELD_LAYOUT_MIX: Layout[] = [...LAYOUTS, ...FIELD_LAYOUTS].filter((l) => l !== "typed_minutes");

/** The k-th field log of a run: its scenario in turn, a layout and up to three artifacts drawn from the seed. */
export function drawFieldLog(k: number, seed: number): { scenario: Scenario; layout: Layout; artifacts: FieldArtifact[]; sim: SimulatedLog } {
  const rng = makeRng(seed * 31 + 7);
  const scenario = FIELD_SCENARIO_MIX[k % FIELD_SCENARIO_MIX.length];
  const layout: Layout = scenario === "typed_minutes" ? "typed_minutes" : rng.pick(FIELD_LAYOUT_MIX);
  const artifacts: FieldArtifact[] = [];
  const want = rng.int(0, 3);
  while (artifacts.length < want) {
    const a = rng.pick(FIELD_ARTIFACTS);
    if (!artifacts.includes(a)) artifacts.push(a);
  }
  const sim = simulateLog({ scenario, seed, layout, artifacts, startInHold: seed % 5 === 0, breakAtEnd: seed % 7 === 0 });
  return { scenario, layout, artifacts, sim };
}

/**
 * Draw, analyse and report `count` field logs from `firstSeed`; `analyse` is the same path as the main
 * part's. Each verdict's confidence and rightness is pushed to `judged` when given (the calibration section).
 */
export function evaluateField(count: number, firstSeed: number, analyse: (sim: SimulatedLog) => AnalysisResult, showMisses: boolean, judged?: { confidence: number; right: boolean }[]): string[] {
  const byLayout = new Map<string, Tally>();
  const byArtifact = new Map<string, Tally>();
  let right = 0;
  let isoRight = 0;
  let errors = 0;
  let overLimit = 0;
  let passesOverLimit = 0;
  const leakErr: number[] = [];
  const plateauErr: number[] = [];
  const misses: string[] = [];
  for (let k = 0; k < count; k++) {
    const seed = firstSeed + k;
    const { scenario, layout, artifacts, sim } = drawFieldLog(k, seed);
    const truth = sim.truth;
    let verdict = "error";
    let isoGood = false;
    let got = "";
    try {
      const r = analyse(sim);
      verdict = r.verdict;
      judged?.push({ confidence: r.confidence, right: r.verdict === truth.verdict });
      const tol = Math.max(3 * truth.sampleSeconds, 45);
      isoGood = truth.isolationAtSeconds === null ? r.isolationAt === null : r.isolationAt !== null && Math.abs(r.isolationAt - truth.isolationAtSeconds) <= tol;
      const high = trueHighest(sim);
      if (high > DEFAULT_PROFILE.limitMicrons && truth.verdict !== "inconclusive") {
        overLimit++;
        if (verdict === "pass") passesOverLimit++;
      }
      const atLeast = r.decay?.leakRateAtLeast === true;
      if (truth.leakRateMicronsPerMinute > 0 && r.decay && verdict !== "inconclusive" && !atLeast)
        leakErr.push(Math.abs(r.decay.leakRateMicronsPerMinute - truth.leakRateMicronsPerMinute) / truth.leakRateMicronsPerMinute);
      if (truth.plateauMicrons !== null && r.decay && verdict !== "inconclusive" && truth.verdict !== "inconclusive" && !atLeast)
        plateauErr.push(r.decay.plateauMicrons === null ? 1 : Math.abs(r.decay.plateauMicrons - truth.plateauMicrons) / truth.plateauMicrons);
      got = `got ${verdict}, iso ${r.isolationAt?.toFixed(0) ?? "none"}`;
    } catch (e) {
      errors++;
      got = `error ${(e as Error).message}`;
    }
    const verdictGood = verdict === truth.verdict;
    if (verdictGood) right++;
    if (isoGood) isoRight++;
    bump(byLayout, layout, verdictGood, isoGood);
    for (const a of artifacts.length ? artifacts : ["(none)"]) bump(byArtifact, a, verdictGood, isoGood);
    bump(byArtifact, `scenario ${scenario}`, verdictGood, isoGood);
    if (!verdictGood || !isoGood)
      misses.push(`field ${scenario} seed ${seed} ${layout}/${truth.unit} [${artifacts.join(",")}]: truth ${truth.verdict}, iso ${truth.isolationAtSeconds?.toFixed(0) ?? "none"}; ${got} (dt ${truth.sampleSeconds.toFixed(0)} s)`);
  }
  const out = [
    "",
    `field logs: ${count} (seeds ${firstSeed}…${firstSeed + count - 1}; every layout, up to three artifacts each, typed and out-of-range scenarios), errors ${errors}`,
    `verdict accuracy:            ${pct(right, count)}  (goal ≥ 95 %)`,
    `isolation within tolerance:  ${pct(isoRight, count)}  (goal ≥ 95 %)`,
    `median leak-rate error:      ${(100 * median(leakErr)).toFixed(2)} %  over ${leakErr.length} leaks (goal ≤ 5 %; lower bounds of gross leaks left out)`,
    `median plateau error:        ${(100 * median(plateauErr)).toFixed(2)} %  over ${plateauErr.length} plateaus (goal ≤ 10 %)`,
    `passes over the limit:       ${passesOverLimit} of ${overLimit} logs whose hold passes ${DEFAULT_PROFILE.limitMicrons} microns (goal 0)`,
    ...table("per layout", byLayout),
    ...table("per artifact and scenario", byArtifact),
  ];
  return showMisses ? out.concat(misses) : out;
}
