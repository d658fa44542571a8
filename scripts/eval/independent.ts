/**
 * An independent set of invented logs for the evaluation: written apart from analysis/decay/simulate, with
 * its own random generator, its own curve shapes and its own gauge habits, so a weakness the
 * project's simulator shares with the engine still shows here. All data invented.
 *
 * Curves (t seconds after isolation): p = iso + A₁(1 − e^(−t/τ₁)) + A₂(1 − e^(−t/τ₂)) + L·t + drift,
 * two outgassing terms (fast and slow) where the simulator has one, a slow thermal drift of up to
 * ±2 % an hour, the pull-down as an exponential approach to a floor below the isolation reading.
 * Gauges: multiplicative log-normal noise 0.3–2.5 %, display steps of 1 micron (and 10 above 1,000
 * on half of them), sample gaps (wireless drop-outs of 20–60 s), repeated rows, one wild reading in
 * the pull-down on some. Hand-typed logs: one reading a minute for 10–20 minutes, whole microns.
 * Truth (common practice thresholds of the default profile): leak when L ≥ the leak rate; moisture
 * when the level-off A₁ + A₂ ends above the limit, or the curve passes the limit without a leak.
 */
import type { AnalyzeOptions, Verdict } from "../../analysis/decay/types";
import { DEFAULT_PROFILE } from "../../analysis/decay/profile";
import { typedReadingsToCsv } from "../../lib/vacuum-tests/typed";

export interface IndependentLog {
  id: string;
  kind: "file" | "typed";
  layout: string;
  text: string;
  /** The same log cut after `holdSeconds` of hold (for the early call). */
  textUpTo: (holdSeconds: number) => string;
  options: AnalyzeOptions;
  truth: { verdict: Verdict; leakRateMicronsPerMinute: number; plateauMicrons: number | null; holdSeconds: number; isolationMicrons: number };
}

/** sfc32 (C. Doty-Humphrey's PractRand "small fast counting" generator), seeded by splitmix32. */
function generator(seed: number) {
  let s = seed >>> 0;
  const split = () => {
    s = (s + 0x9e3779b9) >>> 0;
    let z = s;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
    return (z ^ (z >>> 16)) >>> 0;
  };
  let a = split();
  let b = split();
  let c = split();
  let d = split();
  const next = () => {
    const t = (((a + b) >>> 0) + d) >>> 0;
    d = (d + 1) >>> 0;
    a = b ^ (b >>> 9);
    b = (c + (c << 3)) >>> 0;
    c = ((c << 21) | (c >>> 11)) >>> 0;
    c = (c + t) >>> 0;
    return t / 4294967296;
  };
  for (let i = 0; i < 12; i++) next();
  const uniform = (lo: number, hi: number) => lo + (hi - lo) * next();
  return {
    next,
    uniform,
    logUniform: (lo: number, hi: number) => Math.exp(uniform(Math.log(lo), Math.log(hi))),
    chance: (p: number) => next() < p,
    gauss: () => Math.sqrt(-2 * Math.log(1 - next())) * Math.cos(2 * Math.PI * next()),
    pick: <T>(xs: readonly T[]): T => xs[Math.floor(next() * xs.length)],
  };
}
type Gen = ReturnType<typeof generator>;

type Kind = "tight" | "near_limit" | "moisture" | "slow_leak" | "leak" | "both" | "short" | "high_isolation";
const KINDS: [Kind, number][] = [
  ["tight", 0.28],
  ["near_limit", 0.08],
  ["moisture", 0.16],
  ["slow_leak", 0.1],
  ["leak", 0.14],
  ["both", 0.1],
  ["short", 0.07],
  ["high_isolation", 0.07],
];

interface Curve {
  iso: number;
  a1: number;
  tau1: number;
  a2: number;
  tau2: number;
  leakPerSecond: number;
  driftPerSecond: number;
  holdSeconds: number;
}

