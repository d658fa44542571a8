/**
 * Calibration table of the verdict confidence, written by `npm run calibrate`
 * (scripts/calibrate-confidence.ts). Do not edit by hand: re-fit it whenever the engine changes.
 * Weights: intercept, then one per feature in FEATURE_NAMES order (features.ts):
 * margin, otherMargin, climbNoiseMargin, levelNoiseMargin, seen, logReadings, logScatter, isolationSeen.
 */
import type { Verdict } from "../types";

export const CALIBRATION: { id: string; fittedOn: string; weights: Record<Verdict, number[]> } = {
  id: "engine 0.2.0, 7497 logs",
  fittedOn: "6000 simulated gauge logs (seeds 100001…) and 1500 typed logs from the simulator (seeds 200001…), 2026-12-03",
  weights: {
    pass: [-1.3963, 0.0309, -0.6409, 1.4721, 0.3475, 0, 1.8438, -0.2388, 0.3257],
    leak: [6.4213, -0.4828, 0.2165, 4.4194, 3.024, -1.1929, -2.5989, 2.0604, 0.149],
    moisture: [-6.3183, -2.4006, -0.0307, 0.6037, 2.4903, 0, 1.7697, -0.1862, 0.236],
    leak_and_moisture: [-0.9928, 0.7945, 0.2529, 1.9051, -0.1797, 0, -0.3022, 0.0351, 0.5148],
    inconclusive: [5.9584, 1.5555, 0, 0, 0, -1.5867, -0.0722, 0.4638, -0.2635],
  },
};
