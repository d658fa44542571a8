/**
 * Phase finding: pull-down, isolation, hold(s) and break, in time linear in the number of readings.
 *
 * Method: readings are binned and median-smoothed in log10 (smooth.ts); zig-zag pivots with a
 * threshold above the gauge noise split the log into falls (pull-downs) and rises (holds). Each
 * trough after a fall is an isolation, placed exactly by a two-line change-point fit on the raw
 * readings around it (hinge.ts). A hold runs to the next pull-down (a confirmed peak), to a break
 * (over-range markers, or a jump of thousands of microns far faster than the hold's own rise) or to
 * the end of the log. A log with no fall before its first rise starts in the hold.
 */
import type { Hold, Phases } from "../types";
import { findBreak, joinSpikeSplits, lastIndexAtOrBefore } from "./breaks";
import { hingeSplitBounded } from "./hinge";
import { binReadings, medianIntervalSeconds, relativeNoise, removeShortExcursions, resolutionMicrons, zigzag, type Bins } from "./smooth";

export { medianIntervalSeconds, relativeNoise } from "./smooth";

export interface PhaseOptions {
  /** Force the isolation point (seconds from the first row). */
  isolationAtSeconds?: number;
  /** Use exactly this window as the hold (seconds from the first row). */
  holdWindow?: { startSeconds: number; endSeconds: number };
  /** The profile's hold time: a hold this long, or ended by a pull-down or break, is complete. */
  holdSeconds: number;
}

export interface HoldRange {
  /** Indices into the readings, inclusive. */
  startIndex: number;
  endIndex: number;
  /** False when the log starts in this hold (isolation not seen). */
  isolationSeen: boolean;
}

export interface PhaseAnalysis {
  phases: Phases;
  ranges: HoldRange[];
  /** Relative gauge noise (fraction of the reading). */
  noiseFraction: number;
  sampleSeconds: number;
  /** Readings of the pull-down before the primary hold, inclusive, or null. */
  pulldownRange: { startIndex: number; endIndex: number } | null;
}

/**
 * A hold cut short by a new pull-down counts when it lasted this long, or at least SHORT_REPULL_SECONDS
 * with a rise of SHORT_REPULL_RISE_MICRONS or more: a technician who sees a brisk rise may open to the
 * pump again within two minutes, while oil hopping in the coil moves the reading tens of microns for
 * under a minute or so (common practice, no published source).
 */
const MIN_REPULL_HOLD_SECONDS = 180;
const SHORT_REPULL_SECONDS = 90;
const SHORT_REPULL_RISE_MICRONS = 100;

function firstIndexAtOrAfter(t: ArrayLike<number>, seconds: number): number {
  const i = lastIndexAtOrBefore(t, seconds);
  if (i >= 0 && t[i] === seconds) return i;
  return Math.min(i + 1, t.length - 1);
}

/** Index of the highest reading (3-point median) among [from, to]. */
function argmaxMedian3(p: ArrayLike<number>, from: number, to: number): number {
  let best = from;
  let bestValue = -Infinity;
  for (let i = from; i <= to; i++) {
    const a = p[Math.max(i - 1, from)];
    const b = p[i];
    const c = p[Math.min(i + 1, to)];
    const m = Math.max(Math.min(a, b), Math.min(Math.max(a, b), c));
    if (m > bestValue) {
      bestValue = m;
      best = i;
    }
  }
  return best;
}

