/**
 * The early call at minute 4 of the hold, against the truth of the whole log: right, wrong, or no
 * call, on the simulator's clear cases, on every scenario, and on the independent set; and how many
 * early calls contradict the verdict printed beside them (a "will pass" beside a leak): goal 0.
 */
import { analyzeLog } from "../../analysis";
import { SCENARIOS, simulateLog, type Scenario, type SimulatedLog } from "../../analysis/decay/simulate";
import { DEFAULT_PROFILE } from "../../analysis/decay/profile";
import type { AnalysisResult, Verdict } from "../../analysis/decay/types";
import { independentLogs } from "./independent";
import { MIN_EARLY_CALL_READINGS } from "../../analysis/decay/forecast";

export const EARLY_SECONDS = 240;

/** A call that disagrees with the verdict in the same result. */
export function contradicts(r: AnalysisResult): boolean {
  const call = r.forecast?.earlyCall ?? null;
  if (call === "pass") return r.verdict !== "pass" && r.verdict !== "inconclusive";
  if (call === "fail") return r.verdict === "pass";
  return false;
}

/** Keep the rows of a simulated log up to `cutSeconds` (rows map one-to-one to the last lines). */
export function truncateSimulated(sim: SimulatedLog, cutSeconds: number): string {
  const lines = sim.text.replace(/\n$/, "").split("\n");
  const header = lines.length - sim.tSeconds.length;
  const kept = lines.slice(0, header);
  sim.tSeconds.forEach((t, i) => {
    if (t <= cutSeconds) kept.push(lines[header + i]);
  });
  return kept.join("\n") + "\n";
}

interface Tally {
  total: number;
  right: number;
  wrong: number;
  contradictions: number;
  wrongKinds: Map<string, number>;
}
const tally = (): Tally => ({ total: 0, right: 0, wrong: 0, contradictions: 0, wrongKinds: new Map() });

/** Tally one early call; a log whose truth is "inconclusive" (a hold too short to judge) has no right call and is left out. */
function count(t: Tally, r: AnalysisResult | null, truth: Verdict, label: string) {
  if (truth === "inconclusive") return;
  t.total++;
  const expected = truth === "pass" ? "pass" : "fail";
  const call = r?.forecast?.earlyCall ?? null;
  if (r && contradicts(r)) t.contradictions++;
  if (call === expected) t.right++;
  else if (call) {
    t.wrong++;
    const k = `${label}: truth ${truth}, called ${call}`;
    t.wrongKinds.set(k, (t.wrongKinds.get(k) ?? 0) + 1);
  }
}

function safe(fn: () => AnalysisResult): AnalysisResult | null {
  try {
    return fn();
  } catch {
    return null;
  }
}

/** Simulated holds of 12 minutes (so the truth is judged past the 10-minute hold time) of one scenario, cut at minute 4. */
function simulatedEarly(scenario: Scenario, seed: number): { r: AnalysisResult | null; sim: SimulatedLog } | null {
  const sim = simulateLog({ scenario, seed, holdMinutes: 12 });
  const iso = sim.truth.isolationAtSeconds;
  if (iso === null) return null;
  return { r: safe(() => analyzeLog(truncateSimulated(sim, iso + EARLY_SECONDS))), sim };
}

/** Clear: the 10-minute value at most 0.8× or at least 1.25× the limit, and a leak at least 1.25× the leak rate. */
function clearCase(sim: SimulatedLog): boolean {
  const tr = sim.truth;
  const a = tr.plateauMicrons !== null ? tr.plateauMicrons - tr.isolationMicrons : 0;
  const at10 = tr.isolationMicrons + a * (1 - Math.exp(-600 / (tr.tauSeconds ?? 1))) + tr.leakRateMicronsPerMinute * 10;
  const limit = DEFAULT_PROFILE.limitMicrons;
  const rate = tr.leakRateMicronsPerMinute / DEFAULT_PROFILE.leakRateMicronsPerMinute;
  return !(at10 > 0.8 * limit && at10 < 1.25 * limit) && (rate === 0 || rate >= 1.25);
}

function line(name: string, t: Tally, goal = true): string[] {
  const pct = (a: number) => `${((100 * a) / Math.max(t.total, 1)).toFixed(1)} %`;
  const out = [
    `${name.padEnd(34)} ${t.right}/${t.total} right (${pct(t.right)}), ${t.wrong} wrong (${pct(t.wrong)}), ${t.total - t.right - t.wrong} no call; ${t.contradictions} contradict the verdict beside them${goal ? "  (goals ≥ 90 % right, ≤ 2 % wrong, 0 contradictions)" : ""}`,
  ];
  for (const [k, n] of [...t.wrongKinds].sort((a, b) => b[1] - a[1]).slice(0, 5)) out.push(`    wrong: ${k} × ${n}`);
  return out;
}

/** Lines for the evaluation: early calls at minute 4 and contradictions. */
export function earlyCallLines(firstSeed: number, independentCount: number): string[] {
  const clear = tally();
  const clearScenarios: Scenario[] = ["tight_dry", "moisture", "leak", "leak_and_moisture"];
  for (let k = 0; clear.total < 200 && k < 800; k++) {
    const s = simulatedEarly(clearScenarios[k % 4], firstSeed + 50000 + k);
    if (!s || !clearCase(s.sim)) continue;
    count(clear, s.r, s.sim.truth.verdict, clearScenarios[k % 4]);
  }
  const every = tally();
  for (let k = 0; k < SCENARIOS.length * 20; k++) {
    const s = simulatedEarly(SCENARIOS[k % SCENARIOS.length], firstSeed + 60000 + k);
    if (s) count(every, s.r, s.sim.truth.verdict, SCENARIOS[k % SCENARIOS.length]);
  }
  const ind = tally();
  const indTyped = tally();
  for (const log of independentLogs(independentCount)) {
    if (log.truth.holdSeconds < DEFAULT_PROFILE.holdMinutes * 60) continue;
    const r = safe(() => analyzeLog(log.textUpTo(EARLY_SECONDS), log.options));
    count(log.kind === "typed" ? indTyped : ind, r, log.truth.verdict, log.id.replace(/^ind-\d+-/, ""));
  }
  return [
    "early call at minute 4 of the hold (against the truth of the whole log; pass vs any failing verdict):",
    ...line("simulator, clear cases", clear),
    ...line("simulator, every scenario", every, false),
    ...line("independent set, gauge logs", ind),
    ...line("independent set, typed (1/min)", indTyped, false),
    `    (typed logs have 5 readings by minute 4, under the ${MIN_EARLY_CALL_READINGS} an early call needs: no call by design)`,
  ];
}
