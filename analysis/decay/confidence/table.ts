/**
 * Calibration table of the verdict confidence, written by `npm run calibrate`
 * (scripts/calibrate-confidence.ts). Do not edit by hand: re-fit it whenever the engine changes.
 * Weights: intercept, then one per feature in FEATURE_NAMES order (features.ts):
 * margin, otherMargin, climbNoiseMargin, levelNoiseMargin, seen, logReadings, logScatter, isolationSeen.
 */
import type { Verdict } from "../types";

export const CALIBRATION: { id: string; fittedOn: string; weights: Record<Verdict, number[]> } = {
  id: "engine 0.2.0, 7496 logs",
  fittedOn: "6000 simulated gauge logs (seeds 100001…) and 1500 typed logs from the simulator (seeds 200001…), 2026-12-03",
  weights: {
    pass: [-1.5216, -0.0749, -0.968, 1.326, 0.5727, 0, 2.58, -0.5934, 0.4476],
    leak: [1.9553, -0.204, -0.4537, 4.1024, 2.6739, -2.1412, -2.8597, 0.9367, -0.0151],
    moisture: [-1.2402, -2.569, -1.4544, 0.188, 2.2368, 0.0342, 3.2653, 0.752, 0.4982],
    leak_and_moisture: [-1.2917, 0.7801, 0.2536, 1.93, -0.1627, -0.0008, -0.2621, 0.0299, 0.5017],
    inconclusive: [2.5303, 1.8426, 0, 0, 0, -0.5945, 0.8335, 0.0687, 0.2157],
  },
};