/** Place the isolation near trough bin `b` with a change-point fit on the raw readings. */
function refineIsolation(t: number[], p: number[], bins: Bins, b: number, prevBin: number, endBin: number, threshold: number, endIndex: number, noiseLog: number, stepMicrons: number): number {
  const y = bins.logMicrons;
  const yb = y[b];
  let peak = yb;
  for (let j = b; j <= endBin; j++) peak = Math.max(peak, y[j]);
  // the start of the rise is the straightest part of it: fit only up to a quarter of the rise
  const riseTarget = yb + Math.max(threshold / 4, (peak - yb) / 4);
  let r = b + 1;
  while (r < endBin && y[r] < riseTarget) r++;
  let l = b - 1;
  while (l > prevBin && y[l] < yb + 2 * threshold) l--;
  l = Math.max(l, prevBin, 0);
  const trough = Math.min(bins.start[b] + ((bins.start[b + 1] - bins.start[b]) >> 1), endIndex);
  let to = Math.min(bins.start[Math.min(r + 1, bins.count)] - 1, endIndex);
  to = Math.max(to, Math.min(trough + 4, endIndex));
  let from = bins.start[l];
  const rightSpan = Math.max(t[to] - t[trough], 1);
  // keep the left window comparable to the right one so the curved pull-down tail does not dominate
  while (from < trough - 10 && t[trough] - t[from] > 1.5 * rightSpan) from++;
  from = Math.min(from, Math.max(trough - 4, 0));
  // the smoothed trough is close already: search the split near the bins that tie with it (a flat
  // bottom within the noise), plus 90 s either side
  const tie = Math.max(noiseLog, 0.002);
  let first = b;
  while (first - 1 > Math.max(prevBin, l) && y[first - 1] <= yb + tie) first--;
  let last = b;
  while (last + 1 < Math.min(endBin, r) && y[last + 1] <= yb + tie) last++;
  const sample = Math.max((t[to] - t[from]) / Math.max(to - from, 1), 1e-9);
  const reach = Math.max(2, Math.ceil(90 / sample));
  const lo = Math.max(from, bins.start[first] - reach);
  // on the right, over the whole floor (bins within half the threshold of the trough, before the rise):
  // a long flat floor may hold the corner beyond the bins that tie with the trough
  // (on a coarse gauge the floor flickers between two steps: a step and a half above it is still floor)
  const flicker = stepMicrons >= COARSE_STEP_MICRONS ? Math.log10((10 ** yb + 1.5 * stepMicrons) / 10 ** yb) : 0;
  let floor = last;
  while (floor + 1 < Math.min(endBin, r) && y[floor + 1] <= yb + Math.max(threshold / 2, flicker)) floor++;
  const hi = Math.min(to, bins.start[Math.max(last, floor) + 1] - 1 + reach);
  const split = hingeSplitBounded(t, p, from, to, trough, lo, hi);
  return stepMicrons >= COARSE_STEP_MICRONS ? endOfFloor(t, p, split, endIndex) : split;
}

/** A display step this coarse (microns) hides the corner in a run of equal readings. */
const COARSE_STEP_MICRONS = 5;
/** Readings above the floor in a row that end it (one alone is a flicker between two steps). */
const FLOOR_END_READINGS = 3;

/**
 * On a coarse gauge the pull-down's last step and the start of the rise read the same, so the two-line
 * fit puts the corner at the start of that run of equal readings, and the readings leave the floor for
 * good (FLOOR_END_READINGS in a row above it) only once the rise has crossed a whole step. The valve-off
 * is taken one step's rise time before the run ends (the time from leaving the floor's step to leaving
 * the next one; the first step of a slowing rise is quicker, so at worst a little early), never before
 * the run starts: a long floor (a pump that sat there) keeps its end, a short run moves back into it.
 * The floor is the reading at the split. Common practice, no published source.
 */
function endOfFloor(t: number[], p: number[], split: number, endIndex: number): number {
  const floor = p[split];
  let last = split;
  let above = 0;
  for (let i = split + 1; i <= endIndex; i++) {
    if (p[i] <= floor) {
      last = i;
      above = 0;
    } else if (++above >= FLOOR_END_READINGS) break;
  }
  // the time the rise takes to cross one step: from leaving the floor's step to leaving the next one
  let up = last + 1;
  while (up <= endIndex && p[up] <= floor) up++;
  let next = up + 1;
  while (next <= endIndex && up <= endIndex && p[next] <= p[up]) next++;
  if (up > endIndex || next > endIndex) return last;
  const valvedOff = t[last] - (t[next] - t[up]);
  let k = last;
  while (k > split && t[k - 1] >= valvedOff) k--;
  return k;
}

/**
 * A valved-off system's reading does not fall: where the readings after the placed isolation still
 * drop by more than the turn threshold from one to the next (a sparse log, one reading every few
 * minutes, whose smoothed trough sits a reading early), the pump was still on, and the isolation is
 * the reading where that fall stops. Only a run of falls moves it (a reading above the one before it
 * is a rise, and one low reading after it a spike). `factor` is the turn threshold as a ratio (at least 1.15).
 * Common practice, no published source.
 */
