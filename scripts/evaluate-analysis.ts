/**
 * Evaluation of the analysis on a fresh simulated set (seeds never used while tuning: 900001…).
 * Prints verdict accuracy with a confusion matrix, isolation within max(3 samples, 45 s), median
 * leak-rate and plateau errors; then the same figures on field logs (evaluate-field.ts: every layout,
 * field artifacts, typed and out-of-range scenarios; seeds from firstSeed + 100,000) with accuracy per
 * artifact and per layout; then (scripts/eval/) the early call at minute 4 of the hold against the
 * truth, and the confidence's reliability table with its calibration error on held-out simulated,
 * typed and independent logs (scripts/eval/independent.ts).
 *
 *   tsx scripts/evaluate-analysis.ts [count=500] [firstSeed=900001] [--readings] [--misses]
 *
 * --readings hands the simulated readings straight to analyzeReadings (skipping the importer), to
 * tell analysis errors from import errors.
 */
import { analyzeLog, analyzeReadings } from "../analysis";
import { SCENARIOS, simulateLog, simulatedAsImported, type SimulatedLog } from "../analysis/decay/simulate";
import type { AnalysisResult, Verdict } from "../analysis/decay/types";
import { calibrationLines } from "./eval/calibration-section";
import { earlyCallLines } from "./eval/early-call";
import type { Judged } from "./eval/reliability";
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
const judged: Judged[] = [];
const independentCount = 400;
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
    judged.push({ confidence: r.confidence, right: verdict === truth.verdict });
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

const pct = (a: number, b: number) => `${((100 * a) / Math.max(b, 1)).toFixed(1)} %`;
console.log(`path: ${viaReadings ? "simulated readings → analyzeReadings (importer skipped)" : "CSV text → analyzeLog (importer included)"}`);
console.log(`logs: ${count} (seeds ${firstSeed}…${firstSeed + count - 1}), ${((Date.now() - started) / 1000).toFixed(1)} s, errors ${errors}`);
console.log(`verdict accuracy:            ${pct(correct, count)}  (goal ≥ 95 %)`);
console.log(`isolation within tolerance:  ${pct(isoOk, isoTotal)}  (goal ≥ 95 %; max(3 samples, 45 s); none when the log starts in the hold)`);
console.log(`median leak-rate error:      ${(100 * median(leakErr)).toFixed(2)} %  over ${leakErr.length} leaks (goal ≤ 5 %)`);
console.log(`median plateau error:        ${(100 * median(plateauErr)).toFixed(2)} %  over ${plateauErr.length} plateaus (goal ≤ 10 %)`);
console.log("confusion (rows truth, columns result):");
console.log(["truth \\ result", ...VERDICTS, "error"].map((s) => s.padEnd(18)).join(""));
for (const tv of VERDICTS) {
  console.log([tv, ...[...VERDICTS, "error"].map((rv) => String(confusion.get(`${tv}→${rv}`) ?? 0))].map((s) => s.padEnd(18)).join(""));
}
if (process.argv.includes("--misses")) console.log(misses.join("\n"));
const fieldJudged: Judged[] = [];
console.log(evaluateField(count, firstSeed + 100_000, (sim) => analyse(sim), process.argv.includes("--misses"), fieldJudged).join("\n"));
console.log(earlyCallLines(firstSeed, independentCount).join("\n"));
console.log(calibrationLines(judged, independentCount, fieldJudged).join("\n"));
