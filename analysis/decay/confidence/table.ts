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
    pass: [-0.226, -0.0116, -0.3846, 0.9151, 0.6822, 0, 1.295, -0.3287, 0.2994],
    leak: [4.6738, -0.1169, 0.8128, 2.8376, 0.4959, -1.4044, -2.0281, 3.1367, -0.0187],
    moisture: [-3.0266, -2.5602, -0.0969, 0.5257, 2.2549, 0.1512, 1.6403, 0.6051, -0.2738],
    leak_and_moisture: [-3.5108, 1.0508, 1.086, 1.7012, -0.0147, 0, 0.035, 0.1999, 0.2663],
    inconclusive: [0.1228, 3.0837, 0, 0, 0, -1.9313, 1.3873, 1.65, 2.5519],
  },
};
