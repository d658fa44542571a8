/**
 * A nonlinear least-squares solution reported in one shape: summariseFit takes the plateau hold models'
 * variable-projection solution (varpro.ts) and gives its RSS, degrees of freedom and the linearised
 * covariance s²·(JᵀJ)⁻¹ by QR (no normal equations). The models are written as NonlinearModel (models.ts).
 */
import { solveLinearLeastSquares } from "./linear";

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

/** Σ (y − f(x; b))². */
function sumSquares(model: NonlinearModel, x: ArrayLike<number>, y: ArrayLike<number>, b: readonly number[]): number {
  let s = 0;
  if (model.values) {
    const f = new Float64Array(y.length);
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