function drawCurve(g: Gen, kind: Kind, typed: boolean): Curve {
  const limit = DEFAULT_PROFILE.limitMicrons;
  const hold = typed ? 60 * Math.round(g.uniform(10, 20)) : g.uniform(11, 26) * 60;
  const iso = kind === "high_isolation" ? g.uniform(540, 780) : g.uniform(120, 470);
  const c: Curve = { iso, a1: 0, tau1: 60, a2: 0, tau2: 200, leakPerSecond: 0, driftPerSecond: 0, holdSeconds: hold };
  const slowTau = () => g.uniform(90, Math.min(280, hold / 3));
  const split = (total: number) => {
    const share = g.uniform(0.6, 1);
    c.a1 = total * share;
    c.a2 = total * (1 - share);
    c.tau1 = g.uniform(15, 150);
    c.tau2 = slowTau();
  };
  switch (kind) {
    case "tight":
    case "short":
    case "high_isolation":
      split(g.uniform(20, Math.max(40, 0.85 * limit - iso)));
      if (kind === "short") c.holdSeconds = typed ? 60 * Math.round(g.uniform(4, 8)) : g.uniform(3, 8) * 60;
      break;
    case "near_limit":
      split(g.uniform(0.86, 0.97) * limit - iso);
      break;
    case "moisture":
      split(g.uniform(1.15 * limit, 5 * limit) - iso);
      c.tau1 = g.uniform(30, Math.min(240, hold / 3));
      c.leakPerSecond = g.uniform(0, 3) / 60;
      break;
    case "slow_leak":
      c.leakPerSecond = g.uniform(24, 45) / 60;
      split(g.uniform(0, 120));
      break;
    case "leak":
      c.leakPerSecond = g.logUniform(45, 500) / 60;
      split(g.uniform(0, 200));
      break;
    case "both":
      split(g.uniform(1.2 * limit, 4 * limit) - iso);
      c.tau1 = g.uniform(30, Math.min(240, hold / 3));
      c.leakPerSecond = g.logUniform(30, 250) / 60;
      break;
  }
  c.driftPerSecond = (g.uniform(-0.02, 0.02) * (iso + c.a1 + c.a2)) / 3600;
  return c;
}

const holdAt = (c: Curve, t: number) =>
  c.iso + c.a1 * -Math.expm1(-t / c.tau1) + c.a2 * -Math.expm1(-t / c.tau2) + c.leakPerSecond * t + c.driftPerSecond * t;

function truthOf(c: Curve): IndependentLog["truth"] {
  const p = DEFAULT_PROFILE;
  const holdTarget = p.holdMinutes * 60;
  const leakRate = c.leakPerSecond * 60;
  const plateau = c.a1 + c.a2 > 0 ? c.iso + c.a1 + c.a2 : null;
  let highest = 0;
  for (let t = 0; t <= Math.min(holdTarget, c.holdSeconds); t += 5) highest = Math.max(highest, holdAt(c, t));
  const leak = leakRate >= p.leakRateMicronsPerMinute;
  const moisture = (plateau !== null && plateau > p.limitMicrons) || (!leak && highest > p.limitMicrons);
  let verdict: Verdict = leak && moisture ? "leak_and_moisture" : leak ? "leak" : moisture ? "moisture" : "pass";
  if (c.holdSeconds < holdTarget && highest <= p.limitMicrons) verdict = "inconclusive";
  return { verdict, leakRateMicronsPerMinute: leakRate, plateauMicrons: plateau, holdSeconds: c.holdSeconds, isolationMicrons: c.iso };
}

/** The gauge's display: noise, then steps of 1 micron (10 above 1,000 on coarse gauges). */
function display(g: Gen, v: number, noise: number, coarse: boolean): number {
  const noisy = v * Math.exp(noise * g.gauss());
  const step = coarse && noisy >= 1000 ? 10 : 1;
  return Math.max(1, Math.round(noisy / step) * step);
}

const LAYOUTS = ["iso", "elapsed_s_semicolon", "clock_tab"] as const;

