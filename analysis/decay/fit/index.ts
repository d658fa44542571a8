/**
 * Fitting the hold (the rise after isolation): all four models, spikes left out, one chosen by rule.
 */
import { LogError } from "../../shared/errors";
import type { HoldFitResult, HoldModelKind, ModelFit } from "../types";
import { fitStraightLine } from "./linear";
import { HOLD_MODEL_PARAMS, holdModelMicrons, paramsFromVector } from "./models";
import type { NonlinearFit } from "./nls";
import { reduceHold, type ReducedHold } from "./reduce";
import { medianIntervalSeconds } from "../phases/smooth";
import { findSpikesInResiduals } from "./robust";
import { aiccLeastSquares, chooseHoldModel } from "./select";
import { fitPlateauModel, type PlateauFitOutcome } from "./varpro";

export type { NonlinearFit, NonlinearModel } from "./nls";
export { fitStraightLine, solveLinearLeastSquares } from "./linear";

/**
 * Pressure in microns the fitted model predicts at tSeconds after isolation
 * (p0 + a·(1 − e^(−t/τ)) + l·t with absent terms zero; l in microns per second).
 */
export function evaluateModel(fit: ModelFit, tSeconds: number): number {
  return holdModelMicrons(fit.params, tSeconds);
}

function maskOf(indices: number[], n: number): Uint8Array {
  const mask = new Uint8Array(n);
  for (const i of indices) mask[i] = 1;
  return mask;
}

/** Residuals p − model at every reading (microns), in one tight loop. */
function residualsOf(params: ModelFit["params"], t: ArrayLike<number>, p: ArrayLike<number>): Float64Array {
  const out = new Float64Array(t.length);
  const p0 = params.p0;
  const a = params.a ?? 0;
  const tau = params.tauSeconds ?? 1;
  const l = params.l ?? 0;
  for (let i = 0; i < t.length; i++) out[i] = p[i] - (p0 + a * -Math.expm1(-t[i] / tau) + l * t[i]);
  return out;
}

/** Count, mean and total sum of squares (microns²) of the raw readings not skipped: the same for every model. */
interface KeptSpread {
  n: number;
  mean: number;
  tss: number;
}

function keptSpread(p: ArrayLike<number>, skip: Uint8Array): KeptSpread {
  let n = 0;
  let mean = 0;
  for (let i = 0; i < p.length; i++) {
    if (skip[i]) continue;
    n++;
    mean += p[i];
  }
  mean /= n;
  let tss = 0;
  for (let i = 0; i < p.length; i++) if (!skip[i]) tss += (p[i] - mean) ** 2;
  return { n, mean, tss };
}

/** Fit of one model on the reduced points, as the solver returned it. */
interface RawFit {
  kind: HoldModelKind;
  fit: NonlinearFit;
}

/** The τ range searched for the plateau models: [min(1 s, half a sample), 10× the hold], seconds. */
function tauRange(holdSeconds: number, sampleSeconds: number): [number, number] {
  return [Math.min(1, sampleSeconds / 2), 10 * holdSeconds];
}

/** plateau (withClimb false) or plateau_climb on the reduced points; null when the hold is too short to try. */
function plateauOutcome(r: ReducedHold, withClimb: boolean, holdSeconds: number, sampleSeconds: number): PlateauFitOutcome | null {
  const [tauMin, tauMax] = tauRange(holdSeconds, sampleSeconds);
  return tauMax > tauMin ? fitPlateauModel(r.tSeconds, r.microns, withClimb, tauMin, tauMax) : null;
}

function fitFlat(r: ReducedHold): NonlinearFit {
  const n = r.tSeconds.length;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += r.microns[i];
  mean /= n;
  let rss = 0;
  for (let i = 0; i < n; i++) rss += (r.microns[i] - mean) ** 2;
  const s2 = rss / (n - 1);
  return { params: [mean], stdErrors: [Math.sqrt(s2 / n)], covariance: [[s2 / n]], rss, dof: n - 1, residualSd: Math.sqrt(s2), iterations: 0, stopReason: "closed_form" };
}

function fitClimb(r: ReducedHold): NonlinearFit {
  const line = fitStraightLine(r.tSeconds, r.microns);
  return { params: [line.b0, line.b1], stdErrors: [line.sdB0, line.sdB1], covariance: line.covariance, rss: line.rss, dof: line.dof, residualSd: line.residualSd, iterations: 0, stopReason: "closed_form" };
}

/**
 * The four models on the reduced points, simplest first. `plateauClimb`, when given, is the plateau_climb
 * outcome already computed on these same points (the spike search's first fit), reused rather than redone.
 */
