/** Findings about the hold: leak, moisture, gross leak, hold too short, sparse readings, no hold. */
import { kthSmallestInPlace } from "../fit/median";
import { GROSS_LEAK_MICRONS_PER_MINUTE } from "../profile";
import type { Finding } from "../types";
import type { DiagnoseContext } from "./context";
import { CAUTION_CODES, CAUTION_COMPRESSOR, CAUTION_NITROGEN, finding, fmt } from "./wording";

/** A rise this large within ten minutes of isolation is gross (microns; common practice, no published source). */
const GROSS_RISE_MICRONS = 5000;
/** Fewer readings than this, or a median gap longer than this, in the hold is sparse (our choice). */
const SPARSE_READINGS = 8;
const SPARSE_GAP_SECONDS = 120;

export function holdFindings(ctx: DiagnoseContext): Finding[] {
  const out: Finding[] = [];
  const ph = ctx.phases.phases;
  if (ph.primary === null) {
    out.push(
      finding(
        "isolation_not_found",
        "warning",
        "No hold found",
        "The log never turns from falling to rising, so there is no hold to judge. Valve off the pump and keep logging for at least the profile's hold time.",
        { readings: ctx.tSeconds.length },
        ["Close the valve between pump and system (or at the core tool) and leave the gauge on the system.", "Log the hold for at least " + ctx.profile.holdMinutes + " minutes."],
      ),
    );
    return out;
  }
  const hold = ph.holds[ph.primary];
  const range = ctx.phases.ranges[ph.primary];
  const holdSeconds = hold.endSeconds - hold.isolatedAtSeconds;
  const climb = ctx.climbMicronsPerMinute;

  // gross leak: thousands of microns within minutes, or a climb that leaves the gauge range
  let riseIn10 = 0;
  for (let i = range.startIndex; i <= range.endIndex && ctx.tSeconds[i] - hold.isolatedAtSeconds <= 600; i++) {
    riseIn10 = Math.max(riseIn10, ctx.microns[i] - hold.startMicrons);
  }
  const gross = climb >= GROSS_LEAK_MICRONS_PER_MINUTE || (riseIn10 >= GROSS_RISE_MICRONS && climb >= ctx.profile.leakRateMicronsPerMinute);
  if (gross) {
    out.push(
      finding(
        "gross_leak",
        "danger",
        "Gross leak or open valve",
        `The pressure climbed ${fmt(riseIn10)} microns within ${Math.min(10, holdSeconds / 60).toFixed(0)} minutes of isolation (about ${fmt(climb)} microns per minute)${hold.endedBy === "break" ? " and left the gauge range" : ""}. That is far faster than moisture: something is open.`,
        { climbMicronsPerMinute: Math.round(climb), riseMicrons: Math.round(riseIn10), leftRange: hold.endedBy === "break" },
        [
          "Stop the test.",
          "Check every connection: hoses hand-tight, gaskets in place, caps on.",
          "Check for an open valve: manifold, core tool or service valve left open to air.",
        ],
        [CAUTION_NITROGEN, CAUTION_CODES],
        hold.isolatedAtSeconds,
      ),
    );
  }
  if (ctx.verdict === "leak" || ctx.verdict === "leak_and_moisture") {
    out.push(
      finding(
        "leak",
        gross ? "danger" : "warning",
        "Steady climb: a leak",
        `After isolation the pressure keeps climbing at about ${fmt(climb)} microns per minute instead of levelling off. A leak admits gas at a steady rate.`,
        { leakRateMicronsPerMinute: Math.round(climb * 10) / 10, thresholdMicronsPerMinute: ctx.profile.leakRateMicronsPerMinute },
        [
          "Isolate the rig and test it alone: hoses, hose gaskets, core tools.",
          "Check the service-valve stem O-rings and caps.",
          "Pressure-test the system again with nitrogen and find the leak before evacuating again.",
        ],
        [CAUTION_NITROGEN, CAUTION_CODES],
        hold.isolatedAtSeconds,
      ),
    );
  }
  if (ctx.verdict === "moisture" || ctx.verdict === "leak_and_moisture") {
    const plateau = ctx.decay?.plateauMicrons ?? null;
    out.push(
      finding(
        "moisture",
        "warning",
        "Levels off high: moisture",
        `The rise levels off${plateau !== null ? ` near ${fmt(plateau)} microns` : ""}, above the ${fmt(ctx.profile.limitMicrons)}-micron limit. Water is boiling off, or refrigerant is leaving the compressor oil.${ctx.verdict === "leak_and_moisture" ? " There is also a leak: find the leak first." : ""}`,
        { plateauMicrons: plateau !== null ? Math.round(plateau) : null, limitMicrons: ctx.profile.limitMicrons, timeConstantSeconds: ctx.decay?.timeConstantSeconds ?? null },
        ["Keep evacuating.", "Warm the circuit: run the indoor blower and the outdoor fan.", "Then isolate and hold again."],
        [CAUTION_COMPRESSOR, CAUTION_CODES],
        hold.isolatedAtSeconds,
      ),
    );
  }
  if (holdSeconds < ctx.profile.holdMinutes * 60 && !gross) {
    out.push(
      finding(
        "hold_too_short",
        "advice",
        "Hold shorter than the profile",
        `The hold lasted ${(holdSeconds / 60).toFixed(1)} minutes; the profile asks for at least ${ctx.profile.holdMinutes}.`,
        { holdMinutes: Math.round((holdSeconds / 60) * 10) / 10, requiredMinutes: ctx.profile.holdMinutes },
        ["Hold again for the full time before breaking the vacuum."],
        [CAUTION_CODES],
        hold.endSeconds,
      ),
    );
  }
  // the median gap (the upper middle for an even count) by quickselect, the value a full sort would give
  const gaps = new Float64Array(Math.max(0, range.endIndex - range.startIndex));
  for (let i = range.startIndex + 1; i <= range.endIndex; i++) gaps[i - range.startIndex - 1] = ctx.tSeconds[i] - ctx.tSeconds[i - 1];
  const medianGap = gaps.length ? kthSmallestInPlace(gaps, gaps.length >> 1) : Infinity;
  if (ctx.holdReadings < SPARSE_READINGS || medianGap > SPARSE_GAP_SECONDS) {
    out.push(
      finding(
        "sparse_readings",
        "advice",
        "Few readings in the hold",
        `The hold has ${ctx.holdReadings} readings${Number.isFinite(medianGap) ? `, about one every ${fmt(medianGap)} seconds` : ""}. Too few to tell a level-off from a steady climb with confidence.`,
        { holdReadings: ctx.holdReadings, medianIntervalSeconds: Number.isFinite(medianGap) ? Math.round(medianGap) : null },
        ["Set the gauge to log every 10–30 seconds.", "Hold long enough to collect at least 20 readings."],
      ),
    );
  }
  return out;
}
