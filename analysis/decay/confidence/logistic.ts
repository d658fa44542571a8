/**
 * Logistic regression by Newton–Raphson (iteratively reweighted least squares) with an L2 penalty,
 * for mapping a verdict's evidence to the probability that the verdict is right: Platt scaling
 * (J. Platt, "Probabilistic outputs for support vector machines", 1999) widened from one score to a
 * few named features. Pure; used by `npm run calibrate`, not at analysis time.
 *
 * Model: P(right | x) = σ(w·[1, x]), σ(z) = 1/(1 + e^(−z)). Objective: the mean log-loss plus
 * ½·λ·Σ_{j≥1} w_j² (the intercept is not penalised). Method: Newton steps w ← w − H⁻¹·g, H the
 * Hessian Xᵀ·diag(p(1−p))·X/n + λI', solved by Gaussian elimination with partial pivoting; stops when
 * the largest step is under 1e-9 or after 100 iterations. Reference: T. Hastie, R. Tibshirani,
 * J. Friedman, The Elements of Statistical Learning, 2nd ed. (2009) §4.4.1 (from memory).
 */

export function sigmoid(z: number): number {
  return z >= 0 ? 1 / (1 + Math.exp(-z)) : Math.exp(z) / (1 + Math.exp(z));
}

/** w·[1, x]. */
export function linearScore(weights: readonly number[], x: readonly number[]): number {
  let z = weights[0];
  for (let j = 0; j < x.length; j++) z += weights[j + 1] * x[j];
  return z;
}

/** Solve A·v = b in place (A square, small), Gaussian elimination with partial pivoting; null when singular. */
function solve(a: number[][], b: number[]): number[] | null {
  const n = b.length;
  for (let c = 0; c < n; c++) {
    let piv = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r][c]) > Math.abs(a[piv][c])) piv = r;
    if (Math.abs(a[piv][c]) < 1e-14) return null;
    [a[c], a[piv]] = [a[piv], a[c]];
    [b[c], b[piv]] = [b[piv], b[c]];
    for (let r = c + 1; r < n; r++) {
      const f = a[r][c] / a[c][c];
      for (let k = c; k < n; k++) a[r][k] -= f * a[c][k];
      b[r] -= f * b[c];
    }
  }
  const v = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r];
    for (let k = r + 1; k < n; k++) s -= a[r][k] * v[k];
    v[r] = s / a[r][r];
  }
  return v;
}

export interface LogisticFit {
  /** Intercept first, then one weight per feature. */
  weights: number[];
  iterations: number;
  /** Mean log-loss on the data it was fitted to (nats). */
  logLoss: number;
  n: number;
}

/** Fit P(y = 1 | x) = σ(w·[1, x]) to rows x with labels y ∈ {0, 1}; lambda the L2 penalty per row. */
export function fitLogistic(xs: readonly number[][], ys: readonly number[], lambda = 1e-3): LogisticFit {
  const n = xs.length;
  const d = (xs[0]?.length ?? 0) + 1;
  const w = new Array<number>(d).fill(0);
  const mean = ys.reduce((s, y) => s + y, 0) / Math.max(n, 1);
  w[0] = Math.log(Math.min(Math.max(mean, 1e-3), 1 - 1e-3) / (1 - Math.min(Math.max(mean, 1e-3), 1 - 1e-3)));
  let it = 0;
  for (; it < 100 && n > 0; it++) {
    const g = new Array<number>(d).fill(0);
    const h = Array.from({ length: d }, () => new Array<number>(d).fill(0));
    for (let i = 0; i < n; i++) {
      const row = [1, ...xs[i]];
      const p = sigmoid(linearScore(w, xs[i]));
      const r = p - ys[i];
      const v = Math.max(p * (1 - p), 1e-9);
      for (let j = 0; j < d; j++) {
        g[j] += (r * row[j]) / n;
        for (let k = 0; k < d; k++) h[j][k] += (v * row[j] * row[k]) / n;
      }
    }
    for (let j = 1; j < d; j++) {
      g[j] += lambda * w[j];
      h[j][j] += lambda;
    }
    const step = solve(h, g);
    if (!step) break;
    let largest = 0;
    for (let j = 0; j < d; j++) {
      w[j] -= step[j];
      largest = Math.max(largest, Math.abs(step[j]));
    }
    if (largest < 1e-9) break;
  }
  let loss = 0;
  for (let i = 0; i < n; i++) {
    const p = Math.min(Math.max(sigmoid(linearScore(w, xs[i])), 1e-12), 1 - 1e-12);
    loss -= ys[i] * Math.log(p) + (1 - ys[i]) * Math.log(1 - p);
  }
  return { weights: w, iterations: it, logLoss: loss / Math.max(n, 1), n };
}
