/**
 * Variable projection for the plateau hold models: for a fixed time constant τ the model
 * p0 + a·(1 − e^(−t/τ)) [+ l·t] is linear in (p0, a, l), so the residual sum of squares can be
 * minimised over τ alone ("projected" RSS); at the best τ the linear parameters follow exactly, so that
 * point is the joint least-squares minimum (Golub & Pereyra's theorem) and no joint iteration is needed.
 *
 * Reference: G. H. Golub & V. Pereyra, "The differentiation of pseudo-inverses and nonlinear least
 * squares problems whose variables separate", SIAM J. Numer. Anal. 10 (1973) 413; golden-section search:
 * J. Kiefer (1953); W. H. Press et al., Numerical Recipes (3rd ed.) §10.2.
 */
import type { HoldModelKind } from "../types";
import { solveLinearLeastSquares } from "./linear";
import { summariseFit, type NonlinearFit, type NonlinearModel } from "./nls";
import { holdNonlinearModel } from "./models";

export interface ProjectedFit {
  tauSeconds: number;
  /** p0 (unless left out), a and (with a climb) l, microns and microns per second. */
  coef: number[];
  rss: number;
}

/**
 * The fixed part of the projection for one data set: an orthonormal basis Q of the columns that do not
 * depend on τ (1 unless the offset is left out, and t with a climb; modified Gram–Schmidt, twice for
 * stability) and the data's residual
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
  /** False for the rise from zero, a·(1 − e^(−t/τ)) [+ l·t] (no constant column). */
  withOffset: boolean;
}

function orthogonalise(v: Float64Array, q: Float64Array[], passes = 2): void {
  for (let pass = 0; pass < passes; pass++)
    for (const qk of q) {
      let dot = 0;
      for (let i = 0; i < v.length; i++) dot += qk[i] * v[i];
      for (let i = 0; i < v.length; i++) v[i] -= dot * qk[i];
    }
}

export function projectionBasis(t: ArrayLike<number>, p: ArrayLike<number>, withClimb: boolean, withOffset = true): ProjectionBasis {
  const n = t.length;
  const cols: Float64Array[] = [];
  if (withOffset) cols.push(new Float64Array(n).fill(1));
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
  return { t: Float64Array.from(t), p: Float64Array.from(p), q, yPerp, yPerpNorm2, withClimb, withOffset };
}

/**
 * Projected RSS (microns²) at a fixed τ; Infinity when the rise column is (numerically) inside the span of
 * the fixed columns, so τ cannot be separated from them.
 *
 * One O(n) pass, no allocation: with z = 1 − e^(−t/τ), q₁ = 1/√n and q₂ (the unit centred time column, with a
 * climb), z⊥ = z − QQᵀz has ‖z⊥‖² = Σz² − (Σz)²/n − (z·q₂)² (without the offset there is no q₁ and its
 * term, and q₂ is the unit time column itself), and because y⊥ is orthogonal to Q,
 * z⊥·y⊥ = z·y⊥. So RSS(τ) = ‖y⊥‖² − (z·y⊥)²/‖z⊥‖² needs only the sums Σz, Σz², Σz·q₂ and Σz·y⊥.
 * The subtraction in ‖z⊥‖² loses about log10(‖z‖²/‖z⊥‖²) digits; a z within 1e-9 of span(Q) is rejected.
 */
export function projectedRss(b: ProjectionBasis, tauSeconds: number): number {
  const t = b.t;
  const yPerp = b.yPerp;
  const n = t.length;
  const rate = 1 / tauSeconds;
  let sz = 0;
  let szz = 0;
  let szy = 0;
  let szq = 0;
  if (b.withClimb) {
    const q2 = b.q[b.q.length - 1];
    for (let i = 0; i < n; i++) {
      const z = -Math.expm1(-t[i] * rate);
      sz += z;
      szz += z * z;
      szy += z * yPerp[i];
      szq += z * q2[i];
    }
  } else {
    for (let i = 0; i < n; i++) {
      const z = -Math.expm1(-t[i] * rate);
      sz += z;
      szz += z * z;
      szy += z * yPerp[i];
    }
  }
  const zz = szz - (b.withOffset ? (sz * sz) / n : 0) - szq * szq;
  if (!(zz > 1e-18 * szz)) return Infinity;
  return Math.max(0, b.yPerpNorm2 - (szy * szy) / zz);
}

/**
 * Best (p0, a[, l]) for a fixed τ and its RSS (microns²), by QR on the basis 1, 1 − e^(−t/τ)[, t]
 * (without the offset: (a[, l]) on 1 − e^(−t/τ)[, t]); the full solve, used once at the chosen τ; the
 * search itself uses the O(n) projected RSS.
 */
