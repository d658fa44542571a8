/**
 * Tick values for a logarithmic pressure axis at the 1-2-5 steps of each decade (…, 500, 1,000,
 * 2,000, 5,000, …) between `min` and `max`, so the level a curve settles at can be read off. When
 * the range holds fewer than three such steps, 3 and 7 (then every whole multiple 1…9) are added.
 * Pure; used by chart.js's `afterBuildTicks`, which replaces its own ticks (autoSkip may otherwise
 * drop all but one or two labels on a narrow range).
 */
export function logTicks125(min: number, max: number): number[] {
  if (!(min > 0) || !(max > min) || !Number.isFinite(max)) return [];
  const steps = (mantissas: number[]) => {
    const out: number[] = [];
    for (let k = Math.floor(Math.log10(min)); k <= Math.ceil(Math.log10(max)); k++) {
      for (const m of mantissas) {
        const v = m * 10 ** k;
        if (v >= min * (1 - 1e-9) && v <= max * (1 + 1e-9)) out.push(Number(v.toPrecision(12)));
      }
    }
    return out;
  };
  let ticks = steps([1, 2, 5]);
  if (ticks.length < 3) ticks = steps([1, 2, 3, 5, 7]);
  if (ticks.length < 3) ticks = steps([1, 2, 3, 4, 5, 6, 7, 8, 9]);
  return ticks;
}

/** The label of a tick: the whole number with thousands separators. */
export function logTickLabel(value: number | string): string {
  return Number(value).toLocaleString("en-US");
}

/**
 * Round tick values for a linear axis (minutes): a step of 1, 2 or 5 × 10^k chosen so that at most
 * `maxCount` ticks fall between `min` and `max`, at whole multiples of the step (0, 10, 20, 30 — never
 * the data's own first and last values such as 0.6 or 42.9).
 */
export function roundLinearTicks(min: number, max: number, maxCount = 7): number[] {
  if (!Number.isFinite(min) || !Number.isFinite(max) || max <= min || maxCount < 2) return [];
  const raw = (max - min) / (maxCount - 1);
  const decade = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * decade).find((s) => Math.floor(max / s) - Math.ceil(min / s) + 1 <= maxCount) ?? 10 * decade;
  const out: number[] = [];
  for (let i = Math.ceil(min / step - 1e-9); i * step <= max * (1 + 1e-12) + 1e-12; i++) out.push(Number((i * step).toPrecision(12)));
  return out;
}
