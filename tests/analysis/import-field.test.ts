import { describe, expect, it } from "vitest";
import { analyzeLog } from "@/analysis";
import { importLog } from "@/analysis/decay/import";
import { toMicrons } from "@/analysis/shared/units";

// Field-export layouts written by hand, with the expected values worked out from the cells.
const close = (a: number, b: number, relTol = 1e-9) => expect(Math.abs(a - b)).toBeLessThanOrEqual(relTol * Math.max(1, Math.abs(b)));
const pad2 = (n: number) => String(n).padStart(2, "0");
/** A hold rising from 400 to about `plateau` microns, one reading every `step` seconds. */
const riseAt = (i: number, plateau = 4200, step = 10) => Math.round(400 + (plateau - 400) * (1 - Math.exp((-i * step) / 200)));

function errorOf(f: () => unknown): { code?: string; message: string; column?: string | null } {
  try {
    f();
  } catch (e) {
    return e as { code: string; message: string };
  }
  throw new Error("expected an error");
}

describe("time columns of field exports", () => {
  it("ISO 8601 offsets: +05:30, -0700, Z and 'UTC' name the same instants (ISO 8601:2019 §4.3.13)", () => {
    const instants = ["2026-11-18T20:17:00+05:30", "2026-11-18T07:47:10-0700", "2026-11-18T14:47:20Z", "2026-11-18 14:47:30 UTC", "2026-11-18T15:47:40+01:00"];
    const log = importLog("Time,Pressure (microns)\n" + instants.map((s, i) => `${s},${500 + i}`).join("\n"));
    expect(log.tSeconds).toEqual([0, 10, 20, 30, 40]);
    expect(log.startedAt).toBe("2026-11-18T14:47:00.000Z");
  });

  it("spreadsheet serial days: 25569 is 1970-01-01 and a day is 1 (ECMA-376 Part 1, SpreadsheetML 1900 date system), read by their step even without a date word", () => {
    const rows = [0, 10, 20, 30, 40, 50].map((s) => `${(25569 + (1_795_000_000 + s) / 86400).toFixed(8)},${600 + s}`);
    const log = importLog("Stamp value,Pressure (mTorr)\n" + rows.join("\n"));
    expect(log.summary.timeFormat).toBe("datetime");
    expect(log.tSeconds).toEqual([0, 10, 20, 30, 40, 50]);
    expect(log.startedAt).toBe(new Date(1_795_000_000_000).toISOString().slice(0, -1));
  });

  it("Unix epoch seconds and milliseconds give the same times (POSIX.1-2017 §4.16 seconds since the Epoch)", () => {
    const s = [0, 15, 30, 45, 60].map((d) => `${1_795_000_000 + d},${700 + d}`);
    const ms = [0, 15, 30, 45, 60].map((d) => `${(1_795_000_000 + d) * 1000},${700 + d}`);
    expect(importLog("epoch,microns\n" + s.join("\n")).tSeconds).toEqual([0, 15, 30, 45, 60]);
    expect(importLog("time_ms,microns\n" + ms.join("\n")).tSeconds).toEqual([0, 15, 30, 45, 60]);
  });

  it("US month/day/year and h:mm:ss AM/PM in separate columns, through noon and midnight (12:00 AM is 00:00, 12:00 PM is noon; ISO 8601 for the 24-hour reading)", () => {
    const text = ["Date,Time,Reading,Units", "11/18/2026,11:59:50 AM,500,microns", "11/18/2026,12:00:00 PM,501,microns", "11/18/2026,12:00:10 PM,502,microns", "11/18/2026,11:59:50 PM,503,microns", "11/19/2026,12:00:00 AM,504,microns", "11/19/2026,12:00:10 AM,505,microns"].join("\n");
    const log = importLog(text);
    expect(log.summary).toMatchObject({ timeFormat: "date_and_time", timeColumn: "Date + Time", pressureColumn: "Reading", unit: "micron" });
    expect(log.tSeconds).toEqual([0, 10, 20, 43200, 43210, 43220]);
  });

  it("European day.month.year; HH:MM:SS; decimal comma in mbar (1 mbar = 100 Pa, 1 micron = 101325/760/1000 Pa: NIST SP 811 B.8)", () => {
    const text = "Datum;Uhrzeit;Vakuum [mbar]\n" + [0, 30, 60, 90, 120].map((s, i) => `18.11.2026;14:${pad2(47 + Math.floor(s / 60))}:${pad2(s % 60)};0,${5933 + i}`).join("\n");
    const log = importLog(text);
    expect(log.summary).toMatchObject({ delimiter: ";", decimalComma: true, unit: "mbar", timeFormat: "date_and_time" });
    close(log.microns[0], toMicrons(0.5933, "mbar"));
    close(log.microns[0], (0.5933 * 100) / (101325 / 760 / 1000));
    expect(log.tSeconds).toEqual([0, 30, 60, 90, 120]);
  });

  it("stopwatch time: h:mm:ss past 24 hours and mm:ss past 59 minutes (ISO 8601 duration components, written with colons)", () => {
    const hms = importLog("Elapsed,Vacuum (microns)\n0:00:00,900\n1:00:00,800\n25:30:15,700\n26:00:00,650\n27:00:00,640");
    expect(hms.tSeconds).toEqual([0, 3600, 91815, 93600, 97200]);
    const mmss = importLog("Run time,Vacuum (microns)\n00:00,900\n59:50,800\n60:00,700\n75:30,650\n120:05,640");
    expect(mmss.tSeconds).toEqual([0, 3590, 3600, 4530, 7205]);
  });

  it("a 'Time' column of mm:ss that starts at 00:00 is a stopwatch, and one read as a clock that later passes 23:59 is retried as one", () => {
    const fromZero = importLog("Time,microns\n" + Array.from({ length: 8 }, (_, i) => `${pad2(i * 10)}:00,${800 - i}`).join("\n"));
    expect(fromZero.tSeconds).toEqual([0, 600, 1200, 1800, 2400, 3000, 3600, 4200]);
    const rows = Array.from({ length: 104 }, (_, i) => `${pad2(5 + Math.floor(i / 4))}:${pad2((i % 4) * 15)},${900 - i}`);
    const later = importLog("Time,microns\n" + rows.join("\n"));
    expect(later.tSeconds.at(-1)).toBe(30 * 60 + 45 - 5 * 60); // "30:45" is no clock time: minutes and seconds
    expect(later.summary.assumptions.join(" ")).toMatch(/mm:ss/);
  });

  it.each(["minute", "min", "minutes", "t (min)", "Minute"])("a hand-typed log headed '%s' is read in minutes (common practice, no published source)", (header) => {
    const log = importLog(`${header},reading\n0,315\n1,360\n2,382\n3,426\n4,458\n5,492`);
    expect(log.summary.timeFormat).toBe("elapsed_min");
    expect(log.tSeconds).toEqual([0, 60, 120, 180, 240, 300]);
  });
});