export function projectedFit(t: ArrayLike<number>, p: ArrayLike<number>, tauSeconds: number, withClimb: boolean, withOffset = true): ProjectedFit {
  const n = t.length;
  const rise = new Float64Array(n);
  for (let i = 0; i < n; i++) rise[i] = -Math.expm1(-t[i] / tauSeconds);
  const cols: ArrayLike<number>[] = withOffset ? [new Float64Array(n).fill(1), rise] : [rise];
  if (withClimb) cols.push(t);
  const ls = solveLinearLeastSquares(cols, p, 1e-9);
  if (ls.rank < cols.length) return { tauSeconds, coef: ls.coef, rss: Infinity };
  const first = withOffset ? 1 : 0;
  const p0 = withOffset ? ls.coef[0] : 0;
  const a = ls.coef[first];
  const l = withClimb ? ls.coef[first + 1] : 0;
  let rss = 0;
  for (let i = 0; i < n; i++) {
    const r = p[i] - (p0 + a * rise[i] + l * t[i]);
    rss += r * r;
  }
  return { tauSeconds, coef: ls.coef, rss };
}

/** Above this many points the τ grid runs on group means (the Brent refinement always uses every point). */
export const GRID_FIT_POINTS = 256;

/**
 * Means of consecutive groups of ⌈n/maxPoints⌉ points (t ascending): at most maxPoints points that keep the
 * shape of the projected-RSS profile over τ, for bracketing its minimum cheaply. O(n).
 */
function groupMeans(t: ArrayLike<number>, p: ArrayLike<number>, maxPoints: number): [Float64Array, Float64Array] {
  const n = t.length;
  const size = Math.ceil(n / maxPoints);
  const m = Math.ceil(n / size);
  const tm = new Float64Array(m);
  const pm = new Float64Array(m);
  for (let g = 0; g < m; g++) {
    const from = g * size;
    const to = Math.min(n, from + size);
    let st = 0;
    let sp = 0;
    for (let i = from; i < to; i++) {
      st += t[i];
      sp += p[i];
    }
    tm[g] = st / (to - from);
    pm[g] = sp / (to - from);
  }
  return [tm, pm];
}

export interface TimeConstantSearch {
  best: ProjectedFit;
  /** "low": best τ at the shortest tried (a step); "high": at the longest (no bend seen); null: inside. */
  atEdge: "low" | "high" | null;
  evaluations: number;
}

/**
 * Minimise the projected RSS over ln τ: a grid of `gridPoints` values log-spaced from tauMinSeconds
 * to tauMaxSeconds brackets the minimum (with more than GRID_FIT_POINTS points: the grid on group means, then a
 * downhill walk along the grid on every point to a grid minimum of the full profile), then Brent's method (golden section with parabolic steps) refines it to 1e-5 in
 * ln τ no coarser than 1e-9 (in practice the minimum of a smooth function is only located to about
 * √ε ≈ 1.5e-8 relative, far inside any parameter's uncertainty); the
 * linear coefficients at the best τ come from a full QR solve (projectedFit).
 */
export function searchTimeConstant(
  t: ArrayLike<number>,
  p: ArrayLike<number>,
  withClimb: boolean,
  tauMinSeconds: number,
  tauMaxSeconds: number,
  gridPoints = 32,
  withOffset = true,
): TimeConstantSearch {
  const basis = projectionBasis(t, p, withClimb, withOffset);
  // the grid only brackets the minimum: on a long hold it runs on ≤ GRID_FIT_POINTS group means
  const grouped = t.length > GRID_FIT_POINTS ? groupMeans(t, p, GRID_FIT_POINTS) : null;
  const coarse = grouped ? projectionBasis(grouped[0], grouped[1], withClimb, withOffset) : basis;
  const lo = Math.log(tauMinSeconds);
  const hi = Math.log(tauMaxSeconds);
  const gridU: number[] = [];
  const gridRss: number[] = [];
  for (let k = 0; k < gridPoints; k++) {
    const u = lo + ((hi - lo) * k) / (gridPoints - 1);
    gridU.push(u);
    gridRss.push(projectedRss(coarse, Math.exp(u)));
  }
  let iBest = 0;
  for (let k = 1; k < gridPoints; k++) if (gridRss[k] < gridRss[iBest]) iBest = k;
  let evaluations = gridPoints;
  const f = (u: number) => {
    evaluations++;
    return projectedRss(basis, Math.exp(u));
  };
  const finish = (u: number, atEdge: TimeConstantSearch["atEdge"]): TimeConstantSearch => ({
    best: projectedFit(t, p, Math.exp(u), withClimb, withOffset),
    atEdge,
    evaluations: evaluations + 1,
  });
  let fBest = gridRss[iBest];
  if (coarse !== basis) {
    // confirm on every point: walk the grid downhill from the coarse minimum to a minimum of the full profile
    const full = new Map<number, number>();
    const at = (k: number) => {
      let v = full.get(k);
      if (v === undefined) full.set(k, (v = f(gridU[k])));
      return v;
    };
    for (;;) {
      if (iBest > 0 && at(iBest - 1) < at(iBest)) iBest--;
      else if (iBest < gridPoints - 1 && at(iBest + 1) < at(iBest)) iBest++;
      else break;
    }
    fBest = at(iBest);
  }
  if (iBest === 0 || iBest === gridPoints - 1 || !Number.isFinite(fBest)) {
    return finish(gridU[iBest], iBest === 0 ? "low" : "high");
  }
  const m = brentMinimum(f, gridU[iBest - 1], gridU[iBest + 1], gridU[iBest], fBest, 1e-9);
  const uBest = m.x;
  return finish(uBest, null);
}

