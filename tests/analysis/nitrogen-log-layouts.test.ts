/**
 * The nitrogen test's logger CSV read by the decay importer's reader (one set of rules for both logs):
 * the layouts field exports have — a decimal comma in a semicolon file, quoted thousands in a TSV,
 * separate date and time columns, a preamble — give the same readings as the plain file.
 * Invented data; the layouts are those the importer's own field tests read (common practice, no published source).
 */
import { describe, expect, it } from "vitest";
import { readNitrogenLog } from "@/analysis/calculators/nitrogen-log";

describe("nitrogen log read by the importer's reader (common practice, no published source)", () => {
  it("reads a semicolon file with decimal commas in pressure and temperature", () => {
    const log = readNitrogenLog("Zeit (min);Druck (bar g);Temp (°C)\n0;20,5;26,5\n30;20,4;24,0\n60;20,3;21,5\n");
    expect(log.unit).toBe("bar_gauge");
    expect(log.tSeconds).toEqual([0, 1800, 3600]);
    expect(log.pressureGauge).toEqual([20.5, 20.4, 20.3]);
    expect(log.temperature).toEqual([26.5, 24, 21.5]);
    expect(log.temperatureUnit).toBe("C");
  });

  it("reads a TSV whose quoted pressure cells group thousands (\"2,068.4\" kPa g is 2068.4)", () => {
    const log = readNitrogenLog('elapsed_s\tPressure (kPa g)\tTemp (°F)\n0\t"2,068.4"\t80.0\n600\t"2,061.5"\t78.5\n1200\t"2,054.6"\t77.0\n');
    expect(log.unit).toBe("kpa_gauge");
    expect(log.pressureGauge).toEqual([2068.4, 2061.5, 2054.6]);
    expect(log.tSeconds).toEqual([0, 600, 1200]);
    expect(log.temperature).toEqual([80, 78.5, 77]);
  });

  it("reads separate date and time columns (day first, a European export) with the clock time as start", () => {
    const log = readNitrogenLog("Datum;Uhrzeit;Druck (bar g)\n14.06.2026;13:05:00;20,0\n14.06.2026;14:05:00;19,9\n14.06.2026;15:05:00;19,9\n");
    expect(log.tSeconds).toEqual([0, 3600, 7200]);
    expect(log.pressureGauge).toEqual([20, 19.9, 19.9]);
    expect(log.startedAtMs).toBe(Date.UTC(2026, 5, 14, 13, 5, 0));
  });

  it("skips a logger preamble before the header and names the file line of each reading", () => {
    const log = readNitrogenLog("Logger export\nJob: invented site 12\n\ntime,pressure (psig)\n2026-05-01 08:00:00,300\n2026-05-01 09:00:00,299.5\n");
    expect(log.pressureGauge).toEqual([300, 299.5]);
    expect(log.lines).toEqual([5, 6]);
    expect(log.tSeconds).toEqual([0, 3600]);
  });

  it("rolls a clock-only time column over midnight", () => {
    const log = readNitrogenLog("time,pressure (psig)\n23:30:00,300\n00:30:00,299\n01:30:00,298\n");
    expect(log.tSeconds).toEqual([0, 3600, 7200]);
  });

  it("names the line and the cell of a time that is no time", () => {
    expect(() => readNitrogenLog("time,pressure (psig)\n2026-05-01 08:00:00,300\nlater,299\n")).toThrow(/line 3: time 'later'/);
  });
});
