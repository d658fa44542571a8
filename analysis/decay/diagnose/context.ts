/** What the finding rules look at. */
import type { PhaseAnalysis } from "../phases";
import type { AcceptanceProfile, Decay, Verdict } from "../types";

export interface DiagnoseContext {
  /** Valid readings (above zero), seconds and microns. */
  tSeconds: number[];
  microns: number[];
  /** Seconds of readings at or below zero (impossible for an absolute gauge). */
  nonPositiveSeconds: number[];
  phases: PhaseAnalysis;
  profile: AcceptanceProfile;
  verdict: Verdict;
  decay: Decay | null;
  climbMicronsPerMinute: number;
  /** Readings in the primary hold. */
  holdReadings: number;
  /** Ambient temperature (°C) from the options or the file, or null. */
  ambientC: number | null;
}
