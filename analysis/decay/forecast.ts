/**
 * Forecast of a hold that is still shorter than the profile's hold time: where the reading is heading
 * at that time (with an approximate 95 % prediction interval, for the chart), and an early call on the
 * verdict the hold will get, made with the profile's whole rule set (limit, leak rate, level-off) by
 * the same rule the verdict uses (rule.ts). A forecast only ever looks ahead of the data: a hold that
 * already reached the hold time gets no forecast; its measured figures stand instead (figures.ts).
 */
import { holdModelGradient, holdModelMicrons, HOLD_MODEL_PARAMS } from "./fit/models";
import { seededNormal } from "./fit/prng";
import { AICC_MARGIN } from "./fit/select";
import { studentTQuantile } from "./fit/student";
import { climbOf, curveVerdict, levelledOffWithin } from "./rule";
import type { AcceptanceProfile, Forecast, HoldFitResult, ModelFit, Verdict } from "./types";

/** Points in the chart band, 0 … atHoldSeconds inclusive. */
export const FORECAST_BAND_POINTS = 31;
/** Continuations drawn per plausible model for the early call. */
export const CONTINUATIONS_PER_MODEL = 200;
/** Share of the weighted plausible continuations that must agree for an early call. */
export const CALL_AGREEMENT = 0.95;
/**
 * Fewest readings for an early call. With fewer, the small-sample penalty of AICc rules out the
 * level-off models however well they fit, and a rise that is slowing reads as a straight climb (our
 * choice: at 10 readings a three-parameter plateau pays 2·4·5/(10 − 5) = 8 for its size, twice the
 * selection margin, instead of 40 at 6 readings).
 */
export const MIN_EARLY_CALL_READINGS = 10;
/** Fewest effective continuations (after weighing) a model must keep for its vote to count. */
export const MIN_EFFECTIVE_DRAWS = 10;

/** Mean of the model over [0, observedSeconds] (microns), by the midpoint rule on 64 panels. */
function meanObservedMicrons(fit: ModelFit, observedSeconds: number): number {
  let sum = 0;
  for (let k = 0; k < 64; k++) sum += holdModelMicrons(fit.params, ((k + 0.5) * observedSeconds) / 64);
  return sum / 64;
}

const quantileByDof = new Map<number, number>();

/** studentTQuantile(0.975, dof), remembered per dof (the band asks for the same few dof many times). */
function tQuantile975(dof: number): number {
  let q = quantileByDof.get(dof);
  if (q === undefined) {
    q = studentTQuantile(0.975, dof);
    if (quantileByDof.size > 1000) quantileByDof.clear();
    quantileByDof.set(dof, q);
  }
  return q;
}

/** Gauge scatter expected at a reading of `mid` microns: the residual sd, scaled up in proportion when the reading is higher than the observed mean. */
function noiseSdAt(fit: ModelFit, mid: number, observedSeconds: number): number {
  return fit.residualSd * Math.max(1, mid / Math.max(meanObservedMicrons(fit, observedSeconds), 1));
}

/**
 * Approximate 95 % prediction interval (microns) for one reading at tSeconds from one model fit.
 * Delta method: Var = gᵀ·C·g + s_t², g = ∂model/∂(p0, a, τ, l) at t, C the fit's covariance; s_t is the
 * residual sd scaled up by the predicted/observed-mean reading ratio when the prediction is higher
 * (gauge noise grows roughly in proportion to the reading), half-width = t_{0.975, dof}·√Var.
 * Reference: delta method and prediction intervals for nonlinear regression, G. A. F. Seber & C. J. Wild,
 * Nonlinear Regression (1989) §5.1 (from memory).
 */