describe("pressure columns and units of field exports (NIST SP 811 B.8 for every factor)", () => {
  it.each([
    ["Vacuum (µ)", "micron", 1],
    ["Vacuum (μ)", "micron", 1], // U+03BC, the Greek letter mu
    ["Vacuum (microns Hg)", "micron", 1],
    ["pressure_mTorr", "mtorr", 1],
    ["Pressure (kPa abs)", "kpa", 1000 / (101325 / 760 / 1000)],
  ])("header '%s' reads as %s (microns per unit %f)", (header, unit, factor) => {
    const log = importLog(`timestamp,${header}\n` + [0, 1, 2, 3, 4].map((i) => `2026-11-18T14:47:0${i}Z,${0.5 + i}`).join("\n"));
    expect(log.summary.unit).toBe(unit);
    close(log.microns[0], 0.5 * (factor as number));
  });

  it("the unit in its own column on every row, changing from microns to mTorr", () => {
    const log = importLog("Date,Time,Reading,Units\n11/18/2026,2:47:00 PM,800,microns\n11/18/2026,2:47:10 PM,780,microns\n11/18/2026,2:47:20 PM,760,mTorr\n11/18/2026,2:47:30 PM,750,mTorr\n11/18/2026,2:47:40 PM,745,µ");
    expect(log.microns).toEqual([800, 780, 760, 750, 745]);
  });

  it("a header naming an unknown unit is an unknown_unit error that names it and lists the units read", () => {
    const e = errorOf(() => importLog("time,pressure (furlongs)\n0,500\n10,510\n20,520\n30,530\n40,540"));
    expect(e.code).toBe("unknown_unit");
    expect(e.message).toMatch(/'furlongs' is not a pressure unit known here; units understood: microns \(µmHg\), mTorr, Torr, mmHg, Pa, kPa, mbar, hPa, psia, inHg/);
    expect(e.column).toBe("pressure (furlongs)");
  });

  it("no unit named: microns when the magnitudes fit, said as an assumption and asked (unsureReasons 'unit')", () => {
    const log = importLog("elapsed_s,reading\n0,5200\n10,3100\n20,1900\n30,1200\n40,850");
    expect(log.summary.unit).toBe("micron");
    expect(log.summary.unsureReasons?.map((u) => u.code)).toContain("unit");
    expect(log.summary.assumptions.join(" ")).toMatch(/unit taken as microns/);
  });

  it("TSV with every cell quoted and thousands separators inside the quotes", () => {
    const rows = Array.from({ length: 30 }, (_, i) => `"${pad2(Math.floor((i * 20) / 60))}:${pad2((i * 20) % 60)}"\t"${(riseAt(i, 4200, 20)).toLocaleString("en-US")}"`);
    const log = importLog('"Elapsed (mm:ss)"\t"Vacuum (microns)"\n' + rows.join("\n"));
    expect(log.summary).toMatchObject({ delimiter: "\t", thousandsSeparator: ",", unsure: false });
    expect(log.microns.slice(0, 3)).toEqual([400, riseAt(1, 4200, 20), riseAt(2, 4200, 20)]);
    expect(log.microns.at(-1)).toBe(riseAt(29, 4200, 20));
  });

  it.each(["OL", "HI", "----", ">25000", ""])("over-range written '%s', for the first two hours at 1 Hz, then readings: the columns are still found and the run counted (common practice, no published source)", (marker) => {
    const rows: string[] = [];
    for (let i = 0; i < 7300; i++) rows.push(`${i},${i < 7200 ? marker : 24000 - (i - 7200) * 150}`);
    const log = importLog("elapsed_s,Vacuum (microns)\n" + rows.join("\n"));
    expect(log.summary.overRange).toBe(7200);
    expect(log.microns[0]).toBe(24000);
    expect(log.tSeconds[0]).toBe(7200);
  });
});

