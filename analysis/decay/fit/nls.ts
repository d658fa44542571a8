/**
 * Generic nonlinear least squares (Levenberg–Marquardt), the one solver behind every nonlinear fit
 * in Riseline (the NIST StRD checks call it directly); summariseFit reports the plateau hold models'
 * variable-projection solution the same way (varpro.ts).
 */
import { solveLinearLeastSquares, solveLinearLeastSquaresInPlace } from "./linear";

export interface NonlinearModel {
  /** Model value at x for parameters b. */
  value(x: number, b: readonly number[]): number;
  /** Partial derivatives ∂f/∂b_j at x, written into out (length = b.length). Optional: central differences otherwise. */
  gradient?(x: number, b: readonly number[], out: number[]): void;
  /**
   * Optional batch form of value: out[i] = value(x[i], b) for every i, by the same arithmetic (so the same
   * bits); saves a call per point in the solver's loops.
   */
  values?(x: ArrayLike<number>, b: readonly number[], out: Float64Array): void;
  /** Optional batch form of gradient: cols[j][i] = ∂f(x_i)/∂b_j, the same arithmetic as gradient. */
  jacobian?(x: ArrayLike<number>, b: readonly number[], cols: Float64Array[]): void;
}

export interface NonlinearOptions {
  /** Default 200. */
  maxIterations?: number;
  /** Relative step size below which the fit has converged (default 1e-12). */
  stepTolerance?: number;
  /** Relative RSS decrease below which the fit has converged (default 1e-15). */
  rssTolerance?: number;
  /**
   * Largest accepted change of a nonzero parameter in one step, as a multiple of its current size
   * (default 10). Larger steps are damped further, which keeps a parameter from "evaporating" to a
   * flat region where its gradient vanishes (the trap of BoxBOD start 1).
   */
  maxRelativeStep?: number;
  /** Converged when every column of J is this close to orthogonal to the residuals (cosine; default 1e-13). */
  gradientTolerance?: number;
}

export type StopReason = "converged" | "iteration_limit" | "non_finite" | "closed_form";

export interface NonlinearFit {
  params: number[];
  /** √diag(covariance). */
  stdErrors: number[];
  /** s²·(JᵀJ)⁻¹ at the solution, s² = rss/dof. */
  covariance: number[][];
  rss: number;
  dof: number;
  /** √(rss/dof). */
  residualSd: number;
  iterations: number;
  stopReason: StopReason;
}

/** Σ (y − f(x; b))²; `work` (length ≥ y's) is scratch for the batch form when the model has one. */
function sumSquares(model: NonlinearModel, x: ArrayLike<number>, y: ArrayLike<number>, b: readonly number[], work?: Float64Array): number {
  let s = 0;
  if (model.values) {
    const f = work ?? new Float64Array(y.length);
    model.values(x, b, f);
    for (let i = 0; i < y.length; i++) {
      const r = y[i] - f[i];
      s += r * r;
    }
    return s;
  }
  for (let i = 0; i < y.length; i++) {
    const r = y[i] - model.value(x[i], b);
    s += r * r;
  }
  return s;
}

/**
 * Jacobian columns J[j][i] = ∂f(x_i)/∂b_j (analytic when the model gives one, else central differences),
 * written into `cols` when given (p arrays of length ≥ n), else into fresh arrays.
 */
function jacobianColumns(model: NonlinearModel, x: ArrayLike<number>, b: readonly number[], cols?: Float64Array[]): Float64Array[] {
  const n = x.length;
  const p = b.length;
  cols ??= Array.from({ length: p }, () => new Float64Array(n));
  if (model.jacobian) {
    model.jacobian(x, b, cols);
    return cols;
  }
  if (model.gradient) {
    const g = new Array<number>(p).fill(0);
    for (let i = 0; i < n; i++) {
      model.gradient(x[i], b, g);
      for (let j = 0; j < p; j++) cols[j][i] = g[j];
    }
    return cols;
  }
  for (let j = 0; j < p; j++) {
    // Central difference, step ≈ ∛ε·|b_j| (truncation and rounding errors balanced).
    const h = 6e-6 * Math.max(Math.abs(b[j]), 1e-8);
    const up = b.slice();
    const down = b.slice();
    up[j] += h;
    down[j] -= h;
    for (let i = 0; i < n; i++) cols[j][i] = (model.value(x[i], up) - model.value(x[i], down)) / (2 * h);
  }
  return cols;
}

/**
 * Fit y ≈ f(x; b) by Levenberg–Marquardt with Marquardt's diagonal scaling.
 *
 * Method: each step solves the damped problem min ‖J·δ − r‖² + λ‖D·δ‖² as an augmented least-squares
 * system by Householder QR (no normal equations, so no squared condition number), with D the largest
 * column norms of J seen so far (Moré 1978). λ falls ×0.1 after a successful step and rises ×10 after a
 * failed one; a step that would change a nonzero parameter by more than maxRelativeStep times its size
 * counts as failed (a crude trust region in relative terms, in the spirit of Moré's step bound). Stops
 * ("converged") when every relative parameter step is below stepTolerance, the relative RSS decrease is
 * below rssTolerance, the residuals are orthogonal to every Jacobian column to gradientTolerance (MINPACK's
 * gtol test), or a failed step is already below stepTolerance or λ passes 1e16 (the minimum is reached to
 * machine precision); at maxIterations ("iteration_limit"), or when the model
 * stops giving finite values ("non_finite"). Covariance s²·(JᵀJ)⁻¹ by QR at the solution.
 * Units: parameters in the model's units; rss in y units squared.
 * References: K. Levenberg (1944), D. W. Marquardt, J. SIAM 11 (1963) 431; J. J. Moré, "The
 * Levenberg–Marquardt algorithm: implementation and theory", Lecture Notes in Math. 630 (1978) 105.
 * Checked against the NIST StRD nonlinear regression certified values (tests/analysis/fit-nist.test.ts).
 */