function modelInterval(fit: ModelFit, tSeconds: number, observedSeconds: number): { mid: number; low: number; high: number } {
  const mid = holdModelMicrons(fit.params, tSeconds);
  const g = holdModelGradient(fit.kind, fit.params, tSeconds);
  let paramVar = 0;
  for (let i = 0; i < g.length; i++) for (let j = 0; j < g.length; j++) paramVar += g[i] * (fit.covariance[i]?.[j] ?? NaN) * g[j];
  const noiseSd = noiseSdAt(fit, mid, observedSeconds);
  const half = tQuantile975(fit.dof) * Math.sqrt(Math.max(0, paramVar) + noiseSd * noiseSd);
  if (!Number.isFinite(half)) return { mid, low: 0, high: Infinity };
  return { mid, low: Math.max(0, mid - half), high: mid + half };
}

/** Lower-triangular L with L·Lᵀ = c (Cholesky–Banachiewicz), or null when c is not positive definite. */
function cholesky(c: number[][]): number[][] | null {
  const n = c.length;
  const l = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = c[i][j];
      for (let k = 0; k < j; k++) s -= l[i][k] * l[j][k];
      if (i === j) {
        if (!(s > 0) || !Number.isFinite(s)) return null;
        l[i][i] = Math.sqrt(s);
      } else l[i][j] = s / l[j][j];
    }
  }
  return l;
}

type FailRule = "limit" | "leak_rate" | "plateau";

const RULE_WORDS: Record<FailRule, string> = { limit: "limit", leak_rate: "leak-rate", plateau: "level-off (moisture)" };

/** The hold's readings as fitted (seconds after isolation, microns), spikes the fit left out removed. */
export interface HoldData {
  tSeconds: ArrayLike<number>;
  microns: ArrayLike<number>;
}

/** At most this many readings are used to weigh a continuation (evenly thinned above it, the sum scaled back). */
const WEIGHING_POINTS = 600;
/**
 * Smallest reading variance believed (microns²): a display that steps by 1 micron rounds by up to
 * ±0.5, variance 1/12 (uniform rounding error). Readings typed as whole microns on a straight line
 * fit "perfectly", and without this floor their continuations would all be one curve.
 */
const VARIANCE_FLOOR = 1 / 12;

/**
 * Parameter covariance s²·(JᵀJ)⁻¹ of a model at its fitted parameters, J the model's gradient at the
 * readings (holdModelGradient), order p0, a, τ, l; null when JᵀJ is singular. For fits whose own
 * residual variance is under VARIANCE_FLOOR.
 */
function covarianceAt(fit: ModelFit, data: HoldData, s2: number): number[][] | null {
  const k = HOLD_MODEL_PARAMS[fit.kind].length;
  const jtj = Array.from({ length: k }, () => new Array<number>(k).fill(0));
  for (let i = 0; i < data.tSeconds.length; i++) {
    const g = holdModelGradient(fit.kind, fit.params, data.tSeconds[i]);
    for (let r = 0; r < k; r++) for (let c = 0; c < k; c++) jtj[r][c] += g[r] * g[c];
  }
  const l = cholesky(jtj);
  if (!l) return null;
  // (LLᵀ)⁻¹ column by column: forward then back substitution of each unit vector.
  const inv = Array.from({ length: k }, () => new Array<number>(k).fill(0));
  for (let col = 0; col < k; col++) {
    const y = new Array<number>(k).fill(0);
    for (let r = 0; r < k; r++) {
      let v = r === col ? 1 : 0;
      for (let c = 0; c < r; c++) v -= l[r][c] * y[c];
      y[r] = v / l[r][r];
    }
    for (let r = k - 1; r >= 0; r--) {
      let v = y[r];
      for (let c = r + 1; c < k; c++) v -= l[c][r] * inv[c][col];
      inv[r][col] = v / l[r][r];
    }
  }
  return inv.map((row) => row.map((v) => v * s2));
}

