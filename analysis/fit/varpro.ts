/**
 * Variable projection for the plateau hold models: for a fixed time constant τ the model
 * p0 + a·(1 − e^(−t/τ)) [+ l·t] is linear in (p0, a, l), so the residual sum of squares can be
 * minimised over τ alone ("projected" RSS), then all parameters are polished together.
 *
 * Reference: G. H. Golub & V. Pereyra, "The differentiation of pseudo-inverses and nonlinear least
 * squares problems whose variables separate", SIAM J. Numer. Anal. 10 (1973) 413; golden-section search:
 * J. Kiefer (1953); W. H. Press et al., Numerical Recipes (3rd ed.) §10.2.
 */
import type { HoldModelKind } from "../types";
import { solveLinearLeastSquares } from "./linear";
import { fitNonlinear, summariseFit, type NonlinearFit } from "./nls";
import { holdNonlinearModel } from "./models";

export interface ProjectedFit {
  tauSeconds: number;
  /** p0, a and (with a climb) l, microns and microns per second. */
  coef: number[];
  rss: number;
}

/**
 * The fixed part of the projection for one data set: an orthonormal basis Q of the columns that do not
 * depend on τ (1, and t with a climb; modified Gram–Schmidt, twice for stability) and the data's residual
 * y⊥ = y − QQᵀy. For a given τ only the rise column z = 1 − e^(−t/τ) has to be projected:
 * z⊥ = z − QQᵀz, a = (z⊥·y⊥)/‖z⊥‖², RSS(τ) = ‖y⊥‖² − (z⊥·y⊥)²/‖z⊥‖², an O(n) step per τ.
 * Reference: Golub & Van Loan §5.2.8 (modified Gram–Schmidt), Björck §2.4.5 (reorthogonalisation).
 */
export interface ProjectionBasis {
  t: Float64Array;
  p: Float64Array;
  q: Float64Array[];
  yPerp: Float64Array;
  yPerpNorm2: number;
  withClimb: boolean;
  scratch: Float64Array;
}

function orthogonalise(v: Float64Array, q: Float64Array[], passes = 2): void {
  for (let pass = 0; pass < passes; pass++)
    for (const qk of q) {
      let dot = 0;
      for (let i = 0; i < v.length; i++) dot += qk[i] * v[i];
      for (let i = 0; i < v.length; i++) v[i] -= dot * qk[i];
    }
}

export function projectionBasis(t: ArrayLike<number>, p: ArrayLike<number>, withClimb: boolean): ProjectionBasis {
  const n = t.length;
  const cols = [new Float64Array(n).fill(1)];
  if (withClimb) cols.push(Float64Array.from(t));
  const q: Float64Array[] = [];
  for (const c of cols) {
    orthogonalise(c, q);
    let norm = 0;
    for (let i = 0; i < n; i++) norm += c[i] * c[i];
    norm = Math.sqrt(norm);
    for (let i = 0; i < n; i++) c[i] /= norm;
    q.push(c);
  }
  const yPerp = Float64Array.from(p);
  orthogonalise(yPerp, q);
  let yPerpNorm2 = 0;
  for (let i = 0; i < n; i++) yPerpNorm2 += yPerp[i] * yPerp[i];
  return { t: Float64Array.from(t), p: Float64Array.from(p), q, yPerp, yPerpNorm2, withClimb, scratch: new Float64Array(n) };
}

/**
 * Projected RSS (microns²) at a fixed τ and the plateau height a; rss = Infinity when the rise column is
 * (numerically) inside the span of the fixed columns, so τ cannot be separated from them.
 */
function projectedRss(b: ProjectionBasis, tauSeconds: number): { rss: number; a: number } {
  const z = b.scratch;
  const n = z.length;
  let zNorm2Raw = 0;
  for (let i = 0; i < n; i++) {
    z[i] = -Math.expm1(-b.t[i] / tauSeconds);
    zNorm2Raw += z[i] * z[i];
  }
  // One pass suffices here: Q is orthonormal to rounding, and a z nearly inside span(Q) is rejected below.
  orthogonalise(z, b.q, 1);
  let zz = 0;
  let zy = 0;
  for (let i = 0; i < n; i++) {
    zz += z[i] * z[i];
    zy += z[i] * b.yPerp[i];
  }
  if (!(zz > 1e-18 * zNorm2Raw)) return { rss: Infinity, a: 0 };
  return { rss: Math.max(0, b.yPerpNorm2 - (zy * zy) / zz), a: zy / zz };
}

/**
 * Best (p0, a[, l]) for a fixed τ and its RSS (microns²), by QR on the basis 1, 1 − e^(−t/τ)[, t]
 * (the full solve, used once at the chosen τ; the search itself uses the O(n) projected RSS).
 */
