/**
 * Evaluation of the analysis on a fresh simulated set (seeds never used while tuning: 900001…).
 * Prints verdict accuracy with a confusion matrix, isolation within max(3 samples, 45 s), median
 * leak-rate and plateau errors, and the early-call rate at minute 4 of a 10-minute hold on clear cases;
 * then the same figures on field logs (evaluate-field.ts: every layout, field artifacts, typed and
 * out-of-range scenarios; seeds from firstSeed + 100,000) with accuracy per artifact and per layout.
 *
 *   tsx scripts/evaluate-analysis.ts [count=500] [firstSeed=900001] [--readings] [--misses]
 *
 * --readings hands the simulated readings straight to analyzeReadings (skipping the importer), to
 * tell analysis errors from import errors.
 */
import { analyzeLog, analyzeReadings } from "../analysis";
import { SCENARIOS, simulateLog, simulatedAsImported, type Scenario, type SimulatedLog } from "../analysis/simulate";
import type { AnalysisResult, Verdict } from "../analysis/types";
import { DEFAULT_PROFILE } from "../analysis/profile";
import { evaluateField } from "./evaluate-field";

const count = Number(process.argv[2] ?? 500);
const firstSeed = Number(process.argv[3] ?? 900001);
const VERDICTS: Verdict[] = ["pass", "leak", "moisture", "leak_and_moisture", "inconclusive"];
const median = (v: number[]) => {
  const s = [...v].sort((a, b) => a - b);
  return s.length ? s[s.length >> 1] : NaN;
};

/** Keep the rows of a simulated log up to `cutSeconds` (rows map one-to-one to the last lines). */
function truncate(sim: SimulatedLog, cutSeconds: number): string {
  const lines = sim.text.replace(/\n$/, "").split("\n");
  const header = lines.length - sim.tSeconds.length;
  const kept = lines.slice(0, header);
  sim.tSeconds.forEach((t, i) => {
    if (t <= cutSeconds) kept.push(lines[header + i]);
  });
  return kept.join("\n") + "\n";
}

const viaReadings = process.argv.includes("--readings");

function analyse(sim: SimulatedLog, cutSeconds = Infinity): AnalysisResult {
  if (!viaReadings) return analyzeLog(Number.isFinite(cutSeconds) ? truncate(sim, cutSeconds) : sim.text);
  const keep = sim.tSeconds.map((t) => t <= cutSeconds);
  return analyzeReadings(simulatedAsImported({ ...sim, tSeconds: sim.tSeconds.filter((_, i) => keep[i]), microns: sim.microns.filter((_, i) => keep[i]) }));
}

const confusion = new Map<string, number>();
let correct = 0;
let isoOk = 0;
let isoTotal = 0;
let errors = 0;
const leakErr: number[] = [];
const plateauErr: number[] = [];
const misses: string[] = [];
const started = Date.now();
for (let k = 0; k < count; k++) {
  const seed = firstSeed + k;
  const scenario = SCENARIOS[k % SCENARIOS.length];
  const sim = simulateLog({ scenario, seed, startInHold: seed % 5 === 0, breakAtEnd: seed % 7 === 0 });
  const truth = sim.truth;
  let verdict: Verdict | "error" = "error";
  try {
    const r = analyse(sim);
    verdict = r.verdict;
    const tol = Math.max(3 * truth.sampleSeconds, 45);
    isoTotal++;
    const isoGood = truth.isolationAtSeconds === null ? r.isolationAt === null : r.isolationAt !== null && Math.abs(r.isolationAt - truth.isolationAtSeconds) <= tol;
    if (isoGood) isoOk++;
    if (truth.leakRateMicronsPerMinute > 0 && r.decay && verdict !== "inconclusive") leakErr.push(Math.abs(r.decay.leakRateMicronsPerMinute - truth.leakRateMicronsPerMinute) / truth.leakRateMicronsPerMinute);
    if (truth.plateauMicrons !== null && r.decay && verdict !== "inconclusive" && truth.verdict !== "inconclusive") {
      plateauErr.push(r.decay.plateauMicrons === null ? 1 : Math.abs(r.decay.plateauMicrons - truth.plateauMicrons) / truth.plateauMicrons);
    }
    if (verdict !== truth.verdict || !isoGood) misses.push(`${scenario} seed ${seed}: truth ${truth.verdict} got ${verdict}; iso truth ${truth.isolationAtSeconds?.toFixed(0) ?? "none"} got ${r.isolationAt?.toFixed(0) ?? "none"} (dt ${truth.sampleSeconds.toFixed(0)} s, ${truth.layout}/${truth.unit})`);
  } catch (e) {
    errors++;
    misses.push(`${scenario} seed ${seed}: error ${(e as Error).message}`);
  }
  if (verdict === truth.verdict) correct++;
  const key = `${truth.verdict}→${verdict}`;
  confusion.set(key, (confusion.get(key) ?? 0) + 1);
}

