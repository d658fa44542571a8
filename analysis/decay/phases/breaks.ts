/**
 * Where a hold ends because the vacuum was broken or the gauge left its range: over-range markers
 * after isolation, or a jump of thousands of microns far faster than the hold's own rise that stays up.
 * One or two wild readings that come back (a bumped hose, a hand on the gauge) are spikes, not a break.
 * Thresholds: common practice, no published source.
 */

/** A jump this large (microns, in one step) far beyond the hold's own trend is the vacuum being broken. */
export const BREAK_JUMP_MICRONS = 2000;
/** Readings after a jump that must stay up (unless the gauge leaves its range) for it to be a break, not a spike. */
const STAY_READINGS = 3;

export function lastIndexAtOrBefore(t: ArrayLike<number>, seconds: number): number {
  let lo = 0;
  let hi = t.length - 1;
  if (hi < 0 || t[0] > seconds) return -1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (t[mid] <= seconds) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** First over-range time after `afterSeconds` in the ascending list, or null. */
function firstOverRangeAfter(overRange: number[], afterSeconds: number): number | null {
  let lo = 0;
  let hi = overRange.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (overRange[mid] <= afterSeconds) lo = mid + 1;
    else hi = mid;
  }
  return lo < overRange.length ? overRange[lo] : null;
}

/** Headroom on the recent climb when asking whether it reached the gauge's top by the first over-range row. */
const CLIMB_HEADROOM = 3;
/** Share of the gauge's top the climb must reach to have climbed out of range (the top is only estimated). */
const TOP_SHARE = 0.8;

/**
 * Whether the hold climbed out of the gauge's range (a gross leak) rather than jumping out of it (the
 * vacuum broken with refrigerant or air, or a valve opened): the recent climb (the last three readings,
 * microns per second), with CLIMB_HEADROOM to spare, reaches TOP_SHARE of the gauge's top (the highest
 * reading of the log) by the first over-range row.
 */
function climbsToTop(t: number[], p: number[], start: number, e: number, overAt: number, topMicrons: number): boolean {
  const from = Math.max(start, e - 2);
  const slope = e > from ? Math.max((p[e] - p[from]) / Math.max(t[e] - t[from], 1e-9), 0) : 0;
  return p[e] + CLIMB_HEADROOM * slope * (overAt - t[e]) >= TOP_SHARE * topMicrons;
}

/** Median of the (up to) five readings before index i, not before `start`. */
function levelBefore(p: number[], start: number, i: number): number {
  const w: number[] = [];
  for (let j = Math.max(start, i - 5); j < i; j++) w.push(p[j]);
  w.sort((a, b) => a - b);
  return w[w.length >> 1];
}

export interface HoldBreak {
  /** Last reading of the hold. */
  endIndex: number;
  /** Seconds of the break (the jump, or the first over-range row). */
  breakAt: number;
  /** Seconds of the first over-range row when the hold climbed out of the gauge's range (no jump before it), else null. */
  leftRangeAt: number | null;
}

/**
 * Where in [start, end] the vacuum is broken. The over-range markers after isolation cut the hold at the
 * last reading before them; a jump (at least BREAK_JUMP_MICRONS in one step, and five times the step the
 * hold's average rise since isolation predicts) cuts it before the jump when the readings after it stay
 * above the midpoint of the jump for STAY_READINGS readings, or the gauge leaves its range before they
 * come back. A jump right before the over-range markers is the break itself (the reading on its way out
 * of range), so the hold ends before it; a steady climb out of range (a gross leak) has no such jump.
 */
export function findBreak(t: number[], p: number[], start: number, end: number, overRange: number[], topMicrons: number): HoldBreak | null {
  const ota = firstOverRangeAfter(overRange, t[start]);
  let cut: HoldBreak | null = null;
  if (ota !== null) {
    const nextAfterEnd = end + 1 < t.length ? t[end + 1] : Infinity;
    if (ota < nextAfterEnd) {
      const e = Math.max(lastIndexAtOrBefore(t, ota - 1e-9), start);
      cut = { endIndex: e, breakAt: ota, leftRangeAt: climbsToTop(t, p, start, e, ota, topMicrons) ? ota : null };
    }
  }
  const scanEnd = cut ? cut.endIndex : end;
  for (let i = start + 3; i <= scanEnd; i++) {
    if (p[i] - p[i - 1] < BREAK_JUMP_MICRONS) continue;
    // measured from the level before (the median of up to five readings), so coming back from a dip is no jump
    const step = p[i] - levelBefore(p, start, i);
    if (step < BREAK_JUMP_MICRONS) continue;
    const trend = Math.max((p[i - 1] - p[start]) / Math.max(t[i - 1] - t[start], 1e-9), 0);
    const expected = trend * (t[i] - t[i - 1]);
    if (step <= 5 * expected + BREAK_JUMP_MICRONS) continue;
    // a spike comes straight back down; a break stays up, or the gauge leaves its range
    const mid = p[i] - step / 2;
    let stays = true;
    let seen = 0;
    for (let j = i + 1; j <= scanEnd && seen < STAY_READINGS; j++, seen++) if (p[j] < mid) stays = false;
    if (seen === 0 && !cut) stays = false; // the last reading of the log: a spike or a break, no telling
    if (stays) return { endIndex: i - 1, breakAt: t[i], leftRangeAt: null };
  }
  return cut;
}

/** Median of p[from..to] (inclusive, clipped), for the levels either side of a short excursion. */
function medianOf(p: number[], from: number, to: number): number {
  const w: number[] = [];
  for (let j = Math.max(from, 0); j <= Math.min(to, p.length - 1); j++) w.push(p[j]);
  w.sort((a, b) => a - b);
  return w.length ? w[w.length >> 1] : NaN;
}

/** Readings a fall may span, at most, and still be one or two wild readings rather than a new pull-down. */
const SPIKE_SPAN_READINGS = 3;

/**
 * Join holds that a spike split: a hold "ended by a pull-down" whose fall spans at most
 * SPIKE_SPAN_READINGS readings and after which the readings come back to the level before it (within
 * `ratio`) was one or two wild readings (a bumped hose, a hand on the gauge), not a re-pull: a re-pull
 * brings the reading well below the level the hold had reached. `holds` are in time order, indices into p.
 */
export function joinSpikeSplits<T extends { start: number; end: number; endedBy: string }>(holds: T[], p: number[], ratio: number): T[] {
  const out: T[] = [];
  for (const h of holds) {
    const prev = out[out.length - 1];
    if (prev && prev.endedBy === "pulldown" && h.start - prev.end <= SPIKE_SPAN_READINGS) {
      const before = medianOf(p, Math.max(prev.start, prev.end - 5), prev.end - 1);
      const after = medianOf(p, h.start + 1, h.start + 4);
      if (after * ratio >= before) {
        out[out.length - 1] = { ...h, start: prev.start, seen: (prev as { seen?: boolean }).seen } as T;
        continue;
      }
    }
    out.push(h);
  }
  return out;
}
