/**
 * Suspect-sensor signs: readings at or below zero (impossible for an absolute gauge), long runs of
 * identical readings while the pressure should be moving, and impossible single-reading jumps
 * (a factor of three away from both neighbours, which agree). Thresholds are our choice.
 */
import type { Finding } from "../types";
import type { DiagnoseContext } from "./context";
import { finding } from "./wording";

const JUMP_FACTOR = 3;
const MIN_JUMPS = 3;

export function sensorFindings(ctx: DiagnoseContext): Finding[] {
  const t = ctx.tSeconds;
  const p = ctx.microns;
  const n = p.length;
  const pd = ctx.phases.pulldownRange;
  // flat runs of identical readings
  let longestRunSeconds = 0;
  let runValue = 0;
  let runAt: number | null = null;
  let s = 0;
  for (let i = 1; i <= n; i++) {
    if (i < n && p[i] === p[s]) continue;
    const count = i - s;
    const seconds = t[i - 1] - t[s];
    const inPulldown = pd !== null && s >= pd.startIndex && i - 1 <= pd.endIndex;
    const suspicious = p[s] >= 100 && count >= 20 && (seconds >= (inPulldown ? 180 : 600));
    if (suspicious && seconds > longestRunSeconds) {
      longestRunSeconds = seconds;
      runValue = p[s];
      runAt = t[s];
    }
    s = i;
  }
  let jumps = 0;
  for (let i = 1; i < n - 1; i++) {
    const a = p[i - 1];
    const c = p[i + 1];
    if (Math.max(a, c) / Math.min(a, c) > 1.3) continue;
    const ratio = p[i] / Math.sqrt(a * c);
    if (ratio > JUMP_FACTOR || ratio < 1 / JUMP_FACTOR) jumps++;
  }
  const zeros = ctx.nonPositiveSeconds.length;
  const signs: string[] = [];
  if (zeros > 0) signs.push(`${zeros} reading${zeros > 1 ? "s" : ""} at or below zero`);
  if (longestRunSeconds > 0) signs.push(`the reading stuck at ${Math.round(runValue)} microns for ${(longestRunSeconds / 60).toFixed(0)} minutes`);
  if (jumps >= MIN_JUMPS) signs.push(`${jumps} readings that jump by more than a factor of ${JUMP_FACTOR} and straight back`);
  if (signs.length === 0) return [];
  return [
    finding(
      "suspect_sensor",
      "warning",
      "Check the gauge sensor",
      `The log shows ${signs.join(", ")}. A vacuum cannot read zero or jump like that; a dirty or wet sensor, a loose connection or a flat battery can. Those readings were left out where possible.`,
      { nonPositiveReadings: zeros, longestFlatRunSeconds: Math.round(longestRunSeconds), impossibleJumps: jumps },
      [
        "Clean or dry the sensor as its maker instructs.",
        "Check the gauge's connection and battery.",
        "Compare with a second gauge before trusting this test.",
      ],
      undefined,
      ctx.nonPositiveSeconds[0] ?? runAt,
    ),
  ];
}
