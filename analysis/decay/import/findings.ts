/** Findings the importer raises about the time stamps themselves. */
import type { Finding } from "../types";

export function reorderedFinding(reordered: number, rows: number): Finding {
  return {
    code: "timestamps_reordered",
    severity: "info",
    title: "Readings out of time order",
    message: `${reordered} of ${rows} readings had a time earlier than the reading before them; they were put in time order before the analysis.`,
    evidence: { readingsOutOfOrder: reordered, readings: rows },
    checks: ["Check the gauge's clock was not changed during the test.", "If the log was joined from two exports, check nothing was pasted twice."],
    cautions: [],
  };
}

export function duplicatesFinding(duplicates: number, rows: number, firstAtSeconds: number): Finding {
  return {
    code: "duplicate_timestamps",
    severity: "info",
    title: "Repeated time stamps",
    message: `${duplicates} readings share their time stamp with another reading; all were kept, in file order.`,
    evidence: { duplicateTimestamps: duplicates, readings: rows },
    checks: ["A gauge that logs faster than its clock's resolution repeats stamps; this is usually harmless."],
    cautions: [],
    atSeconds: firstAtSeconds,
  };
}
