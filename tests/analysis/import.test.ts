import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { importLog } from "@/analysis/decay/import";
import { classifyNonNumber, parseReading } from "@/analysis/decay/import/numbers";
import { parseClock, parseColonDuration, parseDateTime } from "@/analysis/decay/import/time";
import { toMicrons } from "@/analysis/shared/units";

const root = path.resolve(import.meta.dirname, "../..");
const sample = (name: string) => readFileSync(path.join(root, "fixtures/samples", name), "utf8");
const layout = (name: string) => readFileSync(path.join(root, "fixtures/layouts", name), "utf8");

// Unit conversions are exact by definition (NIST SP 811 B.8); floating point leaves ~1e-12 relative.
const close = (a: number, b: number, relTol = 1e-9) => expect(Math.abs(a - b)).toBeLessThanOrEqual(relTol * Math.max(1, Math.abs(b)));

describe("the six sample layouts (fixtures/samples, invented data; expected values read off the files)", () => {
  it("sample-1: ISO 8601 with zone, microns, 238 rows 10 s apart", () => {
    const log = importLog(sample("sample-1-iso-microns.csv"));
    expect(log.summary).toMatchObject({ rows: 238, skipped: 0, overRange: 0, unit: "micron", timeFormat: "iso", delimiter: ",", decimalComma: false, headerLine: 0, timeColumn: "timestamp", pressureColumn: "microns", unsure: false });
    expect(log.tSeconds[0]).toBe(0);
    expect(log.tSeconds.at(-1)).toBe(2370); // 13:05:00 → 13:44:30
    expect(log.microns[0]).toBe(20900);
    expect(log.microns.at(-1)).toBe(533);
    expect(log.startedAt).toBe("2026-06-14T13:05:00.000Z");
    expect(log.findings).toEqual([]);
  });

  it("sample-2: elapsed seconds from the header 'elapsed_s', mTorr = microns", () => {
    const log = importLog(sample("sample-2-elapsed-mtorr.csv"));
    expect(log.summary).toMatchObject({ rows: 302, skipped: 0, unit: "mtorr", timeFormat: "elapsed_s", unsure: false });
    expect(log.tSeconds.at(-1)).toBe(3010);
    expect(log.microns[0]).toBe(22000);
    expect(log.startedAt).toBeNull();
  });

  it("sample-3: preamble skipped, clock times, '>25000' over-range markers, °F ambient kept as °C", () => {
    const log = importLog(sample("sample-3-clock-microns-preamble.csv"));
    expect(log.summary).toMatchObject({ rows: 79, skipped: 6, overRange: 6, unit: "micron", timeFormat: "clock", headerLine: 4, timeColumn: "Time", pressureColumn: "Vacuum (microns)", temperatureColumn: "Ambient (F)" });
    // Time zero is the first data row (13:05:00) although its pressure is an over-range marker.
    expect(log.overRangeSeconds).toEqual([0, 30, 60, 90, 120, 150]);
    expect(log.tSeconds[0]).toBe(180); // 13:08:00, first number
    expect(log.tSeconds.at(-1)).toBe(2340); // 13:44:00
    expect(log.microns[0]).toBe(24400);
    // 71.1 °F = 21.7222 °C ((F − 32) × 5/9, exact definition of the scales)
    close(log.temperatureC![0], ((71.1 - 32) * 5) / 9);
    expect(log.temperatureC).toHaveLength(log.tSeconds.length);
  });

  it("sample-4: elapsed minutes from '(min)', Torr × 1000 = microns", () => {
    const log = importLog(sample("sample-4-minutes-torr.csv"));
    expect(log.summary).toMatchObject({ rows: 120, skipped: 0, unit: "torr", timeFormat: "elapsed_min" });
    close(log.tSeconds[1], 0.1667 * 60);
    close(log.tSeconds.at(-1)!, 19.8333 * 60);
    expect(log.microns[0]).toBe(411);
    expect(log.microns.at(-1)).toBe(6410);
  });

  it("sample-5: semicolons, decimal comma, Pa; '---' after 24,000 microns counted as over range", () => {
    const log = importLog(sample("sample-5-semicolon-pa-comma.csv"));
    expect(log.summary).toMatchObject({ rows: 492, skipped: 262, overRange: 262, unit: "pa", timeFormat: "iso", delimiter: ";", decimalComma: true });
    close(log.microns[0], toMicrons(25.2, "pa"));
    expect(log.tSeconds.at(-1)).toBe(237); // 13:08:57, a lone reading between runs of '---'
    expect(log.overRangeSeconds[0]).toBe(229); // 13:08:49, the first '---' (line 231)
    expect(log.overRangeSeconds).toHaveLength(262);
  });

  it("sample-6: extra columns ignored, mbar", () => {
    const log = importLog(sample("sample-6-iso-mbar-extra.csv"));
    expect(log.summary).toMatchObject({ rows: 35, skipped: 0, unit: "mbar", timeFormat: "iso", pressureColumn: "vacuum_mbar", timeColumn: "date_time", temperatureColumn: null });
    close(log.microns[0], toMicrons(0.3773, "mbar"));
    expect(log.tSeconds.at(-1)).toBe(1020);
  });
});