export function fitNonlinear(
  model: NonlinearModel,
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  start: readonly number[],
  options: NonlinearOptions = {},
): NonlinearFit {
  const maxIterations = options.maxIterations ?? 200;
  const stepTol = options.stepTolerance ?? 1e-12;
  const rssTol = options.rssTolerance ?? 1e-15;
  const maxRelStep = options.maxRelativeStep ?? 10;
  const gradTol = options.gradientTolerance ?? 1e-13;
  const n = y.length;
  const p = start.length;
  let b = start.slice();
  // work arrays reused by every iteration and trial (the solver overwrites aug and qty)
  const work = new Float64Array(n);
  const jac = Array.from({ length: p }, () => new Float64Array(n));
  const aug = Array.from({ length: p }, () => new Float64Array(n + p));
  const resid = new Float64Array(n + p);
  const qty = new Float64Array(n + p);
  let rss = sumSquares(model, x, y, b, work);
  let stopReason: StopReason = "iteration_limit";
  let iterations = 0;
  if (!Number.isFinite(rss)) return finish(model, x, y, b, rss, 0, "non_finite");
  let lambda = 1e-3;
  const d = new Array<number>(p).fill(0);
  outer: for (; iterations < maxIterations; ) {
    iterations++;
    jacobianColumns(model, x, b, jac);
    if (model.values) {
      model.values(x, b, work);
      for (let i = 0; i < n; i++) resid[i] = y[i] - work[i];
    } else for (let i = 0; i < n; i++) resid[i] = y[i] - model.value(x[i], b);
    let worstCosine = 0;
    const residNorm = Math.sqrt(rss);
    for (let j = 0; j < p; j++) {
      const col = jac[j];
      let s = 0;
      let g = 0;
      for (let i = 0; i < n; i++) {
        s += col[i] * col[i];
        g += col[i] * resid[i];
      }
      d[j] = Math.max(d[j], Math.sqrt(s));
      if (!Number.isFinite(d[j])) {
        stopReason = "non_finite";
        break outer;
      }
      if (s > 0 && residNorm > 0) worstCosine = Math.max(worstCosine, Math.abs(g) / (Math.sqrt(s) * residNorm));
    }
    if (worstCosine <= gradTol) {
      stopReason = "converged";
      break;
    }
    for (;;) {
      const sqrtLambda = Math.sqrt(lambda);
      for (let j = 0; j < p; j++) {
        const a = aug[j];
        a.set(jac[j]);
        a.fill(0, n);
        a[n + j] = sqrtLambda * (d[j] > 0 ? d[j] : 1);
      }
      qty.set(resid);
      const step = solveLinearLeastSquaresInPlace(aug, qty, 1e-14).coef;
      const trial = b.map((v, j) => v + step[j]);
      const tooFar = step.some((s, j) => b[j] !== 0 && Math.abs(s) > maxRelStep * Math.abs(b[j]));
      const trialRss = tooFar ? NaN : sumSquares(model, x, y, trial, work);
      if (Number.isFinite(trialRss) && trialRss <= rss) {
        const smallStep = step.every((s, j) => Math.abs(s) <= stepTol * (Math.abs(b[j]) + stepTol));
        const smallDecrease = rss - trialRss <= rssTol * rss;
        b = trial;
        rss = trialRss;
        lambda = Math.max(lambda * 0.1, 1e-15);
        if (smallStep || smallDecrease) {
          stopReason = "converged";
          break outer;
        }
        break;
      }
      const smallStep = step.every((s, j) => Math.abs(s) <= stepTol * (Math.abs(b[j]) + stepTol));
      lambda *= 10;
      if (smallStep || lambda > 1e16) {
        stopReason = "converged";
        break outer;
      }
    }
  }
  return finish(model, x, y, b, rss, iterations, stopReason);
}

/**
 * Summarise a least-squares solution b without iterating: rss, dof, s²·(JᵀJ)⁻¹ (by QR), standard errors.
 * Used when a solution comes from elsewhere (variable projection) and must be reported the same way.
 */
export function summariseFit(
  model: NonlinearModel,
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  b: readonly number[],
  iterations: number,
  stopReason: StopReason,
): NonlinearFit {
  return finish(model, x, y, b.slice(), sumSquares(model, x, y, b), iterations, stopReason);
}

function finish(
  model: NonlinearModel,
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  b: number[],
  rss: number,
  iterations: number,
  stopReason: StopReason,
): NonlinearFit {
  const p = b.length;
  const dof = y.length - p;
  const s2 = dof > 0 ? rss / dof : NaN;
  let covariance: number[][] = Array.from({ length: p }, () => new Array<number>(p).fill(NaN));
  if (Number.isFinite(rss)) {
    const ls = solveLinearLeastSquares(jacobianColumns(model, x, b), new Float64Array(y.length));
    if (ls.rank === p) covariance = ls.inverseNormal.map((row) => row.map((v) => v * s2));
  }
  return {
    params: b,
    stdErrors: covariance.map((row, j) => Math.sqrt(row[j])),
    covariance,
    rss,
    dof,
    residualSd: Math.sqrt(s2),
    iterations,
    stopReason: Number.isFinite(rss) ? stopReason : "non_finite",
  };
}
