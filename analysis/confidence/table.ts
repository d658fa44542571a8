/**
 * Calibration table of the verdict confidence, written by `npm run calibrate`
 * (scripts/calibrate-confidence.ts). Do not edit by hand: re-fit it whenever the engine changes.
 * Weights: intercept, then one per feature in FEATURE_NAMES order (features.ts):
 * margin, otherMargin, climbNoiseMargin, levelNoiseMargin, seen, logReadings, logScatter, isolationSeen.
 */
import type { Verdict } from "../types";

export const CALIBRATION: { id: string; fittedOn: string; weights: Record<Verdict, number[]> } = {
  id: "engine 0.2.0, 11996 logs",
  fittedOn: "6000 simulated gauge logs (seeds 100001…) and 3000 typed logs from the simulator (seeds 200001…) and 3000 field logs (seeds 400001…), 2026-12-04",
  weights: {
    pass: [-0.2129, -0.0141, -0.3859, 0.9033, 0.6875, 0, 1.304, -0.3281, 0.3005],
    leak: [4.6733, -0.1167, 0.8132, 2.8375, 0.4959, -1.4045, -2.027, 3.1369, -0.0185],
    moisture: [-2.9944, -2.618, -0.0925, 0.5692, 2.2228, 0.1554, 1.605, 0.5364, -0.2538],
    leak_and_moisture: [-3.5109, 1.0508, 1.0861, 1.7012, -0.0147, 0, 0.035, 0.1999, 0.2663],
    inconclusive: [0.1222, 3.0568, 0, 0, 0, -1.9254, 1.3942, 1.6405, 2.5435],
  },
};