/**
 * Draw plausible continuations of one model and judge each at the hold time with the verdict's rule.
 *
 * Method: importance sampling of the model's posterior (flat priors, log τ): proposals θ ~ N(θ̂, C),
 * the fit's Laplace approximation, with τ drawn on a log scale (log τ ~ N(log τ̂, C_ττ/τ̂²), cross
 * terms C_τj/τ̂) so it stays positive; each proposal is weighed by how well it fits the readings,
 * log w = −(RSS(θ) − RSS(θ̂))/(2s²) + ½·|z|² (s² = RSS/dof, z the proposal's standard normal draw),
 * so a continuation the readings rule out counts for nothing although the linearised covariance
 * allowed it. The highest reading by the hold time is the model's highest on 17 points of [0, H]
 * plus one gauge-noise draw. Each draw gives the climb, the second-half slope, the plateau and the
 * highest, which curveVerdict judges. Seeded, so the same fit always gives the same call.
 * Returns the weighted share of draws that pass, the failing rule met most often and the effective
 * sample size (Σw)²/Σw², or null when the covariance cannot be drawn from.
 * Reference: importance sampling, e.g. C. P. Robert & G. Casella, Monte Carlo Statistical Methods,
 * 2nd ed. (2004) §3.3 (from memory).
 */
function judgeContinuations(fit: ModelFit, data: HoldData | null, observedSeconds: number, holdSeconds: number, profile: AcceptanceProfile, seed: number, spread = 1) {
  const names = HOLD_MODEL_PARAMS[fit.kind];
  const k = names.length;
  const tauIndex = names.indexOf("tauSeconds");
  const mean = names.map((nm) => fit.params[nm] as number);
  const fitted = fit.dof > 0 ? fit.rss / fit.dof : NaN;
  const s2 = Math.max(Number.isFinite(fitted) ? fitted : VARIANCE_FLOOR, VARIANCE_FLOOR);
  const floored = !(fitted >= VARIANCE_FLOOR) && data ? covarianceAt(fit, data, s2) : null;
  const cov = floored ?? Array.from({ length: k }, (_, i) => Array.from({ length: k }, (_, j) => fit.covariance[i]?.[j] ?? NaN));
  if (tauIndex >= 0) {
    const tau = mean[tauIndex];
    if (!(tau > 0)) return null;
    for (let j = 0; j < k; j++) {
      cov[tauIndex][j] /= tau;
      cov[j][tauIndex] /= tau;
    }
    mean[tauIndex] = Math.log(tau);
  }
  const chol = cholesky(cov.map((row) => row.map((v) => v * spread * spread)));
  if (!chol) return null;
  const n = data ? data.tSeconds.length : 0;
  const stride = Math.max(1, Math.ceil(n / WEIGHING_POINTS));
  const rssOf = (params: ModelFit["params"]) => {
    let rss = 0;
    for (let i = 0; i < n; i += stride) rss += (data!.microns[i] - holdModelMicrons(params, data!.tSeconds[i])) ** 2;
    return rss * stride;
  };
  const weighs = !!data && n > k;
  const rssHat = weighs ? rssOf(fit.params) : 0;
  const normal = seededNormal(seed);
  const z = new Array<number>(k);
  const logW: number[] = [];
  const passed: boolean[] = [];
  const failRule: FailRule[] = [];
  for (let d = 0; d < CONTINUATIONS_PER_MODEL; d++) {
    let zz = 0;
    for (let i = 0; i < k; i++) {
      z[i] = normal();
      zz += z[i] * z[i];
    }
    const params: ModelFit["params"] = { p0: 0 };
    names.forEach((nm, i) => {
      let v = mean[i];
      for (let j = 0; j <= i; j++) v += chol[i][j] * z[j];
      params[nm] = i === tauIndex ? Math.exp(v) : v;
    });
    logW.push(weighs ? -(rssOf(params) - rssHat) / (2 * s2) + zz / 2 : 0);
    let highest = -Infinity;
    for (let st = 0; st <= 16; st++) highest = Math.max(highest, holdModelMicrons(params, (holdSeconds * st) / 16));
    highest += normal() * Math.max(noiseSdAt(fit, highest, observedSeconds), Math.sqrt(VARIANCE_FLOOR));
    const half = holdSeconds / 2;
    const climb = climbOf(params, holdSeconds);
    const levelled = levelledOffWithin(params, holdSeconds);
    const plateau = params.a !== undefined ? params.p0 + params.a : null;
    const call = curveVerdict(
      {
        climbMicronsPerMinute: climb,
        lateSlopeMicronsPerMinute: ((holdModelMicrons(params, holdSeconds) - holdModelMicrons(params, half)) / half) * 60,
        plateauMicrons: plateau,
        levelledOff: levelled,
        maxMicrons: highest,
      },
      profile,
    );
    passed.push(call.verdict === "pass");
    failRule.push(call.leak ? "leak_rate" : plateau !== null && levelled && plateau > profile.limitMicrons ? "plateau" : "limit");
  }
  const top = logW.reduce((m, x) => (Number.isFinite(x) && x > m ? x : m), -Infinity);
  const w = logW.map((x) => (Number.isFinite(x) ? Math.exp(x - top) : 0));
  const total = w.reduce((a, b) => a + b, 0);
  const ess = total > 0 ? total ** 2 / w.reduce((a, b) => a + b * b, 0) : 0;
  const fails: Record<FailRule, number> = { limit: 0, leak_rate: 0, plateau: 0 };
  let pass = 0;
  w.forEach((wi, i) => {
    if (passed[i]) pass += wi;
    else fails[failRule[i]] += wi;
  });
  const rule = (Object.keys(fails) as FailRule[]).reduce((a, b) => (fails[b] > fails[a] ? b : a));
  return { passShare: total > 0 ? pass / total : NaN, rule, ess };
}