// early call at minute 4 of a 10-minute hold, on clear cases (10-minute value ≤ 0.8× or ≥ 1.25× the limit)
const clearScenarios: Scenario[] = ["tight_dry", "moisture", "leak", "leak_and_moisture"];
let earlyTotal = 0;
let earlyRight = 0;
let earlyWrong = 0;
for (let k = 0; earlyTotal < 100 && k < 400; k++) {
  const sim = simulateLog({ scenario: clearScenarios[k % 4], seed: firstSeed + 50000 + k, holdMinutes: 10 });
  const tr = sim.truth;
  if (tr.isolationAtSeconds === null) continue;
  const a = tr.plateauMicrons !== null ? tr.plateauMicrons - tr.isolationMicrons : 0;
  const at10 = tr.isolationMicrons + a * (1 - Math.exp(-600 / (tr.tauSeconds ?? 1))) + tr.leakRateMicronsPerMinute * 10;
  const limit = DEFAULT_PROFILE.limitMicrons;
  if (at10 > 0.8 * limit && at10 < 1.25 * limit) continue;
  earlyTotal++;
  const expected = at10 <= limit ? "pass" : "fail";
  try {
    const r = analyse(sim, tr.isolationAtSeconds + 240);
    if (r.forecast?.earlyCall === expected) earlyRight++;
    else if (r.forecast?.earlyCall) earlyWrong++;
  } catch {
    /* counted as no call */
  }
}

const pct = (a: number, b: number) => `${((100 * a) / Math.max(b, 1)).toFixed(1)} %`;
console.log(`path: ${viaReadings ? "simulated readings → analyzeReadings (importer skipped)" : "CSV text → analyzeLog (importer included)"}`);
console.log(`logs: ${count} (seeds ${firstSeed}…${firstSeed + count - 1}), ${((Date.now() - started) / 1000).toFixed(1)} s, errors ${errors}`);
console.log(`verdict accuracy:            ${pct(correct, count)}  (goal ≥ 95 %)`);
console.log(`isolation within tolerance:  ${pct(isoOk, isoTotal)}  (goal ≥ 95 %; max(3 samples, 45 s); none when the log starts in the hold)`);
console.log(`median leak-rate error:      ${(100 * median(leakErr)).toFixed(2)} %  over ${leakErr.length} leaks (goal ≤ 5 %)`);
console.log(`median plateau error:        ${(100 * median(plateauErr)).toFixed(2)} %  over ${plateauErr.length} plateaus (goal ≤ 10 %)`);
console.log(`early call at minute 4:      ${earlyRight}/${earlyTotal} right, ${earlyWrong} wrong, rest no call  (goal ≥ 9/10)`);
console.log("confusion (rows truth, columns result):");
console.log(["truth \\ result", ...VERDICTS, "error"].map((s) => s.padEnd(18)).join(""));
for (const tv of VERDICTS) {
  console.log([tv, ...[...VERDICTS, "error"].map((rv) => String(confusion.get(`${tv}→${rv}`) ?? 0))].map((s) => s.padEnd(18)).join(""));
}
if (process.argv.includes("--misses")) console.log(misses.join("\n"));
console.log(evaluateField(count, firstSeed + 100_000, (sim) => analyse(sim), process.argv.includes("--misses")).join("\n"));