function fitOnReduced(r: ReducedHold, holdSeconds: number, sampleSeconds: number, notes: string[], plateauClimb?: PlateauFitOutcome | null): RawFit[] {
  const n = r.tSeconds.length;
  const out: RawFit[] = [];
  if (n >= 2) out.push({ kind: "flat", fit: fitFlat(r) });
  if (n >= 3) out.push({ kind: "climb", fit: fitClimb(r) });
  const [tauMin] = tauRange(holdSeconds, sampleSeconds);
  for (const withClimb of [false, true]) {
    const kind: HoldModelKind = withClimb ? "plateau_climb" : "plateau";
    const outcome = withClimb && plateauClimb !== undefined ? plateauClimb : plateauOutcome(r, withClimb, holdSeconds, sampleSeconds);
    if (!outcome) {
      notes.push(`${kind} not fitted: hold too short`);
      continue;
    }
    if (outcome.fit) out.push({ kind, fit: outcome.fit });
    else if (outcome.notIdentified === "step") notes.push(`${kind} not identified: best τ under ${tauMin} s (a step at isolation)`);
    else if (outcome.notIdentified === "no_bend") notes.push(`${kind} not identified: no bend within τ ≤ 10× the hold`);
    else notes.push(`${kind} not fitted: too few points`);
  }
  return out;
}

/**
 * The most flexible model that fits the reduced points (plateau_climb, else climb, else flat), for the
 * spike search; also returns the plateau_climb outcome so a pass without spikes need not refit it.
 */
function firstFit(r: ReducedHold, holdSeconds: number, sampleSeconds: number): { kind: HoldModelKind; fit: NonlinearFit; plateauClimb: PlateauFitOutcome | null } | null {
  const n = r.tSeconds.length;
  const plateauClimb = plateauOutcome(r, true, holdSeconds, sampleSeconds);
  if (plateauClimb?.fit) return { kind: "plateau_climb", fit: plateauClimb.fit, plateauClimb };
  if (n >= 3) return { kind: "climb", fit: fitClimb(r), plateauClimb };
  // plateau needs at least 5 points, so with under 3 only flat is left
  if (n >= 2) return { kind: "flat", fit: fitFlat(r), plateauClimb };
  return null;
}

/**
 * Turn a solver result into the shared ModelFit: rss, residual sd and R² over the raw kept readings.
 * `residuals`, when given, are p − model for this very fit (the spike search's), reused for the rss.
 */
function toModelFit(raw: RawFit, t: ArrayLike<number>, p: ArrayLike<number>, skip: Uint8Array, excluded: number[], nFit: number, spread: KeptSpread, residuals?: Float64Array): ModelFit {
  const names = HOLD_MODEL_PARAMS[raw.kind];
  const params = paramsFromVector(raw.kind, raw.fit.params);
  const stdErrors = paramsFromVector(raw.kind, raw.fit.stdErrors);
  const p0 = params.p0;
  const a = params.a ?? 0;
  const tau = params.tauSeconds ?? 1;
  const l = params.l ?? 0;
  const { n, tss } = spread;
  let rss = 0;
  if (residuals) {
    for (let i = 0; i < t.length; i++) if (!skip[i]) rss += residuals[i] * residuals[i];
  } else if (a !== 0) {
    for (let i = 0; i < t.length; i++) {
      if (skip[i]) continue;
      const r = p[i] - (p0 + a * -Math.expm1(-t[i] / tau) + l * t[i]);
      rss += r * r;
    }
  } else {
    for (let i = 0; i < t.length; i++) {
      if (skip[i]) continue;
      const r = p[i] - (p0 + 0 + l * t[i]);
      rss += r * r;
    }
  }
  const dof = n - names.length;
  return {
    kind: raw.kind,
    params,
    stdErrors,
    covariance: raw.fit.covariance,
    n,
    dof,
    rss,
    residualSd: dof > 0 ? Math.sqrt(rss / dof) : NaN,
    rSquared: tss > 0 ? 1 - rss / tss : rss === 0 ? 1 : 0,
    aicc: aiccLeastSquares(raw.fit.rss, nFit, names.length),
    iterations: raw.fit.iterations,
    stopReason: raw.fit.stopReason,
    excluded,
  };
}

