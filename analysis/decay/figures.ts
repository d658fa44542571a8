/**
 * Every number of the primary hold, given once with its definition: the start, the last reading, the
 * highest the limit rule judges, the rise, the steady climb, the level-off, the hold time, and what
 * was measured at the profile's hold time. The verdict's reasons, the profile rules and every screen
 * quote these, so no two places can show two different "ends" or "highests".
 */
import { groupedInteger } from "../shared/format";
import type { Figure, HoldFigures, ModelFit } from "./types";

export interface JudgedHighest {
  /** Highest running median (5 readings, 3 for holds under 15 readings), microns. */
  smoothedMicrons: number;
  smoothedAtSeconds: number;
  /** Highest single reading over the same readings, microns. */
  rawMicrons: number;
  rawAtSeconds: number;
}

/**
 * The highest reading of p[from..to] up to time `untilSeconds` (seconds from the first data row),
 * smoothed by a running median of 5 readings (3 for holds under 15 readings) so one wild reading
 * (a bumped hose) does not decide the limit, and the highest single reading beside it (spikes
 * included: it is what the gauge showed). Readings marked in `skip` (indexed from `from`: the spikes
 * the fit left out) take no part in the smoothed value.
 * Running median: J. W. Tukey, Exploratory Data Analysis (1977), ch. 7 (from memory).
 */
export function judgedHighest(t: number[], p: number[], from: number, to: number, untilSeconds: number, skip?: Uint8Array): JudgedHighest {
  const half = to - from + 1 >= 15 ? 2 : 1;
  const w = new Float64Array(5);
  let best = 0;
  let bestAt = t[from];
  let raw = 0;
  let rawAt = t[from];
  for (let i = from; i <= to && t[i] <= untilSeconds; i++) {
    if (p[i] > raw) {
      raw = p[i];
      rawAt = t[i];
    }
    if (skip?.[i - from]) continue;
    // the window's median by insertion sort into a fixed buffer (at most 5 readings), no allocation
    const lo = Math.max(i - half, from);
    const hi = Math.min(i + half, to);
    let m = 0;
    for (let j = lo; j <= hi; j++) {
      if (skip?.[j - from]) continue;
      const v = p[j];
      let k = m++;
      while (k > 0 && w[k - 1] > v) {
        w[k] = w[k - 1];
        k--;
      }
      w[k] = v;
    }
    if (w[m >> 1] > best) {
      best = w[m >> 1];
      bestAt = t[i];
    }
  }
  return { smoothedMicrons: best, smoothedAtSeconds: bestAt, rawMicrons: raw, rawAtSeconds: rawAt };
}

/** Index of the last reading at or before `seconds` in t[from..to] (from when none is). */
function lastIndexAtOrBefore(t: number[], from: number, to: number, seconds: number): number {
  let lo = from;
  let hi = to;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (t[mid] <= seconds) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

const fmt = (x: number) => groupedInteger(Math.round(x));
const min1 = (s: number) => (s / 60).toFixed(1);

function highestFigure(h: JudgedHighest, judgedSeconds: number, isolatedAtSeconds: number, judgedByLimit: boolean): Figure {
  return {
    value: h.smoothedMicrons,
    definition: `the highest reading in the first ${min1(judgedSeconds)} min of the hold, smoothed over 5 readings so one wild reading (or a spike left out of the fit) does not count${judgedByLimit ? "; the limit rule judges this value" : ""}`,
    atSeconds: h.smoothedAtSeconds,
    raw: {
      value: h.rawMicrons,
      atSeconds: h.rawAtSeconds,
      definition: `the highest single reading, at ${min1(h.rawAtSeconds - isolatedAtSeconds)} min of the hold`,
    },
  };
}

export interface FiguresInput {
  t: number[];
  p: number[];
  /** Indices of the primary hold's first and last reading. */
  from: number;
  to: number;
  isolationSeen: boolean;
  /** The profile's hold time, seconds. */
  profileHoldSeconds: number;
  /** The chosen hold model, or null. */
  model: ModelFit | null;
  /** The steady climb the verdict judged, microns per minute. */
  climbMicronsPerMinute: number;
  /** The highest the limit rule judged (judgedHighest over the whole hold). */
  judged: JudgedHighest;
  /** Readings of the hold the fit left out as spikes (indices from `from`), kept out of the smoothed highest. */
  skip?: Uint8Array;
}

/** The hold's figures (see the file comment). Units: microns, microns per minute, seconds. */
export function holdFigures(x: FiguresInput): HoldFigures {
  const { t, p, from, to } = x;
  const iso = t[from];
  const holdSeconds = t[to] - iso;
  const start: Figure = {
    value: p[from],
    definition: x.isolationSeen ? "the reading when the pump was valved off (isolation)" : "the first reading of the log, which starts in the hold (the isolation is not in the log)",
    atSeconds: iso,
  };
  const last: Figure = { value: p[to], definition: "the last reading of the hold, as the gauge showed it", atSeconds: t[to] };
  const m = x.model;
  const plateau: Figure | null =
    m && m.params.a !== undefined
      ? { value: m.params.p0 + m.params.a, definition: "where the fitted curve levels off (its plateau)", atSeconds: null }
      : null;
  let atHoldTime: HoldFigures["atHoldTime"] = null;
  if (holdSeconds >= x.profileHoldSeconds) {
    const i = lastIndexAtOrBefore(t, from, to, iso + x.profileHoldSeconds);
    atHoldTime = {
      holdSeconds: x.profileHoldSeconds,
      readingMicrons: {
        value: p[i],
        definition: `the reading at ${min1(x.profileHoldSeconds)} min of the hold, the profile's hold time (the last reading at or before it, at ${min1(t[i] - iso)} min)`,
        atSeconds: t[i],
      },
      highestMicrons: highestFigure(judgedHighest(t, p, from, to, iso + x.profileHoldSeconds, x.skip), x.profileHoldSeconds, iso, false),
    };
  }
  return {
    startMicrons: start,
    lastMicrons: last,
    highestMicrons: highestFigure(x.judged, holdSeconds, iso, true),
    riseMicrons: { value: p[to] - p[from], definition: `the last reading minus the start (${fmt(p[to])} − ${fmt(p[from])})`, atSeconds: null },
    rateMicronsPerMinute: {
      value: x.climbMicronsPerMinute,
      definition: "the steady climb of the fitted curve over the whole hold (its straight-line part, or its end slope when it has not levelled off); the leak rule judges this value",
      atSeconds: null,
    },
    plateauMicrons: plateau,
    holdSeconds: { value: holdSeconds, definition: "from isolation to the last reading of the hold", atSeconds: null },
    atHoldTime,
  };
}
