/** The typed-readings screen's rules (app/(app)/vacuum-tests/new/readings.ts): pure, no browser needed. */
import { describe, expect, it } from "vitest";
import { checkReadings, suggestNextTime, type ReadingRow } from "@/app/(app)/vacuum-tests/new/readings";
import { typedReadingsToCsv } from "@/lib/vacuum-tests/typed";

const rows = (pairs: [string, string][]): ReadingRow[] => pairs.map(([time, microns]) => ({ time, microns }));

describe("typed readings", () => {
  it("leaves out the empty rows Enter adds after the last reading, even with a suggested time", () => {
    const typed = rows([["0", "350"], ["1", "412"], ["2", "474"], ["3", "536"], ["4", "598"], ["5", "660"]]);
    const withTail = [...typed, { time: suggestNextTime(typed, "minutes"), microns: "" }, { time: "7", microns: " " }];
    expect(withTail[6].time).toBe("6");
    const checked = checkReadings(withTail, "minutes");
    expect(checked.problems).toEqual([]);
    expect(checked.readings).toHaveLength(6);
  });

  it("still names an empty reading in the middle, and minutes that do not count up", () => {
    const middle = checkReadings(rows([["0", "350"], ["1", ""], ["2", "474"], ["3", "536"], ["4", "598"], ["5", "660"]]), "minutes");
    expect(middle.problems).toEqual(["Row 2: “(empty)” is not a reading in microns."]);
    const backwards = checkReadings(rows([["0", "350"], ["2", "412"], ["1", "474"], ["3", "536"], ["4", "598"]]), "minutes");
    expect(backwards.problems[0]).toMatch(/^Row 3: 1 min is not after 2 min/);
  });

  it("writes minutes since isolation as a CSV whose first reading is the isolation (t = 0)", () => {
    const out = typedReadingsToCsv({ timeMode: "minutes", readings: [{ time: 0, microns: 350 }, { time: 1, microns: 412 }] });
    expect(out.text).toBe("Elapsed (min),Vacuum (microns)\n0,350\n1,412\n");
    expect(out.isolationAtSeconds).toBe(0);
    expect(out.importDefaults).toEqual({ timeColumn: 0, pressureColumn: 1, unit: "micron", timeUnit: "min" });
    // Clock times may include the pull-down: the engine finds the isolation itself.
    expect(typedReadingsToCsv({ timeMode: "clock", readings: [{ time: "13:05", microns: 350 }] }).isolationAtSeconds).toBeUndefined();
  });
});
