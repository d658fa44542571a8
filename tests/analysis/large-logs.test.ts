import { describe, expect, it } from "vitest";
import { analyzeLog } from "@/analysis";
import { SHAPES, generateShapedLog } from "../../scripts/bench-shapes";

// A million rows of any shape complete (no data-sized array goes through the call stack: see
// stack-safety.test.ts). Speed is measured by `npm run bench:analysis`, not here.
describe("1,000,000-row logs of field shapes complete (V8 call-stack limit; engine behaviour, no published source)", () => {
  it.each(["elapsed h:mm:ss, multi-day pull-down", "US date + AM/PM time, unit column", "TSV quoted, mm:ss past 59, thousands", "EU date;time;mbar decimal comma"])("%s", (shape) => {
    expect(SHAPES).toContain(shape);
    const r = analyzeLog(generateShapedLog(shape, 1_000_000));
    expect(r.import.rows).toBe(1_000_000);
    expect(r.verdict).toBe("moisture");
    // the hold starts at 60 % of the log (97 % for the multi-day pull-down), one reading a second
    const isolation = shape.includes("multi-day") ? 970_000 : 600_000;
    expect(Math.abs(r.isolationAt! - isolation)).toBeLessThanOrEqual(120);
  });
});
