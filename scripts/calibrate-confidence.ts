/**
 * `npm run calibrate`: fit the verdict confidence to simulated logs with known truth and write the
 * table the engine reads (analysis/decay/confidence/table.ts). Run it again whenever the engine changes
 * (import, phases, fit or classify), then `npm run eval:analysis` to see the reliability on
 * held-out and independent logs.
 *
 *   tsx scripts/calibrate-confidence.ts [fileLogs=6000] [typedLogs=3000] [fieldLogs=3000]
 *
 * Method: per verdict, a logistic regression of "the verdict was right" on the evidence of
 * analysis/decay/confidence/features.ts (Platt scaling widened to a few features, analysis/decay/confidence/logistic.ts),
 * L2 penalty 1e-3. Fitting seeds 100001… (gauge logs), 200001… (typed logs) and 400001… (field logs:
 * every layout, field artifacts, typed minutes and gross leaks out of range, drawn as the evaluation's
 * field part draws them) are never used by the evaluation (900001…, 1000001…, 300001…, and the
 * independent set).
 */
import { writeFileSync } from "node:fs";
import { FEATURE_NAMES } from "../analysis/decay/confidence";
import { fitLogistic } from "../analysis/decay/confidence/logistic";
import { ENGINE_VERSION } from "../analysis";
import type { Verdict } from "../analysis/decay/types";
import { fieldSet, simulatedSet, typedSet, type Labelled } from "./eval/training";

const fileCount = Number(process.argv[2] ?? 6000);
const typedCount = Number(process.argv[3] ?? 3000);
const fieldCount = Number(process.argv[4] ?? 3000);
const VERDICTS: Verdict[] = ["pass", "leak", "moisture", "leak_and_moisture", "inconclusive"];
const started = Date.now();
const rows: Labelled[] = [...simulatedSet(fileCount, 100001), ...typedSet(typedCount, 200001), ...fieldSet(fieldCount, 400001)];

const weights = {} as Record<Verdict, number[]>;
const lines: string[] = [];
for (const v of VERDICTS) {
  const mine = rows.filter((r) => r.verdict === v);
  const xs = mine.map((r) => FEATURE_NAMES.map((k) => r.evidence[k] ?? 0));
  const ys = mine.map((r) => (r.right ? 1 : 0));
  const fit = fitLogistic(xs, ys, 1e-3);
  weights[v] = fit.weights.map((w) => Math.round(w * 1e4) / 1e4);
  lines.push(`${v.padEnd(18)} ${String(mine.length).padStart(5)} verdicts, ${(100 * (ys.reduce((s: number, y) => s + y, 0) / Math.max(ys.length, 1))).toFixed(1)} % right, log-loss ${fit.logLoss.toFixed(3)}, ${fit.iterations} Newton steps`);
}
const id = `engine ${ENGINE_VERSION}, ${rows.length} logs`;
const fittedOn = `${fileCount} simulated gauge logs (seeds 100001…) and ${typedCount} typed logs from the simulator (seeds 200001…) and ${fieldCount} field logs (seeds 400001…), ${new Date().toISOString().slice(0, 10)}`;
const table = `/**
 * Calibration table of the verdict confidence, written by \`npm run calibrate\`
 * (scripts/calibrate-confidence.ts). Do not edit by hand: re-fit it whenever the engine changes.
 * Weights: intercept, then one per feature in FEATURE_NAMES order (features.ts):
 * ${FEATURE_NAMES.join(", ")}.
 */
import type { Verdict } from "../types";

export const CALIBRATION: { id: string; fittedOn: string; weights: Record<Verdict, number[]> } = {
  id: ${JSON.stringify(id)},
  fittedOn: ${JSON.stringify(fittedOn)},
  weights: {
${VERDICTS.map((v) => `    ${v}: [${weights[v].join(", ")}],`).join("\n")}
  },
};
`;
writeFileSync(new URL("../analysis/decay/confidence/table.ts", import.meta.url), table);
console.log(lines.join("\n"));
console.log(`wrote analysis/decay/confidence/table.ts (${id}) in ${((Date.now() - started) / 1000).toFixed(1)} s`);