function fileLog(g: Gen, c: Curve, id: string): IndependentLog {
  const startsInHold = g.chance(0.2);
  const dt = g.logUniform(2, 30);
  const noise = g.uniform(0.003, 0.025);
  const coarse = g.chance(0.5);
  const rows: [number, number][] = [];
  let t = 0;
  let isoAt = 0;
  const step = () => dt * g.uniform(0.9, 1.1) + (g.chance(0.01) ? g.uniform(20, 60) : 0);
  if (!startsInHold) {
    const start = g.logUniform(5000, 700000);
    const floor = c.iso * g.uniform(0.6, 0.85);
    const tau = g.uniform(120, 900);
    const spikeAt = g.chance(0.3) ? g.uniform(0.2, 0.8) : -1;
    // the exponential approach reaches the isolation reading at tIso
    const tIso = tau * Math.log((start - floor) / (c.iso - floor));
    for (; t < tIso; t += step()) {
      let v = floor + (start - floor) * Math.exp(-t / tau);
      if (spikeAt > 0 && Math.abs(t / tIso - spikeAt) < dt / tIso / 2) v *= 1.8;
      rows.push([t, display(g, v, noise, coarse)]);
    }
    isoAt = t;
    for (let h = 0; h <= c.holdSeconds; h += step()) rows.push([isoAt + h, display(g, holdAt(c, h), noise, coarse)]);
  } else {
    const skip = g.uniform(0, 15);
    isoAt = -skip;
    for (let h = skip; h <= c.holdSeconds; h += step()) rows.push([h - skip, display(g, holdAt(c, h), noise, coarse)]);
  }
  if (g.chance(0.2)) for (let k = 0; k < rows.length / 100; k++) {
    const i = Math.floor(g.next() * rows.length);
    rows.splice(i, 0, rows[i]);
  }
  const layout = g.pick(LAYOUTS);
  const startMs = Date.UTC(2026, 2, 3, 7 + Math.floor(g.uniform(0, 9)), Math.floor(g.uniform(0, 59)), 0);
  const clock = (s: number) => new Date(startMs + s * 1000).toISOString().slice(11, 19);
  const render = (upTo: number) => {
    const kept = rows.filter(([s]) => s - isoAt <= upTo);
    if (layout === "iso") return ["timestamp,vacuum_microns", ...kept.map(([s, v]) => `${new Date(startMs + Math.round(s) * 1000).toISOString().replace(".000", "")},${v}`)].join("\n") + "\n";
    if (layout === "elapsed_s_semicolon") return ["Seconds;Microns", ...kept.map(([s, v]) => `${s.toFixed(1)};${v}`)].join("\n") + "\n";
    return ["Time\tVacuum (micron)", ...kept.map(([s, v]) => `${clock(s)}\t${v}`)].join("\n") + "\n";
  };
  return { id, kind: "file", layout: `${layout}${startsInHold ? "/in_hold" : ""}`, text: render(Infinity), textUpTo: render, options: {}, truth: truthOf(c) };
}

function typedLog(g: Gen, c: Curve, id: string): IndependentLog {
  const noise = g.uniform(0.003, 0.015);
  const readings: { time: number; microns: number }[] = [];
  for (let m = 0; m * 60 <= c.holdSeconds + 1e-9; m++) readings.push({ time: m, microns: Math.max(1, Math.round(holdAt(c, m * 60) * Math.exp(noise * g.gauss()))) });
  const csv = (upTo: number) => typedReadingsToCsv({ timeMode: "minutes", readings: readings.filter((r) => r.time * 60 <= upTo) });
  const { text, importDefaults, isolationAtSeconds } = csv(Infinity);
  return { id, kind: "typed", layout: "typed_minutes", text, textUpTo: (s) => csv(s).text, options: { import: importDefaults, isolationAtSeconds }, truth: truthOf(c) };
}

/** `count` independent logs from `firstSeed` (a quarter of them hand-typed). */
export function independentLogs(count: number, firstSeed = 7_000_001): IndependentLog[] {
  const out: IndependentLog[] = [];
  for (let k = 0; k < count; k++) {
    const g = generator(firstSeed + k);
    let r = g.next();
    let kind: Kind = KINDS[KINDS.length - 1][0];
    for (const [name, share] of KINDS) {
      if (r < share) {
        kind = name;
        break;
      }
      r -= share;
    }
    const typed = g.chance(0.25);
    const c = drawCurve(g, kind, typed);
    out.push(typed ? typedLog(g, c, `ind-${firstSeed + k}-${kind}`) : fileLog(g, c, `ind-${firstSeed + k}-${kind}`));
  }
  return out;
}