function pastStillFalling(p: number[], start: number, end: number, factor: number): number {
  let s = start;
  // a run of falls only: a reading above the one before it is a rise (or an up-spike), not the pull-down
  while (s + 2 <= end && s > 0 && p[s] <= p[s - 1] && p[s + 1] * factor < p[s]) s++;
  return s;
}

interface Candidate {
  start: number;
  end: number;
  endedBy: Hold["endedBy"];
  breakAt: number | null;
  leftRangeAt: number | null;
  seen: boolean;
}

/** A hold from `start` to `end` (indices), cut where the vacuum was broken or the gauge left its range. */
function candidateOf(t: number[], p: number[], start: number, end: number, endedBy: Hold["endedBy"], seen: boolean, overRange: number[], top: number): Candidate {
  const cut = findBreak(t, p, start, end, overRange, top);
  return cut
    ? { start, end: cut.endIndex, endedBy: "break", breakAt: cut.breakAt, leftRangeAt: cut.leftRangeAt, seen }
    : { start, end, endedBy, breakAt: null, leftRangeAt: null, seen };
}

export function findPhases(t: number[], p: number[], overRangeSeconds: number[], options: PhaseOptions): PhaseAnalysis {
  const n = t.length;
  const sampleSeconds = medianIntervalSeconds(t);
  const noiseFraction = relativeNoise(p);
  const empty: PhaseAnalysis = { phases: { pulldown: null, holds: [], primary: null, breakAtSeconds: null }, ranges: [], noiseFraction, sampleSeconds, pulldownRange: null };
  if (n < 3) return empty;
  const overRange = overRangeSeconds.slice().sort((a, b) => a - b);
  const minHoldSeconds = Math.max(60, 2 * sampleSeconds);
  // the gauge's top, as far as the log shows it: its highest reading
  let top = 0;
  for (let i = 0; i < n; i++) if (p[i] > top) top = p[i];

  let candidates: Candidate[] = [];
  const push = (start: number, end: number, endedBy: Hold["endedBy"], seen: boolean) => candidates.push(candidateOf(t, p, start, end, endedBy, seen, overRange, top));

  if (options.holdWindow) {
    const s = firstIndexAtOrAfter(t, options.holdWindow.startSeconds);
    const e = Math.max(lastIndexAtOrBefore(t, options.holdWindow.endSeconds), s);
    push(s, e, "end_of_log", s > 0);
  } else {
    const bins = binReadings(t, p);
    const sigmaLog = noiseFraction / Math.LN10;
    const threshold = Math.max(Math.log10(1.15), 4 * sigmaLog);
    removeShortExcursions(bins.logMicrons, threshold);
    // a coarse gauge flickers between two steps: a turn must move more than two and a half of them
    const step = resolutionMicrons(p);
    const pivots = zigzag(bins.logMicrons, threshold, step >= 5 ? 2.5 * step : 0);
    let prevPeakBin = 0;
    let sawFall = false;
    for (let k = 0; k < pivots.length; k++) {
      const pv = pivots[k];
      if (pv.kind === "peak") {
        prevPeakBin = pv.bin;
        sawFall = pv.confirmed;
        continue;
      }
      const next = pivots[k + 1];
      const endBin = next ? next.bin : bins.count - 1;
      const endedBy: Hold["endedBy"] = next && next.confirmed ? "pulldown" : "end_of_log";
      let end = endedBy === "pulldown" ? argmaxMedian3(p, bins.start[Math.max(endBin - 1, 0)], bins.start[Math.min(endBin + 2, bins.count)] - 1) : n - 1;
      let fallBefore = sawFall;
      if (!fallBefore) {
        let maxBefore = -Infinity;
        for (let j = 0; j <= pv.bin; j++) maxBefore = Math.max(maxBefore, bins.logMicrons[j]);
        fallBefore = maxBefore - bins.logMicrons[pv.bin] >= threshold || t[bins.start[pv.bin]] - t[0] > Math.max(3 * sampleSeconds, 45);
      }
      let start = 0;
      let seen = false;
      if (fallBefore) {
        start = pastStillFalling(p, refineIsolation(t, p, bins, pv.bin, prevPeakBin, endBin, threshold, end, sigmaLog, step), end, 10 ** threshold);
        seen = start > 0;
      }
      if (end <= start) end = Math.min(start + 1, n - 1);
      push(start, end, endedBy, seen);
    }
  }

  // a spike that split a hold in two (a short fall, then back to the level before) is joined up again
  if (!options.holdWindow) {
    candidates = joinSpikeSplits(candidates, p, 10 ** Math.max(Math.log10(1.15), 4 * (noiseFraction / Math.LN10)));
  }
  // keep real holds; overrides move the isolation of the hold that contains it
  // a re-pull after a real hold comes minutes later; shorter rises inside a pull-down are hops
  // a hold that climbs out of the gauge's range counts with three readings, however short (a gross leak)
  const long = (c: Candidate) => t[c.end] - t[c.start] >= (c.endedBy === "pulldown" ? Math.max(minHoldSeconds, MIN_REPULL_HOLD_SECONDS) : minHoldSeconds);
  const briskRepull = (c: Candidate) => c.endedBy === "pulldown" && t[c.end] - t[c.start] >= Math.max(minHoldSeconds, SHORT_REPULL_SECONDS) && p[c.end] - p[c.start] >= SHORT_REPULL_RISE_MICRONS;
  let holdsIdx = candidates.filter((c) => c.end - c.start >= 2 && (c.leftRangeAt !== null || long(c) || briskRepull(c)));
  if (options.isolationAtSeconds !== undefined && !options.holdWindow) {
    const s = firstIndexAtOrAfter(t, options.isolationAtSeconds);
    const host = candidates.find((c) => c.end >= s) ?? null;
    const end = host && host.end > s ? host.end : n - 1;
    holdsIdx = [candidateOf(t, p, s, end, host && host.end > s ? host.endedBy : "end_of_log", true, overRange, top)];
  }

  const holds: Hold[] = holdsIdx.map((c) => {
    const duration = t[c.end] - t[c.start];
    return {
      isolatedAtSeconds: t[c.start],
      endSeconds: t[c.end],
      startMicrons: p[c.start],
      endMicrons: p[c.end],
      // an abandoned hold (the pump opened again before the hold time) is not complete; a break ends the test
      complete: c.endedBy === "break" || duration >= options.holdSeconds,
      endedBy: c.endedBy,
      leftRangeAtSeconds: c.leftRangeAt,
      fit: null,
    };
  });
  const ranges: HoldRange[] = holdsIdx.map((c) => ({ startIndex: c.start, endIndex: c.end, isolationSeen: c.seen }));
  let primary: number | null = null;
  for (let i = holds.length - 1; i >= 0 && primary === null; i--) if (holds[i].complete) primary = i;
  if (primary === null && holds.length > 0) primary = holds.length - 1;

  let pulldown: Phases["pulldown"] = null;
  let pulldownRange: PhaseAnalysis["pulldownRange"] = null;
  if (primary !== null && ranges[primary].isolationSeen) {
    const startIndex = primary > 0 ? ranges[primary - 1].endIndex + 1 : 0;
    const endIndex = ranges[primary].startIndex;
    let lowest = Infinity;
    for (let i = startIndex; i <= endIndex; i++) {
      const m = Math.max(Math.min(p[Math.max(i - 1, startIndex)], p[i]), Math.min(Math.max(p[Math.max(i - 1, startIndex)], p[i]), p[Math.min(i + 1, endIndex)]));
      lowest = Math.min(lowest, m);
    }
    pulldown = { startSeconds: t[startIndex], endSeconds: t[endIndex], startMicrons: p[startIndex], lowestMicrons: lowest };
    pulldownRange = { startIndex, endIndex };
  }
  const breakAtSeconds = holdsIdx.find((c) => c.breakAt !== null)?.breakAt ?? null;
  return { phases: { pulldown, holds, primary, breakAtSeconds }, ranges, noiseFraction, sampleSeconds, pulldownRange };
}