/**
 * Fit the four hold models to a hold and choose one.
 *
 * Input: tSeconds since isolation (ascending), microns (same length). Method:
 * 1. holds over BIN_ABOVE_POINTS (1,000) readings are reduced to 500–1,000 equal-time-bin means
 *    (reduce.ts, which states why that fit stands in for the fit on every reading), so fitting costs one
 *    O(n) pass plus a constant;
 * 2. flat and climb by closed-form least squares (QR); plateau and plateau_climb by variable projection
 *    over τ ∈ [min(1 s, half a sample), 10× the hold], the exact joint least-squares minimum (varpro.ts);
 * 3. with robust (default true): readings more than 5 local robust sd off the most flexible fit are
 *    spikes (robust.ts), left out, and everything is refitted (only that one model is fitted before the
 *    spike search; without spikes it is kept and the other three are fitted on the same points);
 * 4. the model is chosen by the rule in select.ts (AICc margin 4 plus physical sanity).
 * Unweighted least squares, on purpose: gauge noise grows with the reading (a few % plus resolution
 * steps) but within one hold the reading rarely spans more than a decade, binning already tames
 * the noise, and weights taken from the noisy readings themselves would bias the fit towards low readings.
 * Reported per model: n = raw readings used (spikes left out), dof = n − parameters, rss / residualSd /
 * rSquared over those raw readings; covariance and stdErrors from s²·(JᵀJ)⁻¹ of the points fitted (the
 * bins when binned); aicc on the points fitted. Units: microns, seconds, l in microns per second.
 * Throws LogError("too_few_readings") with fewer than 2 readings or mismatched lengths.
 */
export function fitHoldModels(tSeconds: ArrayLike<number>, microns: ArrayLike<number>, options: { robust?: boolean } = {}): HoldFitResult {
  if (tSeconds.length !== microns.length) throw new LogError("too_few_readings", `hold has ${tSeconds.length} times but ${microns.length} readings`);
  if (tSeconds.length < 2) throw new LogError("too_few_readings", `hold has ${tSeconds.length} reading(s); at least 2 are needed to fit`);
  const robust = options.robust ?? true;
  const holdSeconds = tSeconds[tSeconds.length - 1] - Math.min(0, tSeconds[0]);
  const sampleSeconds = medianIntervalSeconds(tSeconds);
  const ctx = { holdSeconds, sampleSeconds };

  const run = (excluded: number[], reduced = reduceHold(tSeconds, microns, maskOf(excluded, tSeconds.length)), plateauClimb?: PlateauFitOutcome | null) => {
    const notes: string[] = [];
    const raws = fitOnReduced(reduced, holdSeconds, sampleSeconds, notes, plateauClimb);
    return { notes, reduced, raws };
  };
  let excluded: number[] = [];
  let pass: ReturnType<typeof run>;
  // residuals of the plateau_climb fit the spike search used, when that same fit is kept (no spikes)
  let flexibleResiduals: { fit: NonlinearFit; residuals: Float64Array } | null = null;
  if (robust) {
    // the spike search needs only the most flexible fit; the rest are fitted once the spikes are known
    const reduced = reduceHold(tSeconds, microns, maskOf(excluded, tSeconds.length));
    const flexible = firstFit(reduced, holdSeconds, sampleSeconds);
    if (flexible) {
      const params = paramsFromVector(flexible.kind, flexible.fit.params);
      const residuals = residualsOf(params, tSeconds, microns);
      excluded = findSpikesInResiduals(residuals);
      if (excluded.length === 0 && flexible.kind === "plateau_climb" && (params.a ?? 0) !== 0) flexibleResiduals = { fit: flexible.fit, residuals };
    }
    pass = excluded.length > 0 ? run(excluded) : run(excluded, reduced, flexible ? flexible.plateauClimb : undefined);
  } else pass = run(excluded);
  const fits: Partial<Record<HoldModelKind, ModelFit>> = {};
  const skip = maskOf(excluded, tSeconds.length);
  const spread = keptSpread(microns, skip);
  for (const raw of pass.raws) {
    const residuals = flexibleResiduals && raw.fit === flexibleResiduals.fit ? flexibleResiduals.residuals : undefined;
    fits[raw.kind] = toModelFit(raw, tSeconds, microns, skip, excluded, pass.reduced.tSeconds.length, spread, residuals);
  }
  const notes = pass.notes;
  if (excluded.length > 0) notes.push(`${excluded.length} spike(s) left out (over 5 local robust sd off the first fit)`);
  if (pass.reduced.binned)
    notes.push(`${tSeconds.length - excluded.length} readings reduced to ${pass.reduced.tSeconds.length} equal-time-bin means before fitting (AICc on the bins)`);
  const { chosen, rule } = chooseHoldModel(fits, ctx, notes);
  return { chosen, rule, fits };
}