/**
 * Minimum of a function of one variable on [a, b], starting from x with f(x) = fx (a bracketing interior
 * point), by Brent's method: parabolic interpolation through the three best points, falling back to a
 * golden-section step when the parabola is not trusted; stops when the bracket is within 2·tol of x.
 * Reference: R. P. Brent, Algorithms for Minimization without Derivatives (1973), ch. 5; Press et al.,
 * Numerical Recipes (3rd ed.) §10.3.
 */
export function brentMinimum(f: (x: number) => number, a: number, b: number, x: number, fx: number, tol: number, maxIterations = 100): { x: number; fx: number } {
  const golden = 0.381966011250105; // (3 − √5)/2
  let w = x;
  let v = x;
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  for (let it = 0; it < maxIterations; it++) {
    const mid = 0.5 * (a + b);
    const tol1 = tol + 1e-10 * Math.abs(x);
    const tol2 = 2 * tol1;
    if (Math.abs(x - mid) <= tol2 - 0.5 * (b - a)) break;
    let useGolden = true;
    if (Math.abs(e) > tol1) {
      const r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      if (Math.abs(p) < Math.abs(0.5 * q * e) && p > q * (a - x) && p < q * (b - x)) {
        e = d;
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = mid >= x ? tol1 : -tol1;
        useGolden = false;
      }
    }
    if (useGolden) {
      e = x >= mid ? a - x : b - x;
      d = golden * e;
    }
    const u = Math.abs(d) >= tol1 ? x + d : x + (d > 0 ? tol1 : -tol1);
    const fu = f(u);
    if (fu <= fx) {
      if (u >= x) a = x;
      else b = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return { x, fx };
}

export interface PlateauFitOutcome {
  fit: NonlinearFit | null;
  /** Why there is no fit: "step" (τ below the shortest tried) or "no_bend" (τ beyond the longest). */
  notIdentified: "step" | "no_bend" | "too_few_points" | null;
}

/**
 * The rise from zero, y = a·(1 − e^(−t/τ)), as a NonlinearModel over b = [a, τ]: the plateau model
 * without its offset, for summariseFit when withOffset is false (the form of the NIST StRD problems
 * Misra1a and BoxBOD, y = b1·(1 − e^(−b2·x)) with b1 = a and b2 = 1/τ).
 */
const RISE_FROM_ZERO: NonlinearModel = {
  value: (t, b) => b[0] * -Math.expm1(-t / b[1]),
  gradient: (t, b, out) => {
    out[0] = -Math.expm1(-t / b[1]);
    out[1] = (-b[0] * t * Math.exp(-t / b[1])) / (b[1] * b[1]);
  },
};

/**
 * Fit plateau (withClimb false) or plateau_climb (true) to (t seconds, p microns): variable projection
 * over τ ∈ [tauMinSeconds, tauMaxSeconds] (searchTimeConstant). The projected minimum is the joint
 * least-squares solution (Golub & Pereyra 1973, Theorem 2.1: minimisers of the projected functional and
 * of the full one coincide), so a joint Levenberg–Marquardt iteration from it would only move τ within
 * the search tolerance; the solution is summarised by summariseFit (RSS, s²·(JᵀJ)⁻¹ by QR, standard
 * errors), with iterations = projected-RSS evaluations. withOffset false fits the rise from zero
 * (b = [a, τ], no climb): the same search, checked against NIST StRD Misra1a and BoxBOD
 * (tests/analysis/fit-nist.test.ts).
 */
export function fitPlateauModel(
  t: ArrayLike<number>,
  p: ArrayLike<number>,
  withClimb: boolean,
  tauMinSeconds: number,
  tauMaxSeconds: number,
  withOffset = true,
): PlateauFitOutcome {
  if (!withOffset && withClimb) throw new Error("fitPlateauModel: the rise from zero has no climb term");
  const kind: HoldModelKind = withClimb ? "plateau_climb" : "plateau";
  const nParams = (withClimb ? 4 : 3) - (withOffset ? 0 : 1);
  if (t.length < nParams + 2) return { fit: null, notIdentified: "too_few_points" };
  const search = searchTimeConstant(t, p, withClimb, tauMinSeconds, tauMaxSeconds, 32, withOffset);
  if (search.atEdge) return { fit: null, notIdentified: search.atEdge === "low" ? "step" : "no_bend" };
  const { coef, tauSeconds } = search.best;
  if (!withOffset) return { fit: summariseFit(RISE_FROM_ZERO, t, p, [coef[0], tauSeconds], search.evaluations, "converged"), notIdentified: null };
  const start = withClimb ? [coef[0], coef[1], tauSeconds, coef[2]] : [coef[0], coef[1], tauSeconds];
  const model = holdNonlinearModel(kind);
  return { fit: summariseFit(model, t, p, start, search.evaluations, "converged"), notIdentified: null };
}
