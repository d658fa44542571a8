/**
 * Linear least squares by Householder QR, in double precision, with column scaling.
 *
 * Used directly for straight-line fits (Norris, the "climb" hold model), inside the variable
 * projection of the plateau models (the linear part for a fixed time constant) and for the
 * linearised covariance of a fit (nls.ts). Not simple-statistics' linearRegression: the fits need the
 * parameters' standard errors and covariance, and QR rather than normal equations (checked against NIST
 * StRD Norris to 10 digits).
 *
 * Reference: G. H. Golub & C. F. Van Loan, Matrix Computations (4th ed.), §5.2 (Householder QR)
 * and §5.3 (least squares via QR); Å. Björck, Numerical Methods for Least Squares Problems (1996), §2.
 */

/** Result of min ‖X·b − y‖² (columns given separately, each of length n). */
export interface LinearLeastSquares {
  /** Coefficients, one per column (0 for a column dropped as dependent). */
  coef: number[];
  /** (XᵀX)⁻¹ of the kept columns in original units; rows/cols of dropped columns are 0. */
  inverseNormal: number[][];
  /** Number of linearly independent columns kept. */
  rank: number;
  /** Columns dropped because they were (numerically) dependent on earlier ones. */
  dropped: number[];
}

/**
 * Solve min ‖X·b − y‖² by Householder QR.
 *
 * Method: each column is first divided by its Euclidean norm (so mixed units such as microns and
 * seconds do not spoil the pivot test), then reduced by Householder reflections; a column whose
 * remaining norm is below `rankTolerance` (relative, default 1e-10) of its original norm is treated as
 * dependent and dropped (coefficient 0). Back substitution gives b; R⁻¹R⁻ᵀ gives (XᵀX)⁻¹.
 * Unitless: the coefficients carry the units of y divided by the units of each column.
 * Reference: Golub & Van Loan §5.3.3 (QR solution of the full-rank problem); Björck §2.7 (scaling).
 */
export function solveLinearLeastSquares(
  columns: ArrayLike<number>[],
  y: ArrayLike<number>,
  rankTolerance = 1e-10,
): LinearLeastSquares {
  const a: Float64Array[] = [];
  for (let j = 0; j < columns.length; j++) a.push(copyOf(columns[j]));
  return solveLinearLeastSquaresInPlace(a, copyOf(y), rankTolerance);
}

function copyOf(v: ArrayLike<number>): Float64Array {
  if (v instanceof Float64Array) return v.slice();
  const out = new Float64Array(v.length);
  for (let i = 0; i < v.length; i++) out[i] = v[i];
  return out;
}

/**
 * solveLinearLeastSquares on work arrays it may overwrite: the columns `a` (each of length ≥ y's) and `qty`
 * (y on entry, Qᵀy on return). Same method and the same floating-point operations in the same order, so the
 * same bits; the Householder vector of each column is kept in the column's own lower part instead of a
 * fresh array (solveLinearLeastSquares copies its input and calls this).
 */