describe("thousands separator or decimal comma, decided for the whole column (common practice, no published source)", () => {
  const tsv = (cells: string[]) => '"t (s)"\t"Vacuum (microns)"\n' + cells.map((c, i) => `"${i * 10}"\t"${c}"`).join("\n");

  it("proof in the column: a '0,58' makes every comma a decimal mark; a '1,234,567' makes it a thousands separator", () => {
    const decimal = importLog("time;pressure (Torr)\n" + ["1,234", "0,58", "0,512", "0,498", "0,503"].map((c, i) => `${i * 10};${c}`).join("\n"));
    close(decimal.microns[0], 1234); // 1.234 Torr = 1,234 microns (1 Torr = 1,000 microns exactly, NIST SP 811 B.8)
    const grouped = importLog(tsv(["1,234,567", "1,234", "1,200", "1,100", "1,050"]));
    expect(grouped.microns).toEqual([1234567, 1234, 1200, 1100, 1050]);
  });

  it("continuity: '1,010' beside '998' is 1,010 (read as 1.01 the curve would fall 1,000-fold between two readings)", () => {
    const log = importLog(tsv(["4,150", "2,200", "1,310", "1,010", "998", "750", "640", "600", "655", "720", "790", "850", "905", "980", "1,050", "1,120"]));
    expect(log.microns.slice(0, 6)).toEqual([4150, 2200, 1310, 1010, 998, 750]);
    expect(log.summary.unsure).toBe(false);
    expect(log.summary.assumptions.join(" ")).toMatch(/would jump 1,000-fold/);
  });

  it("physics: '3,200' kPa is 3.2 kPa (3,200 kPa is above the atmosphere, no vacuum reading)", () => {
    const log = importLog("time\tpressure (kPa)\n" + ["3,200", "3,150", "3,100", "3,080", "3,055"].map((c, i) => `${i * 10}\t${c}`).join("\n"));
    close(log.microns[0], toMicrons(3.2, "kpa"));
    expect(log.summary.assumptions.join(" ")).toMatch(/could not come from a vacuum-decay log/);
  });

  it("the file's separators: quoted '1,250' in a comma-delimited file groups thousands", () => {
    const log = importLog('time,"Vacuum, microns"\n' + ["1,250", "1,220", "1,190", "1,170", "1,160"].map((c, i) => `${i * 10},"${c}"`).join("\n"));
    expect(log.microns).toEqual([1250, 1220, 1190, 1170, 1160]);
    expect(log.summary.unsureReasons?.map((u) => u.code)).not.toContain("decimal_mark");
    expect(log.summary.assumptions.join(" ")).toMatch(/'1,250' is 1,250 or 1.25 microns: read as 1,250, because/);
  });

  it("a point that groups thousands in a day.month.year semicolon export: '12.500' beside '980' is 12,500", () => {
    const cells = ["24.500", "12.500", "4.150", "1.310", "980", "700", "520", "480", "530", "610"];
    const log = importLog("Datum;Zeit;Vakuum (micron)\n" + cells.map((c, i) => `18.11.2026;14:47:${pad2(i * 5)};${c}`).join("\n"));
    expect(log.microns).toEqual([24500, 12500, 4150, 1310, 980, 700, 520, 480, 530, 610]);
  });

  it("still ambiguous (a wet log whose every reading is 'd,ddd' microns and nothing else tells): unsure with the reason, read as the larger reading, never a pass", () => {
    const cells = Array.from({ length: 80 }, (_, i) => riseAt(i, 9800).toLocaleString("en-US")).filter((c) => c.includes(","));
    const text = tsv(cells);
    const r = analyzeLog(text);
    expect(r.import.unsure).toBe(true);
    expect(r.import.unsureReasons).toEqual([expect.objectContaining({ code: "decimal_mark", message: expect.stringMatching(/is .* or .* microns: nothing in the file tells which; read as/) })]);
    expect(r.verdict).not.toBe("pass");
    expect(r.verdict).toBe("moisture");
    expect(r.reasons.at(-1)).toMatch(/^Check the readings before relying on this: '.*' is .* or .* microns/);
  });

  it("the caller's answer settles it: decimalMark 'comma' reads the same cells as decimals, 'point' as thousands", () => {
    const text = tsv(["12,500", "12,600", "12,650", "12,700", "12,720"]);
    expect(importLog(text, { decimalMark: "comma" }).microns).toEqual([12.5, 12.6, 12.65, 12.7, 12.72]);
    expect(importLog(text, { decimalMark: "point" }).microns).toEqual([12500, 12600, 12650, 12700, 12720]);
    expect(importLog(text, { decimalMark: "point" }).summary.unsure).toBe(false);
  });
});