describe("hand-made layouts (fixtures/layouts; expected values written with the files)", () => {
  it("tab-delimited, 'YYYY-MM-DD HH:MM:SS' without zone, extra text column", () => {
    const log = importLog(layout("tab.tsv"));
    expect(log.summary).toMatchObject({ delimiter: "\t", timeFormat: "datetime", rows: 10 });
    expect(log.tSeconds).toEqual([0, 60, 120, 180, 240, 300, 360, 420, 480, 540]);
    expect(log.startedAt).toBe("2026-06-14T13:00:00.000"); // no zone in the file: no 'Z'
    expect(log.summary.assumptions.join(" ")).toMatch(/no zone/);
  });

  it("quoted fields: a comma inside the header and thousands separators inside cells", () => {
    const log = importLog(layout("quoted.csv"));
    expect(log.summary.pressureColumn).toBe("Vacuum, microns");
    expect(log.microns).toEqual([1250, 1020, 845, 700, 612, 540]);
  });

  it("byte-order mark and CRLF line ends", () => {
    const log = importLog(layout("bom-crlf.csv"));
    expect(log.summary.columns).toEqual(["time", "microns"]);
    expect(log.microns).toEqual([800, 700, 650, 610, 590, 580]);
    expect(log.tSeconds.at(-1)).toBe(50);
  });

  it("separate date and time columns crossing midnight, day-first date, °C temperature with a blank", () => {
    const log = importLog(layout("date-time-columns.csv"));
    expect(log.summary).toMatchObject({ timeFormat: "date_and_time", timeColumn: "Date + Time", temperatureColumn: "Line temp C" });
    expect(log.tSeconds).toEqual([0, 20, 40, 60, 80, 100]);
    expect(log.temperatureC![0]).toBe(12.5);
    expect(Number.isNaN(log.temperatureC![3])).toBe(true);
  });

  it("clock times rolling over midnight (23:58 → 00:02)", () => {
    const log = importLog(layout("midnight-clock.csv"));
    expect(log.summary.timeFormat).toBe("clock");
    expect(log.tSeconds).toEqual([0, 60, 90, 120, 150, 180, 240]);
  });

  it("out-of-order and duplicate stamps: stable sort plus info findings with counts", () => {
    const log = importLog(layout("unordered.csv"));
    expect(log.tSeconds).toEqual([0, 10, 20, 30, 40, 40, 50]);
    expect(log.microns).toEqual([900, 800, 700, 600, 550, 548, 530]); // duplicates keep file order
    const reordered = log.findings.find((f) => f.code === "timestamps_reordered");
    const duplicates = log.findings.find((f) => f.code === "duplicate_timestamps");
    expect(reordered).toMatchObject({ severity: "info", evidence: { readingsOutOfOrder: 1 } });
    expect(duplicates).toMatchObject({ severity: "info", evidence: { duplicateTimestamps: 1 }, atSeconds: 40 });
  });

  it("a unit column that changes from Torr to mTorr between rows", () => {
    const log = importLog(layout("unit-column.csv"));
    expect(log.microns).toEqual([1200, 1050, 980, 850, 760, 700]);
    expect(log.summary.unit).toBe("torr");
  });

  it("elapsed time with no unit: seconds assumed, unsure, said in assumptions", () => {
    const log = importLog(layout("elapsed-no-unit.csv"));
    expect(log.summary).toMatchObject({ timeFormat: "elapsed_s", unsure: true, unit: "micron" });
    expect(log.summary.assumptions.join(" ")).toMatch(/seconds/);
    expect(log.summary.assumptions.join(" ")).toMatch(/microns/);
  });

  it("no unit and every value below 30: not taken as microns, an unknown_unit error that lists the units read (common practice, no published source)", () => {
    let error: unknown = null;
    try {
      importLog(layout("small-values-no-unit.csv"));
    } catch (e) {
      error = e;
    }
    expect(error).toMatchObject({ code: "unknown_unit", column: "reading" });
    expect(String((error as Error).message)).toMatch(/names no unit.*too small for microns.*Torr, mbar.*units understood: microns \(µmHg\), mTorr, Torr/);
  });

  it("explicit overrides win: time column by name, pressure column by index, unit, time unit", () => {
    const log = importLog(layout("overrides.csv"), { timeColumn: "RUN", pressureColumn: 2, unit: "pa", timeUnit: "min" });
    expect(log.summary).toMatchObject({ timeColumn: "run", pressureColumn: "chan2", unit: "pa", timeFormat: "elapsed_min" });
    expect(log.tSeconds).toEqual([0, 60, 120, 180, 240, 300]);
    close(log.microns[0], toMicrons(66.7, "pa"));
    // The unit option also beats a unit named in the header.
    const forced = importLog(sample("sample-1-iso-microns.csv"), { unit: "mtorr" });
    expect(forced.summary.unit).toBe("mtorr");
  });

  it("month-first dates with AM/PM (unambiguous: day 14 > 12), noon to 1 PM", () => {
    const log = importLog(layout("month-first-pm.csv"));
    expect(log.summary.timeFormat).toBe("datetime");
    expect(log.tSeconds).toEqual([0, 30, 60, 90, 120, 150]);
    expect(log.startedAt).toBe("2026-06-14T12:59:30.000");
  });

  it("ISO with a +02:00 offset: startedAt in UTC", () => {
    const log = importLog(layout("zone-offset.csv"));
    expect(log.startedAt).toBe("2026-06-14T13:05:00.000Z");
    expect(log.tSeconds.at(-1)).toBe(75);
  });

  it("day.month.year, decimal comma, blank and 'Err' cells skipped (not over range), a footer row ignored", () => {
    const log = importLog(layout("footer-and-gaps.csv"));
    expect(log.summary).toMatchObject({ rows: 7, skipped: 2, overRange: 0, decimalComma: true, unit: "pa" });
    expect(log.tSeconds).toEqual([0, 30, 40, 50, 60]);
    expect(log.overRangeSeconds).toEqual([]);
    expect(log.summary.assumptions.join(" ")).toMatch(/footer/);
  });

  it("day/month order that is ambiguous in the first 50 rows is retried when a later row proves it", () => {
    // 60 rows on 12 June (ambiguous: 12/06), then rows on 13 June written 13/06 (day-first only).
    const lines = ["time,microns"];
    for (let i = 0; i < 60; i++) lines.push(`12/06/2026 23:${String(i % 60).padStart(2, "0")}:00,${500 + i}`);
    for (let i = 0; i < 5; i++) lines.push(`13/06/2026 00:0${i}:00,${600 + i}`);
    const log = importLog(lines.join("\n"));
    expect(log.tSeconds.at(-1)).toBe(64 * 60); // 12 June 23:00 → 13 June 00:04
    expect(log.summary.assumptions.join(" ")).toMatch(/day\/month\/year/);
  });

  it("a row of units under the column names is folded into them (s, mTorr, F)", () => {
    const log = importLog(layout("units-row.csv"));
    expect(log.summary).toMatchObject({ headerLine: 2, timeColumn: "Time (s)", pressureColumn: "Pressure (mTorr)", temperatureColumn: "Temperature (F)", unit: "mtorr", timeFormat: "elapsed_s", unsure: false });
    expect(log.tSeconds).toEqual([0, 15, 30, 45, 60, 75]);
    close(log.temperatureC![0], 20); // 68 °F = 20 °C exactly
  });

  it("decimal comma inside quotes in a comma-delimited file; '<0,01' under range skipped and said; milliseconds in stamps", () => {
    const log = importLog(layout("quoted-decimal-comma.csv"));
    expect(log.summary).toMatchObject({ delimiter: ",", decimalComma: true, unit: "mbar", skipped: 1, overRange: 0 });
    close(log.microns[0], toMicrons(0.8, "mbar"));
    expect(log.tSeconds).toEqual([0, 1, 3, 4, 5]);
    expect(log.startedAt).toBe("2026-06-14T13:05:00.500");
    expect(log.summary.assumptions.join(" ")).toMatch(/below the gauge's range/);
  });

  it("spreadsheet serial dates in a 'Date' column (days since 1899-12-30, the spreadsheet 1900 date system) and a 'µ' header", () => {
    const text = "Date,Vacuum (µ)\n" + [0, 1, 2, 3, 4].map((i) => `${46187.5 + (i * 10) / 86400},${800 - i * 10}`).join("\n");
    const log = importLog(text);
    expect(log.startedAt).toBe("2026-06-14T12:00:00.000"); // 46187 = 2026-06-14 in the 1900 date system
    expect(log.tSeconds).toEqual([0, 10, 20, 30, 40]);
    expect(log.summary.unit).toBe("micron");
  });

  it("month names with AM/PM ('Jun 14, 2026 1:05:00 PM')", () => {
    const text = "Time,Microns\n" + [0, 10, 20, 30, 40].map((s) => `"Jun 14, 2026 1:05:${String(s).padStart(2, "0")} PM",${800 - s}`).join("\n");
    const log = importLog(text);
    expect(log.startedAt).toBe("2026-06-14T13:05:00.000");
    expect(log.tSeconds).toEqual([0, 10, 20, 30, 40]);
  });

  it("two exports joined: the repeated header row is skipped, not a bad time", () => {
    const part = (from: number) => ["timestamp,microns", ...[0, 1, 2].map((i) => `2026-06-14T13:0${from + i}:00Z,${700 - from - i}`)];
    const log = importLog([...part(0), ...part(3)].join("\n"));
    expect(log.tSeconds).toEqual([0, 60, 120, 180, 240, 300]);
    expect(log.summary.assumptions.join(" ")).toMatch(/repeated header/);
  });

  it("Unix time in seconds: startedAt from the stamps", () => {
    const start = Date.UTC(2026, 5, 14, 13, 5, 0) / 1000;
    const text = ["unix_time,microns", ...Array.from({ length: 6 }, (_, i) => `${start + 10 * i},${800 - i}`)].join("\n");
    const log = importLog(text);
    expect(log.startedAt).toBe("2026-06-14T13:05:00.000Z");
    expect(log.tSeconds.at(-1)).toBe(50);
  });

  it("a 24-hour 1 Hz log (86,400 rows) is read in full", () => {
    const start = Date.UTC(2026, 5, 14) / 1000;
    const rows = ["timestamp,microns"];
    for (let i = 0; i < 86_400; i++) rows.push(`${new Date((start + i) * 1000).toISOString().slice(0, 19)}Z,${400 + (i % 50)}`);
    const log = importLog(rows.join("\n") + "\n");
    expect(log.tSeconds).toHaveLength(86_400);
    expect(log.tSeconds.at(-1)).toBe(86_399);
  });

  it("semicolon file, decimal comma with three decimals beside an unlocalised '21.5' column: '33,199' mbar is 33.199, not 33199 (rule in decimal.ts, common practice, no published source)", () => {
    const log = importLog(layout("semicolon-mbar-three-decimals.csv"));
    expect(log.summary).toMatchObject({ delimiter: ";", decimalComma: true, unit: "mbar", rows: 7, skipped: 1, overRange: 1 });
    // mbar → microns is exact by definition (1 mbar = 100 Pa); close() allows 1e-9 relative for float rounding.
    close(log.microns[0], toMicrons(33.199, "mbar"));
    close(log.microns[2], toMicrons(12.004, "mbar"));
    close(log.microns.at(-1)!, toMicrons(0.533, "mbar"));
    expect(log.microns.every((m) => m < 25000)).toBe(true); // none read as thousands
    expect(log.temperatureC![0]).toBe(21.5); // the point-decimal column is still read with a point
  });

  it("comma-delimited file, quoted decimal-comma cells: one '5,5' proves the convention for the whole file, so '33,199' is 33.199 (common practice, no published source)", () => {
    const log = importLog(layout("quoted-comma-three-decimals.csv"));
    expect(log.summary).toMatchObject({ delimiter: ",", decimalComma: true, unit: "mbar", rows: 6, skipped: 0 });
    close(log.microns[0], toMicrons(33.199, "mbar"));
    close(log.microns[3], toMicrons(1.067, "mbar"));
    close(log.microns[2], toMicrons(5.5, "mbar"));
    expect(log.temperatureC![0]).toBe(21.5);
  });

  it("the decimal convention is decided per file, not per cell: '33,199' in later rows follows a '0,5' in an earlier one, in a tab file with no other evidence (common practice, no published source)", () => {
    const rows = ["0,5", ...Array.from({ length: 80 }, (_, i) => `${10 + i},${String(100 + i).padStart(3, "0")}`)];
    const text = "Time\tPressure (Torr)\n" + rows.map((v, i) => `2026-06-14 13:${String(Math.floor(i / 60)).padStart(2, "0")}:${String(i % 60).padStart(2, "0")}\t${v}`).join("\n");
    const log = importLog(text);
    expect(log.summary.decimalComma).toBe(true);
    close(log.microns[1], toMicrons(10.1, "torr"));
    close(log.microns.at(-1)!, toMicrons(89.179, "torr"));
  });

  it("a 2 s log starting with 300 over-range rows ('>25000', 'OR', '----'): the pressure column is still found from the readings after them (common practice, no published source)", () => {
    const log = importLog(layout("over-range-start.csv"));
    // 'CH1' names neither pressure nor unit: chosen as the only numeric column, microns assumed.
    expect(log.summary).toMatchObject({ rows: 360, skipped: 300, overRange: 300, pressureColumn: "CH1", unit: "micron", timeFormat: "clock" });
    expect(log.microns).toHaveLength(60);
    expect(log.microns[0]).toBe(24000);
    expect(log.microns.at(-1)).toBe(18100);
    expect(log.tSeconds[0]).toBe(600); // 13:15:00, 300 rows × 2 s after the first row
    expect(log.overRangeSeconds).toHaveLength(300);
  });

  it("a semicolon kPa log starting with 250 '>3,3331' rows: decimal comma from the markers, readings '3,200' kPa (common practice, no published source)", () => {
    const log = importLog(layout("over-range-start-semicolon.csv"));
    expect(log.summary).toMatchObject({ rows: 280, skipped: 250, overRange: 250, unit: "kpa", decimalComma: true });
    expect(log.microns).toHaveLength(30);
    // kPa → microns exact by definition; 1e-9 relative for float rounding.
    close(log.microns[0], toMicrons(3.2, "kpa"));
    close(log.microns.at(-1)!, toMicrons(3.055, "kpa"));
  });

  it("quoted '1,250' with no decimal-comma evidence in a comma-delimited file stays a thousands separator (common practice, no published source)", () => {
    const log = importLog(layout("quoted.csv"));
    expect(log.summary.decimalComma).toBe(false);
    expect(log.microns[0]).toBe(1250);
  });
});

describe("cell parsers", () => {
  it("dated stamps agree with Date.UTC (ECMAScript Date, proleptic Gregorian) over 10,000 seeded instants 1990–2089", () => {
    let seed = 42;
    const random = () => (seed = (seed * 48271) % 2147483647) / 2147483647;
    for (let k = 0; k < 10_000; k++) {
      const ms = Math.floor(Date.UTC(1990, 0, 1) + random() * (Date.UTC(2090, 0, 1) - Date.UTC(1990, 0, 1)));
      const d = new Date(Math.floor(ms / 1000) * 1000);
      const iso = d.toISOString(); // 2026-06-14T13:05:00.000Z
      const want = d.getTime() / 1000;
      // Fast path (fixed positions), general path (fraction), space separator, day-first and month-first forms.
      expect(parseDateTime(iso.slice(0, 19) + "Z", "ymd")).toBe(want);
      expect(parseDateTime(iso, "ymd")).toBe(want);
      expect(parseDateTime(iso.slice(0, 19) + ".250Z", "ymd")).toBe(want + 0.25); // fast path with milliseconds
      expect(parseDateTime(iso.slice(0, 19) + ".25Z", "ymd")).toBe(want + 0.25); // general path
      expect(parseDateTime(iso.slice(0, 10) + " " + iso.slice(11, 19), "ymd")).toBe(want);
      const [y, m, day] = [iso.slice(0, 4), iso.slice(5, 7), iso.slice(8, 10)];
      expect(parseDateTime(`${day}/${m}/${y} ${iso.slice(11, 19)}`, "dmy")).toBe(want);
      expect(parseDateTime(`${m}/${day}/${y} ${iso.slice(11, 19)}`, "mdy")).toBe(want);
    }
  });

  it("rejects impossible dates and times (Gregorian calendar rules: 2024 is a leap year, 2026 is not)", () => {
    expect(parseDateTime("2024-02-29T00:00:00Z", "ymd")).toBe(Date.UTC(2024, 1, 29) / 1000);
    for (const bad of ["2026-02-29T00:00:00Z", "2026-13-01T00:00:00Z", "2026-06-14T13:60:00Z", "2026-06-14T1x:00:00Z", "2026-06-14T13:05:00Q", "2026-06-31 10:00:00"])
      expect(Number.isNaN(parseDateTime(bad, "ymd"))).toBe(true);
    expect(Number.isNaN(parseClock("25:00:00"))).toBe(true);
    expect(parseClock("12:30:00 AM")).toBe(30 * 60);
    expect(parseClock("12:30 PM")).toBe(12.5 * 3600);
    expect(parseColonDuration("65:30")).toBe(65 * 60 + 30);
    expect(parseColonDuration("1:02:03")).toBe(3723);
  });

  it("zone designators are applied (ISO 8601): +02:00, -0500, Z all name the same instant", () => {
    const want = Date.UTC(2026, 5, 14, 13, 5, 0) / 1000;
    expect(parseDateTime("2026-06-14T15:05:00+02:00", "ymd")).toBe(want);
    expect(parseDateTime("2026-06-14T08:05:00-0500", "ymd")).toBe(want);
    expect(parseDateTime("2026-06-14 13:05:00 UTC", "ymd")).toBe(want);
  });

  it("readings: plain, decimal comma, thousands separators; hex, Infinity and words refused", () => {
    expect(parseReading("512", false)).toBe(512);
    expect(parseReading(" 512.5 ", false)).toBe(512.5);
    expect(parseReading("25,20", true)).toBe(25.2);
    expect(parseReading("1.234,5", true)).toBe(1234.5);
    expect(parseReading("1,234", false)).toBe(1234);
    expect(parseReading("33,199", true)).toBe(33.199);
    expect(parseReading("1.234.567", true)).toBe(1234567);
    for (const bad of ["0x1F", "Infinity", "1e309", "", "OR", ">25000", "12a"]) expect(Number.isNaN(parseReading(bad, false))).toBe(true);
  });

  it("over- and under-range markers are told apart from blanks and errors (common practice, no published source)", () => {
    for (const c of [">25000", "OR", "O.R.", "OL", "HI", "Over range"]) expect(classifyNonNumber(c)).toBe("over_range");
    expect(classifyNonNumber("---")).toBe("dashes");
    expect(classifyNonNumber("  ")).toBe("blank");
    for (const c of ["<20", "UR", "LO"]) expect(classifyNonNumber(c)).toBe("under_range");
    for (const c of ["Err", "n/a", "abc"]) expect(classifyNonNumber(c)).toBe("other");
  });
});