function solveLinearLeastSquaresInPlace(a: Float64Array[], qty: Float64Array, rankTolerance = 1e-10): LinearLeastSquares {
  const p = a.length;
  const n = qty.length;
  const scale: number[] = [];
  for (let j = 0; j < p; j++) {
    const col = a[j];
    let s = 0;
    for (let i = 0; i < n; i++) s += col[i] * col[i];
    s = Math.sqrt(s);
    scale.push(s > 0 ? s : 1);
    if (s > 0) for (let i = 0; i < n; i++) col[i] /= s;
  }
  const kept: number[] = [];
  const dropped: number[] = [];
  const rDiag: number[] = [];
  // R stored column by column: r[jk] for k < kept.length.
  const rCols: number[][] = [];
  let row = 0;
  for (let j = 0; j < p; j++) {
    const col = a[j];
    // Earlier reflections have already been applied to this column in place.
    let norm2 = 0;
    for (let i = row; i < n; i++) norm2 += col[i] * col[i];
    const norm = Math.sqrt(norm2);
    // Original scaled norm is 1 (or 0 for an all-zero column).
    if (!(norm > rankTolerance) || row >= n) {
      dropped.push(j);
      continue;
    }
    const alpha = col[row] > 0 ? -norm : norm;
    // v = x − alpha·e1, kept in place of col[row..n) (R's part of the column, above row, is untouched)
    const r0 = row;
    col[r0] -= alpha;
    let vNorm2 = 0;
    for (let i = r0; i < n; i++) vNorm2 += col[i] * col[i];
    if (vNorm2 !== 0) {
      for (let k = j + 1; k <= p; k++) {
        const target = k < p ? a[k] : qty;
        let dot = 0;
        for (let i = r0; i < n; i++) dot += col[i] * target[i];
        const f = (2 * dot) / vNorm2;
        for (let i = r0; i < n; i++) target[i] -= f * col[i];
      }
    }
    const rCol: number[] = [];
    for (let k = 0; k < kept.length; k++) rCol.push(col[k]);
    rCol.push(alpha);
    rCols.push(rCol);
    rDiag.push(alpha);
    kept.push(j);
    row++;
  }
  const m = kept.length;
  // Back substitution R·c = (Qᵀy)[0..m)
  const c = new Array<number>(m).fill(0);
  for (let i = m - 1; i >= 0; i--) {
    let s = qty[i];
    for (let k = i + 1; k < m; k++) s -= rCols[k][i] * c[k];
    c[i] = s / rDiag[i];
  }
  // R⁻¹ (upper triangular), then (XᵀX)⁻¹ = R⁻¹R⁻ᵀ in scaled units.
  const rInv: number[][] = Array.from({ length: m }, () => new Array<number>(m).fill(0));
  for (let j = 0; j < m; j++) {
    rInv[j][j] = 1 / rDiag[j];
    for (let i = j - 1; i >= 0; i--) {
      let s = 0;
      for (let k = i + 1; k <= j; k++) s += rCols[k][i] * rInv[k][j];
      rInv[i][j] = -s / rDiag[i];
    }
  }
  const coef = new Array<number>(p).fill(0);
  const inverseNormal: number[][] = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let i = 0; i < m; i++) {
    coef[kept[i]] = c[i] / scale[kept[i]];
    for (let j = 0; j < m; j++) {
      let s = 0;
      for (let k = Math.max(i, j); k < m; k++) s += rInv[i][k] * rInv[j][k];
      inverseNormal[kept[i]][kept[j]] = s / (scale[kept[i]] * scale[kept[j]]);
    }
  }
  return { coef, inverseNormal, rank: m, dropped };
}

/**
 * Straight line y = b0 + b1·x by QR, with the usual statistics.
 * Standard errors from s²·(XᵀX)⁻¹, s² = RSS/(n − 2); R² = 1 − RSS/Σ(y − ȳ)².
 * Reference: NIST/SEMATECH e-Handbook of Statistical Methods §4.1.4.1 (linear least squares).
 */
export function fitStraightLine(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
): { b0: number; b1: number; sdB0: number; sdB1: number; rss: number; dof: number; residualSd: number; rSquared: number; covariance: number[][] } {
  const n = y.length;
  const ones = new Float64Array(n).fill(1);
  const ls = solveLinearLeastSquares([ones, x], y);
  const [b0, b1] = ls.coef;
  let rss = 0;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += y[i];
  mean /= n;
  let tss = 0;
  for (let i = 0; i < n; i++) {
    const r = y[i] - (b0 + b1 * x[i]);
    rss += r * r;
    tss += (y[i] - mean) ** 2;
  }
  const dof = n - ls.rank;
  const s2 = dof > 0 ? rss / dof : NaN;
  // A dropped column (all x equal) has no defined slope uncertainty: NaN, not 0.
  const covariance = ls.inverseNormal.map((r, i) => r.map((v, j) => (ls.dropped.includes(i) || ls.dropped.includes(j) ? NaN : v * s2)));
  return {
    b0,
    b1,
    sdB0: Math.sqrt(covariance[0][0]),
    sdB1: Math.sqrt(covariance[1][1]),
    rss,
    dof,
    residualSd: Math.sqrt(s2),
    rSquared: tss > 0 ? 1 - rss / tss : NaN,
    covariance,
  };
}
