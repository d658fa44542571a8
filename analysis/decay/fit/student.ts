/**
 * Student's t distribution: CDF and quantile, for prediction intervals with few degrees of freedom.
 */

/** ln Γ(x) for x > 0 by the Lanczos approximation (g = 7, 9 terms; ~15 digits). Reference: C. Lanczos, SIAM J. Numer. Anal. B1 (1964) 86. */
function logGamma(x: number): number {
  const c = [
    0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
    12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
  ];
  // reflection Γ(x)Γ(1 − x) = π / sin(πx) for x < 0.5, so the series below always runs at x ≥ 0.5
  const reflect = x < 0.5;
  const head = reflect ? Math.log(Math.PI / Math.sin(Math.PI * x)) : 0;
  if (reflect) x = 1 - x;
  x -= 1;
  let a = c[0];
  const t = x + 7.5;
  for (let i = 1; i < 9; i++) a += c[i] / (x + i);
  const series = 0.5 * Math.log(2 * Math.PI) + (x + 0.5) * Math.log(t) - t + Math.log(a);
  return reflect ? head - series : series;
}

/** Continued fraction for the incomplete beta function (modified Lentz). Reference: Press et al., Numerical Recipes (3rd ed.) §6.4. */
function betaContinuedFraction(a: number, b: number, x: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 300; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-15) break;
  }
  return h;
}

/** Regularised incomplete beta I_x(a, b). Reference: Numerical Recipes §6.4. */
function incompleteBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(1 - x));
  return x < (a + 1) / (a + b + 2) ? (front * betaContinuedFraction(a, b, x)) / a : 1 - (front * betaContinuedFraction(b, a, 1 - x)) / b;
}

/** P(T ≤ t) for Student's t with ν degrees of freedom: 1 − ½·I_{ν/(ν+t²)}(ν/2, ½) for t ≥ 0. */
export function studentTCdf(t: number, dof: number): number {
  const tail = 0.5 * incompleteBeta(dof / (dof + t * t), dof / 2, 0.5);
  return t >= 0 ? 1 - tail : tail;
}

/**
 * Quantile t_p of Student's t with ν = dof degrees of freedom (p in (0, 1)), by bisection on the CDF to
 * ~1e-12; ν ≥ 1e7 falls back to the normal quantile by the same bisection on the limit. Unitless.
 */
export function studentTQuantile(p: number, dof: number): number {
  if (!(p > 0 && p < 1) || !(dof > 0)) return NaN;
  // symmetric about 0: t_p = −t_(1−p)
  if (p < 0.5) return -upperStudentTQuantile(1 - p, dof);
  return upperStudentTQuantile(p, dof);
}

/** studentTQuantile for p in [0.5, 1). */
function upperStudentTQuantile(p: number, dof: number): number {
  let lo = 0;
  let hi = 1;
  while (studentTCdf(hi, dof) < p) hi *= 2;
  for (let i = 0; i < 200 && hi - lo > 1e-12 * Math.max(1, hi); i++) {
    const mid = (lo + hi) / 2;
    if (studentTCdf(mid, dof) < p) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
