/**
 * Choosing among the hold models: information criterion with a margin, plus physical sanity.
 */
import type { HoldModelKind, ModelFit } from "../types";
import { HOLD_MODEL_KINDS, HOLD_MODEL_PARAMS } from "./models";

/** A more complex model must lower AICc by at least this much to be preferred over a simpler one it contains. */
export const AICC_MARGIN = 4;
/** A plateau whose τ exceeds this multiple of the observed hold cannot be told from a straight climb. */
export const TAU_MAX_HOLD_MULTIPLE = 3;
/**
 * A plateau whose τ is below this many sample intervals, and below TAU_STEP_SECONDS, is a step, not a rise
 * that levels off. The second bound keeps a real quick level-off (water flashing off within a minute or
 * two) in a hand-typed or sparse log: its τ is then under two samples, yet its level and any climb after
 * it are seen plainly.
 */
export const TAU_MIN_SAMPLE_INTERVALS = 2;
export const TAU_STEP_SECONDS = 20;
/**
 * A term that moves the curve over the hold by less than this (microns, two gauge resolution steps) or by
 * less than the scatter of one reading (the fit's residual sd) cannot be seen on the chart and changes no
 * decision: it is not worth a model. Common practice, no published source.
 */
export const MIN_EFFECT_MICRONS = 2;

/**
 * Small-sample corrected Akaike information criterion of a least-squares fit with Gaussian errors:
 * AICc = n·ln(RSS/n) + 2k + 2k(k+1)/(n − k − 1), k = model parameters + 1 (the noise variance).
 * Reference: C. M. Hurvich & C.-L. Tsai, Biometrika 76 (1989) 297; K. P. Burnham & D. R. Anderson,
 * Model Selection and Multimodel Inference (2nd ed., 2002) §2.4 (from memory).
 */
export function aiccLeastSquares(rss: number, n: number, modelParams: number): number {
  const k = modelParams + 1;
  if (n - k - 1 <= 0) return Infinity;
  const rssFloor = Math.max(rss, n * 1e-12);
  return n * Math.log(rssFloor / n) + 2 * k + (2 * k * (k + 1)) / (n - k - 1);
}

/** True when every parameter of `simpler` is also in `complex` (flat ⊂ climb, plateau ⊂ plateau_climb, …). */
function nestedIn(simpler: HoldModelKind, complex: HoldModelKind): boolean {
  return simpler !== complex && HOLD_MODEL_PARAMS[simpler].every((name) => HOLD_MODEL_PARAMS[complex].includes(name));
}

export interface SelectionContext {
  holdSeconds: number;
  sampleSeconds: number;
}

/** Why a fitted model may not be chosen, or null when it may. */
export function ineligibleReason(fit: ModelFit, ctx: SelectionContext): string | null {
  const { a, tauSeconds, l } = fit.params;
  const minEffect = Math.max(MIN_EFFECT_MICRONS, Number.isFinite(fit.residualSd) ? fit.residualSd : 0);
  if (fit.stopReason === "non_finite") return "no finite fit";
  if (!Number.isFinite(fit.aicc)) return "too few points for AICc";
  if (a !== undefined && tauSeconds !== undefined) {
    if (a <= 0) return "falls instead of rising to a level";
    if (tauSeconds > TAU_MAX_HOLD_MULTIPLE * ctx.holdSeconds)
      return `τ ${tauSeconds.toFixed(0)} s is over ${TAU_MAX_HOLD_MULTIPLE}× the ${ctx.holdSeconds.toFixed(0)} s hold (reads as a climb)`;
    if (tauSeconds < Math.min(TAU_MIN_SAMPLE_INTERVALS * ctx.sampleSeconds, TAU_STEP_SECONDS))
      return `τ ${tauSeconds.toFixed(1)} s is under ${TAU_MIN_SAMPLE_INTERVALS} sample intervals and ${TAU_STEP_SECONDS} s (a step)`;
    if (a < minEffect) return `plateau height ${a.toFixed(1)} microns is under ${minEffect.toFixed(1)} (reading scatter)`;
  }
  if (l !== undefined && Math.abs(l) * ctx.holdSeconds < minEffect)
    return `climb of ${(Math.abs(l) * ctx.holdSeconds).toFixed(1)} microns over the hold is under ${minEffect.toFixed(1)} (reading scatter)`;
  return null;
}

/**
 * Pick the hold model. Rule: (1) drop models that are physically indistinguishable from a simpler one —
 * a plateau that falls, has τ beyond 3× the observed hold (a climb) or below both 2 sample intervals and 20 s (a step),
 * or a term that moves the curve over the hold by less than max(2 microns, the residual sd); (2) take the lowest AICc of the rest;
 * (3) replace it by the simplest model nested inside it whose AICc is within 4 of it. A margin of 4 means
 * the extra term must make the data about e² ≈ 7 times more likely; Burnham & Anderson (2002) read
 * ΔAICc ≤ 2 as "substantial support" for the simpler model and 4–7 as "considerably less" (from memory).
 */
export function chooseHoldModel(
  fits: Partial<Record<HoldModelKind, ModelFit>>,
  ctx: SelectionContext,
  notes: string[],
): { chosen: HoldModelKind; rule: string } {
  const eligible: ModelFit[] = [];
  const words: string[] = [];
  for (const kind of HOLD_MODEL_KINDS) {
    const fit = fits[kind];
    if (!fit) continue;
    const why = ineligibleReason(fit, ctx);
    if (why) words.push(`${kind} set aside: ${why}`);
    else eligible.push(fit);
  }
  if (eligible.length === 0)
    return { chosen: "flat", rule: ["flat by default: too few readings to compare models (AICc needs at least 4 points fitted)", ...words, ...notes].join("; ") };
  let best = eligible.reduce((x, y) => (y.aicc < x.aicc ? y : x));
  const lowest = best;
  const simpler = eligible
    .filter((f) => nestedIn(f.kind, lowest.kind) && f.aicc <= lowest.aicc + AICC_MARGIN)
    .sort((x, y) => HOLD_MODEL_PARAMS[x.kind].length - HOLD_MODEL_PARAMS[y.kind].length || x.aicc - y.aicc);
  let head: string;
  if (simpler.length > 0) {
    best = simpler[0];
    head = `${best.kind}: within ${AICC_MARGIN} AICc of ${lowest.kind} (${(best.aicc - lowest.aicc).toFixed(1)}), so the simpler model`;
  } else {
    const runnerUp = eligible.filter((f) => f !== best).reduce<ModelFit | null>((x, y) => (!x || y.aicc < x.aicc ? y : x), null);
    head = runnerUp
      ? `${best.kind}: lowest AICc, ${(runnerUp.aicc - best.aicc).toFixed(1)} below ${runnerUp.kind} (margin ${AICC_MARGIN})`
      : `${best.kind}: the only model left`;
  }
  return { chosen: best.kind, rule: [head, ...words, ...notes].join("; ") };
}
