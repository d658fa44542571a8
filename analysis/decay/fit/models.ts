/**
 * The four hold models, t = seconds since isolation, p = microns:
 *   flat           p0
 *   plateau        p0 + a·(1 − e^(−t/τ))          moisture / outgassing levelling off
 *   climb          p0 + l·t                        a leak through a fixed opening
 *   plateau_climb  p0 + a·(1 − e^(−t/τ)) + l·t     both
 * Outgassing levels off and a real leak stays linear: K. Zapfe, "Leak Detection", CERN Accelerator
 * School, Vacuum in Accelerators (2006); TRADE.md "Reading the rise after isolation".
 */
import type { HoldModelKind, ModelFit } from "../types";
import type { NonlinearModel } from "./nls";

export type HoldParam = "p0" | "a" | "tauSeconds" | "l";

/** Parameters of each model, in the covariance order p0, a, tauSeconds, l. */
export const HOLD_MODEL_PARAMS: Record<HoldModelKind, HoldParam[]> = {
  flat: ["p0"],
  plateau: ["p0", "a", "tauSeconds"],
  climb: ["p0", "l"],
  plateau_climb: ["p0", "a", "tauSeconds", "l"],
};

/** Simplest first: the order ties are broken in. */
export const HOLD_MODEL_KINDS: HoldModelKind[] = ["flat", "climb", "plateau", "plateau_climb"];

export type HoldParams = ModelFit["params"];

/**
 * Pressure in microns predicted by a hold model at tSeconds after isolation.
 * Formula per the model list above; a absent = 0, l absent = 0 (l in microns per second).
 */
export function holdModelMicrons(params: HoldParams, tSeconds: number): number {
  let p = params.p0;
  if (params.a !== undefined && params.tauSeconds !== undefined) p += params.a * -Math.expm1(-tSeconds / params.tauSeconds);
  if (params.l !== undefined) p += params.l * tSeconds;
  return p;
}

/**
 * Partial derivatives of the model at tSeconds with respect to its present parameters, in the order
 * p0, a, tauSeconds, l: ∂/∂p0 = 1, ∂/∂a = 1 − e^(−t/τ), ∂/∂τ = −a·t·e^(−t/τ)/τ², ∂/∂l = t.
 */
export function holdModelGradient(kind: HoldModelKind, params: HoldParams, tSeconds: number): number[] {
  const g: number[] = [1];
  if (kind === "plateau" || kind === "plateau_climb") {
    const tau = params.tauSeconds as number;
    const e = Math.exp(-tSeconds / tau);
    g.push(-Math.expm1(-tSeconds / tau), (-(params.a as number) * tSeconds * e) / (tau * tau));
  }
  if (kind === "climb" || kind === "plateau_climb") g.push(tSeconds);
  return g;
}

export function paramsFromVector(kind: HoldModelKind, b: readonly number[]): HoldParams {
  const out: HoldParams = { p0: b[0] };
  HOLD_MODEL_PARAMS[kind].forEach((name, j) => {
    out[name] = b[j];
  });
  return out;
}

export function vectorFromParams(kind: HoldModelKind, params: HoldParams): number[] {
  return HOLD_MODEL_PARAMS[kind].map((name) => params[name] as number);
}

/**
 * The hold model as a generic NonlinearModel over its parameter vector (for summariseFit), written out
 * per kind so the solver's inner loops make no objects: b = [p0, a, τ, l] with absent ones left out.
 * The batch forms (values, jacobian) repeat the point forms' arithmetic exactly, one loop per call.
 */
export function holdNonlinearModel(kind: HoldModelKind): NonlinearModel {
  const hasPlateau = kind === "plateau" || kind === "plateau_climb";
  const lIndex = kind === "climb" ? 1 : kind === "plateau_climb" ? 3 : -1;
  return {
    value: (t, b) => {
      let p = b[0];
      if (hasPlateau) p += b[1] * -Math.expm1(-t / b[2]);
      if (lIndex > 0) p += b[lIndex] * t;
      return p;
    },
    gradient: (t, b, out) => {
      out[0] = 1;
      if (hasPlateau) {
        const e = Math.exp(-t / b[2]);
        out[1] = -Math.expm1(-t / b[2]);
        out[2] = (-b[1] * t * e) / (b[2] * b[2]);
      }
      if (lIndex > 0) out[lIndex] = t;
    },
    values: (x, b, out) => {
      const p0 = b[0];
      const a = hasPlateau ? b[1] : 0;
      const tau = hasPlateau ? b[2] : 1;
      const l = lIndex > 0 ? b[lIndex] : 0;
      for (let i = 0; i < x.length; i++) {
        const t = x[i];
        let p = p0;
        if (hasPlateau) p += a * -Math.expm1(-t / tau);
        if (lIndex > 0) p += l * t;
        out[i] = p;
      }
    },
    jacobian: (x, b, cols) => {
      const c0 = cols[0];
      for (let i = 0; i < x.length; i++) c0[i] = 1;
      if (hasPlateau) {
        const a = b[1];
        const tau = b[2];
        const tau2 = tau * tau;
        const ca = cols[1];
        const ct = cols[2];
        for (let i = 0; i < x.length; i++) {
          const t = x[i];
          const e = Math.exp(-t / tau);
          ca[i] = -Math.expm1(-t / tau);
          ct[i] = (-a * t * e) / tau2;
        }
      }
      if (lIndex > 0) {
        const cl = cols[lIndex];
        for (let i = 0; i < x.length; i++) cl[i] = x[i];
      }
    },
  };
}
