/** The detailed description of one simulated log, and the truth it carries. */
import type { PressureUnit, Verdict } from "../types";
import type { HoldSpec, PulldownSpec } from "./curve";
import type { FieldArtifact } from "./artifacts";
import type { Layout } from "./render";

export type { HoldSpec, PulldownSpec } from "./curve";

export interface AttemptSpec {
  /** null: the log starts in this hold (only for the first attempt). */
  pulldown: PulldownSpec | null;
  hold: HoldSpec;
  /** Pressure at isolation when the log starts in the hold (microns). */
  isolationMicrons?: number;
}

export interface SensorFaultSpec {
  /** A run of identical readings (the display stuck) during the pull-down. */
  flatRun?: boolean;
  /** A few readings of zero. */
  zeros?: boolean;
  /** A few readings that jump by a factor of ten and back. */
  jumps?: boolean;
}

export interface SimulationParams {
  seed: number;
  attempts: AttemptSpec[];
  /** After the last hold, vacuum broken: the reading leaves the gauge range for this many seconds. */
  breakSeconds?: number;
  /** Seconds into the first hold at which the log starts, when it starts in the hold. */
  startOffsetSeconds?: number;
  sampleSeconds: number;
  /** Relative jitter of the sampling interval (0.1 = ±5 %). */
  jitterFraction: number;
  /** Gauge noise: standard deviation as a fraction of the reading. */
  noiseFraction: number;
  /** Probability per reading of a spike (reading × 0.4–2.5). */
  spikeRate: number;
  /** Highest reading the gauge shows; above it the row holds `overRangeMarker`. */
  gaugeMaxMicrons: number;
  overRangeMarker: string;
  sensorFault?: SensorFaultSpec;
  layout: Layout;
  unit: PressureUnit;
  ambientC: number;
  startIso: string;
  /** What field logs carry on top (artifacts.ts); none when absent. */
  artifacts?: FieldArtifact[];
}

export interface SimulatedHoldTruth {
  isolationAtSeconds: number | null;
  endSeconds: number;
  endedBy: "end_of_log" | "break" | "pulldown";
}

/** What the simulated log really contains. */
export interface SimulationTruth {
  scenario: string | null;
  seed: number;
  verdict: Verdict;
  /** Primary hold's isolation, seconds from the first row; null when the log starts in the hold. */
  isolationAtSeconds: number | null;
  isolationMicrons: number;
  leakRateMicronsPerMinute: number;
  /** p_iso + A when the hold has a part that levels off, else null. */
  plateauMicrons: number | null;
  tauSeconds: number | null;
  /** Seconds of the primary hold present in the log. */
  holdSeconds: number;
  holdReadings: number;
  holds: SimulatedHoldTruth[];
  /** Index into holds of the primary one. */
  primary: number;
  /** Finding codes the analysis should raise. */
  findings: string[];
  sampleSeconds: number;
  layout: Layout;
  unit: PressureUnit;
  /** The field artifacts the log carries (empty for a clean log). */
  artifacts: FieldArtifact[];
}

export interface SimulatedLog {
  text: string;
  truth: SimulationTruth;
  /** The readings as written (microns; null for marker rows), for tests that skip the importer. */
  tSeconds: number[];
  microns: (number | null)[];
}
