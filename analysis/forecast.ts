/**
 * Forecast of the hold reading at the profile's hold time from the first part of a hold, with an
 * approximate 95 % prediction interval, and an early pass/fail call when the interval allows one.
 */
import { holdModelGradient, holdModelMicrons } from "./fit/models";
import { AICC_MARGIN } from "./fit/select";
import { studentTQuantile } from "./fit/student";
import type { Forecast, HoldFitResult, ModelFit } from "./types";

/** Points in the chart band, 0 … atHoldSeconds inclusive. */
export const FORECAST_BAND_POINTS = 31;

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
  const levelRatio = Math.max(1, mid / Math.max(meanObservedMicrons(fit, observedSeconds), 1));
  const noiseSd = fit.residualSd * levelRatio;
  const q = tQuantile975(fit.dof);
  const half = q * Math.sqrt(Math.max(0, paramVar) + noiseSd * noiseSd);
  if (!Number.isFinite(half)) return { mid, low: 0, high: Infinity };
  return { mid, low: Math.max(0, mid - half), high: mid + half };
}

/**
 * Forecast the reading at atHoldSeconds after isolation from a hold fitted over its first
 * observedHoldSeconds, against limitMicrons.
 *
 * Method: the chosen model's value with its delta-method prediction interval (see modelInterval). To be
 * honest when extrapolating, the interval is widened to cover the intervals of every other fitted model
 * the data cannot reject (AICc within the selection margin of the best fitted model): far beyond the
 * observed part, a plateau and a climb that fit the first minutes equally well part ways, and the band
 * shows it. earlyCall is "pass" when the whole interval is below the limit, "fail" when it is wholly
 * above, else null (also null when there were too few readings to compare the models). The band has FORECAST_BAND_POINTS points from 0 to atHoldSeconds.
 * Units: seconds after isolation, microns.
 */
export function forecastHold(fit: HoldFitResult, observedHoldSeconds: number, atHoldSeconds: number, limitMicrons: number): Forecast {
  const chosen = fit.fits[fit.chosen];
  const all = Object.values(fit.fits).filter((f): f is ModelFit => !!f && Number.isFinite(f.aicc) && f.stopReason !== "non_finite");
  const bestAicc = all.reduce((m, f) => Math.min(m, f.aicc), Infinity);
  const plausible = all.filter((f) => f.aicc <= bestAicc + AICC_MARGIN && f !== chosen);
  const observed = Math.max(observedHoldSeconds, 1e-9);
  const at = (t: number) => {
    if (!chosen) return { mid: NaN, low: 0, high: Infinity };
    const own = modelInterval(chosen, t, observed);
    let { low, high } = own;
    for (const other of plausible) {
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
  // No call when the models could not even be compared (too few readings for AICc).
  const comparable = !!chosen && Number.isFinite(chosen.aicc);
  const earlyCall = !comparable ? null : end.high < limitMicrons ? "pass" : end.low > limitMicrons ? "fail" : null;
  return {
    atHoldSeconds,
    predictedMicrons: end.mid,
    lowMicrons: end.low,
    highMicrons: end.high,
    earlyCall,
    basedOnSeconds: observedHoldSeconds,
    band,
  };
}
