/**
 * A simulated log's readings as an ImportedLog: what a perfect importer would return. Readings in
 * microns, times in seconds from the start; over-range readings (null) go to overRangeSeconds.
 * Lets tests and the evaluation hand the truth straight to analyzeReadings, skipping the importer.
 */
import type { ImportedLog } from "../types";
import type { SimulatedLog } from "./params";

export function simulatedAsImported(sim: SimulatedLog): ImportedLog {
  const log: ImportedLog = {
    tSeconds: [],
    microns: [],
    overRangeSeconds: [],
    temperatureC: null,
    startedAt: null,
    findings: [],
    summary: {
      rows: sim.tSeconds.length, skipped: 0, overRange: 0, unit: "micron", timeFormat: "typed", delimiter: ",", decimalComma: false,
      headerLine: 0, columns: ["t", "p"], timeColumn: "t", pressureColumn: "p", temperatureColumn: null, unsure: false, assumptions: [],
    },
  };
  sim.tSeconds.forEach((t, i) => {
    const v = sim.microns[i];
    if (v === null) log.overRangeSeconds.push(t);
    else {
      log.tSeconds.push(t);
      log.microns.push(v);
    }
  });
  return log;
}
