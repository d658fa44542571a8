/** Test helper: a simulated log's readings as an ImportedLog (what a perfect importer returns). */
import type { SimulatedLog } from "@/analysis/simulate";
import type { ImportedLog } from "@/analysis/types";

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

/** Isolation tolerance of the product goal: max(3 sampling intervals, 45 s). */
export function isolationTolerance(sampleSeconds: number): number {
  return Math.max(3 * sampleSeconds, 45);
}
