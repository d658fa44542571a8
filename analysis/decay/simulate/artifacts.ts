/**
 * What field logs carry on top of a clean simulated log, applied to the readings after sampling: a
 * bumped hose (one or two wild readings), wireless drop-outs (minutes of missing rows), repeated rows,
 * a coarse gauge (10- or 100-micron steps), thermal drift of a few per cent an hour (sun on the line
 * set, a cooling evening), a long run of over-range rows before the pull-down reaches the gauge's range,
 * and over-range written as nothing. Gauge behaviour: common practice, no published source. Each draws
 * from its own generator seeded from the log's seed, so a log without artifacts is unchanged.
 */
import { makeRng, type Rng } from "./prng";
import type { RenderRow } from "./render";

export const FIELD_ARTIFACTS = ["spikes", "dropouts", "duplicates", "coarse_steps", "drift", "long_over_range_start", "blank_over_range"] as const;
export type FieldArtifact = (typeof FIELD_ARTIFACTS)[number];

/** Where the judged hold lies in the rows (seconds, before any shift). */
export interface HoldWindow {
  startSeconds: number;
  endSeconds: number;
}

/** A reading as a gauge shows it (1 micron below 1,000, 10 below 10,000, then 100), or coarser. */
function displayRound(microns: number, step: number): number {
  const s = Math.max(step, microns < 1000 ? 1 : microns < 10000 ? 10 : 100);
  return Math.max(Math.round(microns / s) * s, s === 1 ? 1 : s);
}

function inHold(rows: RenderRow[], w: HoldWindow, margin: number): number[] {
  const out: number[] = [];
  rows.forEach((r, i) => {
    if (r.microns !== null && r.tSeconds > w.startSeconds + margin && r.tSeconds < w.endSeconds - margin) out.push(i);
  });
  return out;
}

function spikes(rows: RenderRow[], w: HoldWindow, rng: Rng, sampleSeconds: number, gaugeMaxMicrons: number): void {
  const candidates = inHold(rows, w, 2 * sampleSeconds);
  if (candidates.length < 12) return;
  const events = rng.int(1, 2);
  for (let e = 0; e < events; e++) {
    const at = candidates[rng.int(0, candidates.length - 3)];
    const width = rng.chance(0.6) ? 1 : 2;
    const factor = rng.chance(0.7) ? rng.uniform(1.4, 3) : rng.uniform(0.4, 0.7);
    for (let j = at; j < at + width; j++) if (rows[j].microns !== null) rows[j].microns = Math.min(displayRound(rows[j].microns! * factor, 1), gaugeMaxMicrons);
  }
}

function dropouts(rows: RenderRow[], w: HoldWindow, rng: Rng): RenderRow[] {
  if (w.endSeconds - w.startSeconds < 600) return rows;
  const gaps: [number, number][] = [];
  const n = rng.int(1, 3);
  for (let g = 0; g < n; g++) {
    const from = rng.uniform(w.startSeconds + 90, w.endSeconds - 120);
    gaps.push([from, from + rng.uniform(30, 300)]);
  }
  return rows.filter((r) => !gaps.some(([a, b]) => r.tSeconds > a && r.tSeconds < b));
}

function duplicates(rows: RenderRow[], rng: Rng): RenderRow[] {
  const out: RenderRow[] = [];
  for (const r of rows) {
    out.push(r);
    if (rng.chance(0.05)) out.push({ ...r });
  }
  return out;
}

/**
 * Apply the artifacts. Returns the new rows and the seconds the log was lengthened by at its start (a
 * long over-range run): every true time after it moves by that much.
 */
export function applyFieldArtifacts(
  input: RenderRow[],
  artifacts: readonly FieldArtifact[],
  w: HoldWindow,
  seed: number,
  sampleSeconds: number,
  gaugeMaxMicrons: number,
): { rows: RenderRow[]; shiftSeconds: number } {
  let rows = input;
  const rng = makeRng(seed * 104729 + 31);
  const has = (a: FieldArtifact) => artifacts.includes(a);
  if (has("drift")) {
    // a few per cent an hour after isolation, either way
    const perHour = rng.uniform(0.015, 0.04) * (rng.chance(0.5) ? 1 : -1);
    for (const r of rows) if (r.microns !== null && r.tSeconds > w.startSeconds) r.microns = displayRound(r.microns * (1 + (perHour * (r.tSeconds - w.startSeconds)) / 3600), 1);
  }
  if (has("coarse_steps")) {
    const step = rng.chance(0.5) ? 10 : 100;
    for (const r of rows) if (r.microns !== null) r.microns = displayRound(r.microns, step);
  }
  if (has("spikes")) spikes(rows, w, rng, sampleSeconds, gaugeMaxMicrons);
  // drop-outs are a wireless gauge's, logging every few seconds; a log every few minutes has nothing to drop
  if (has("dropouts") && sampleSeconds <= 60) rows = dropouts(rows, w, rng);
  if (has("duplicates")) rows = duplicates(rows, rng);
  const marker = has("blank_over_range") ? "" : undefined;
  if (marker !== undefined) for (const r of rows) if (r.microns === null) r.marker = marker;
  let shiftSeconds = 0;
  if (has("long_over_range_start") && rows.length > 0) {
    const lead = Math.round(rng.uniform(20, 90) * 60);
    const steps = Math.max(1, Math.floor(lead / sampleSeconds));
    shiftSeconds = steps * sampleSeconds;
    const template = rows.find((r) => r.microns === null)?.marker ?? marker ?? "OL";
    const head: RenderRow[] = [];
    for (let k = 0; k < steps; k++) head.push({ tSeconds: k * sampleSeconds, microns: null, marker: template, temperatureC: rows[0].temperatureC });
    rows = head.concat(rows.map((r) => ({ ...r, tSeconds: r.tSeconds + shiftSeconds })));
  }
  return { rows, shiftSeconds };
}