export function projectedFit(t: ArrayLike<number>, p: ArrayLike<number>, tauSeconds: number, withClimb: boolean): ProjectedFit {
  const n = t.length;
  const ones = new Float64Array(n).fill(1);
  const rise = new Float64Array(n);
  for (let i = 0; i < n; i++) rise[i] = -Math.expm1(-t[i] / tauSeconds);
  const cols: ArrayLike<number>[] = withClimb ? [ones, rise, t] : [ones, rise];
  const ls = solveLinearLeastSquares(cols, p, 1e-9);
  if (ls.rank < cols.length) return { tauSeconds, coef: ls.coef, rss: Infinity };
  const [p0, a] = ls.coef;
  const l = withClimb ? ls.coef[2] : 0;
  let rss = 0;
  for (let i = 0; i < n; i++) {
    const r = p[i] - (p0 + a * rise[i] + l * t[i]);
    rss += r * r;
  }
  return { tauSeconds, coef: ls.coef, rss };
}

export interface TimeConstantSearch {
  best: ProjectedFit;
  /** "low": best τ at the shortest tried (a step); "high": at the longest (no bend seen); null: inside. */
  atEdge: "low" | "high" | null;
  evaluations: number;
}

/**
 * Minimise the projected RSS over ln τ: a grid of `gridPoints` values log-spaced from tauMinSeconds
 * to tauMaxSeconds brackets the minimum, then golden-section search refines it to 1e-5 in ln τ (the Levenberg–Marquardt polish does the rest); the
 * linear coefficients at the best τ come from a full QR solve (projectedFit).
 */
export function searchTimeConstant(
  t: ArrayLike<number>,
  p: ArrayLike<number>,
  withClimb: boolean,
  tauMinSeconds: number,
  tauMaxSeconds: number,
  gridPoints = 32,
): TimeConstantSearch {
  const basis = projectionBasis(t, p, withClimb);
  const lo = Math.log(tauMinSeconds);
  const hi = Math.log(tauMaxSeconds);
  const gridU: number[] = [];
  const gridRss: number[] = [];
  for (let k = 0; k < gridPoints; k++) {
    const u = lo + ((hi - lo) * k) / (gridPoints - 1);
    gridU.push(u);
    gridRss.push(projectedRss(basis, Math.exp(u)).rss);
  }
  let iBest = 0;
  for (let k = 1; k < gridPoints; k++) if (gridRss[k] < gridRss[iBest]) iBest = k;
  let evaluations = gridPoints;
  const finish = (u: number, atEdge: TimeConstantSearch["atEdge"]): TimeConstantSearch => ({
    best: projectedFit(t, p, Math.exp(u), withClimb),
    atEdge,
    evaluations: evaluations + 1,
  });
  if (iBest === 0 || iBest === gridPoints - 1 || !Number.isFinite(gridRss[iBest])) {
    return finish(gridU[iBest], iBest === 0 ? "low" : "high");
  }
  const f = (u: number) => {
    evaluations++;
    return projectedRss(basis, Math.exp(u)).rss;
  };
  const ratio = (Math.sqrt(5) - 1) / 2;
  let a = gridU[iBest - 1];
  let b = gridU[iBest + 1];
  let c = b - ratio * (b - a);
  let d = a + ratio * (b - a);
  let fc = f(c);
  let fd = f(d);
  while (b - a > 1e-5) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - ratio * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + ratio * (b - a);
      fd = f(d);
    }
  }
  let uBest = fc < fd ? c : d;
  if (gridRss[iBest] < Math.min(fc, fd)) uBest = gridU[iBest];
  return finish(uBest, null);
}

export interface PlateauFitOutcome {
  fit: NonlinearFit | null;
  /** Why there is no fit: "step" (τ below the shortest tried) or "no_bend" (τ beyond the longest). */
  notIdentified: "step" | "no_bend" | "too_few_points" | null;
}

/**
 * Fit plateau (withClimb false) or plateau_climb (true) to (t seconds, p microns): variable projection
 * over τ ∈ [tauMinSeconds, tauMaxSeconds], then a Levenberg–Marquardt polish of all parameters with
 * fitNonlinear (nls.ts) from the projected solution; the polish is kept only if it does not raise the RSS.
 */
export function fitPlateauModel(
  t: ArrayLike<number>,
  p: ArrayLike<number>,
  withClimb: boolean,
  tauMinSeconds: number,
  tauMaxSeconds: number,
): PlateauFitOutcome {
  const kind: HoldModelKind = withClimb ? "plateau_climb" : "plateau";
  const nParams = withClimb ? 4 : 3;
  if (t.length < nParams + 2) return { fit: null, notIdentified: "too_few_points" };
  const search = searchTimeConstant(t, p, withClimb, tauMinSeconds, tauMaxSeconds);
  if (search.atEdge) return { fit: null, notIdentified: search.atEdge === "low" ? "step" : "no_bend" };
  const { coef, tauSeconds } = search.best;
  const start = withClimb ? [coef[0], coef[1], tauSeconds, coef[2]] : [coef[0], coef[1], tauSeconds];
  const model = holdNonlinearModel(kind);
  const polished = fitNonlinear(model, t, p, start, { maxIterations: 30, stepTolerance: 1e-8, gradientTolerance: 1e-9 });
  const polishOk =
    polished.stopReason !== "non_finite" && polished.params[2] > 0 && polished.rss <= search.best.rss * (1 + 1e-12);
  const fit = polishOk ? polished : summariseFit(model, t, p, start, search.evaluations, "converged");
  return { fit, notIdentified: null };
}