/**
 * Forecast the hold at the profile's hold time from a hold fitted over its first observedHoldSeconds.
 *
 * Band: the chosen model's value with its delta-method prediction interval (modelInterval), widened
 * to cover the intervals of every other model the data cannot reject (AICc within the selection
 * margin of the best): far beyond the data a plateau and a climb that fit the first minutes equally
 * well part ways, and the band shows it.
 *
 * Early call: the continuations of every model the data cannot reject (and of the chosen one) are
 * judged by the verdict's own rule (judgeContinuations) and averaged with Akaike weights
 * w ∝ e^(−ΔAICc/2); "pass" when at least CALL_AGREEMENT of the weighted continuations pass, "fail"
 * when at least that share fails, else null. Also null with fewer than MIN_EARLY_CALL_READINGS readings,
 * when the models could not be compared (AICc not finite), or when a model's weighed draws are too
 * few to count (effective sample under MIN_EFFECTIVE_DRAWS).
 * Units: seconds after isolation, microns.
 */
export function forecastHold(fit: HoldFitResult, observedHoldSeconds: number, profile: AcceptanceProfile, data: HoldData | null = null): Forecast {
  const atHoldSeconds = profile.holdMinutes * 60;
  const chosen = fit.fits[fit.chosen];
  const all = Object.values(fit.fits).filter((f): f is ModelFit => !!f && Number.isFinite(f.aicc) && f.stopReason !== "non_finite");
  const bestAicc = all.reduce((m, f) => Math.min(m, f.aicc), Infinity);
  const plausible = all.filter((f) => f.aicc <= bestAicc + AICC_MARGIN);
  const observed = Math.max(observedHoldSeconds, 1e-9);
  // Every model the data cannot reject votes on the call, and the chosen one always does.
  const voters = chosen && !plausible.includes(chosen) ? [...plausible, chosen] : plausible;
  const at = (t: number) => {
    if (!chosen) return { mid: NaN, low: 0, high: Infinity };
    const own = modelInterval(chosen, t, observed);
    let { low, high } = own;
    for (const other of plausible) {
      if (other === chosen) continue;
      const o = modelInterval(other, t, observed);
      low = Math.min(low, o.low);
      high = Math.max(high, o.high);
    }
    return { mid: own.mid, low, high };
  };
  const end = at(atHoldSeconds);
  const band: Forecast["band"] = [];
  for (let k = 0; k < FORECAST_BAND_POINTS; k++) {
    const t = (atHoldSeconds * k) / (FORECAST_BAND_POINTS - 1);
    const b = at(t);
    band.push({ tSeconds: t, microns: b.mid, low: b.low, high: b.high });
  }

  let earlyCall: Forecast["earlyCall"] = null;
  let decidingRule: Forecast["decidingRule"] = null;
  let agreement = 0;
  const comparable = !!chosen && Number.isFinite(chosen.aicc) && chosen.n >= MIN_EARLY_CALL_READINGS && voters.includes(chosen);
  if (comparable) {
    // A proposal far wider than the posterior (a plateau the readings pin down along a curved ridge) leaves
    // few weighed draws: it is drawn again at half and a quarter of the spread before the model is let go.
    const judgeModel = (f: ModelFit, i: number) => {
      let j = null;
      for (const spread of [1, 0.5, 0.25]) {
        j = judgeContinuations(f, data, observed, atHoldSeconds, profile, 0x5eed + 7919 * i + f.n, spread);
        if (j && j.ess >= MIN_EFFECTIVE_DRAWS) break;
      }
      return j;
    };
    const all = voters.map((f, i) => ({ f, j: judgeModel(f, i) }));
    const usable = (x: (typeof all)[number]) => x.j !== null && Number.isFinite(x.j.passShare) && x.j.ess >= MIN_EFFECTIVE_DRAWS;
    // A model whose fit cannot be drawn from (a plateau too small to pin down: no usable covariance,
    // or draws the readings all rule out) is left out of the vote; the chosen model must be usable.
    const counted = all.filter(usable);
    if (counted.some((x) => x.f === chosen)) {
      const judged = counted.map((x) => x.j!);
      const best = counted.reduce((m, x) => Math.min(m, x.f.aicc), Infinity);
      // Akaike weights over the voting models (Burnham & Anderson 2002, §2.9, from memory).
      const weights = counted.map((x) => Math.exp(-(x.f.aicc - best) / 2));
      const total = weights.reduce((x, y) => x + y, 0);
      const passShare = judged.reduce((acc, j, i) => acc + (weights[i] / total) * j.passShare, 0);
      const failShare = 1 - passShare;
      if (passShare >= CALL_AGREEMENT) {
        earlyCall = "pass";
        agreement = passShare;
      } else if (failShare >= CALL_AGREEMENT) {
        earlyCall = "fail";
        agreement = failShare;
        decidingRule = judged.reduce((x, y) => (y.passShare < x.passShare ? y : x)).rule;
      } else agreement = Math.max(passShare, failShare);
    }
  }
  return {
    atHoldSeconds,
    predictedMicrons: end.mid,
    lowMicrons: end.low,
    highMicrons: end.high,
    earlyCall,
    basedOnSeconds: observedHoldSeconds,
    band,
    decidingRule,
    agreement,
    basis: earlyCall
      ? `${Math.floor(agreement * 100)} % of the curves that fit the first ${(observedHoldSeconds / 60).toFixed(1)} min ${earlyCall === "pass" ? "meet every rule" : `fail the ${RULE_WORDS[decidingRule ?? "limit"]} rule`} at ${profile.holdMinutes} min`
      : !comparable
        ? `too few readings yet for a call (at least ${MIN_EARLY_CALL_READINGS} in the hold)`
        : `the curves that fit the first ${(observedHoldSeconds / 60).toFixed(1)} min do not agree yet on the verdict at ${profile.holdMinutes} min`,
  };
}

/**
 * The early call made to agree with the verdict of the same data: a short hold already decided (it
 * passed the limit) is a "fail" because the verdict is; an undecided one keeps the forecast's call.
 */
export function earlyCallWithVerdict(forecast: Forecast, verdict: Verdict, leakRule: boolean): Forecast {
  if (verdict === "inconclusive") return forecast;
  const call = verdict === "pass" ? "pass" : "fail";
  if (forecast.earlyCall === call) return forecast;
  return {
    ...forecast,
    earlyCall: call,
    decidingRule: call === "fail" ? (leakRule ? "leak_rate" : "limit") : null,
    agreement: 1,
    basis: "the readings have already decided it: the hold passed the limit before the hold time",
  };
}
