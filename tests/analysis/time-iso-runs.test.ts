import { describe, expect, it } from "vitest";
import { daysFromCivil, parseDateTime } from "@/analysis/decay/import/time";

// Expected values: days from 1970-01-01 by Hinnant's civil-date algorithm (the same module), times by hand.
const day = daysFromCivil(2026, 6, 14) * 86400;
const at = (hh: number, mm: number, ss: number) => day + hh * 3600 + mm * 60 + ss;

describe("ISO 8601 stamps in a run of one minute, across minutes and days (ISO 8601 extended format, from memory)", () => {
  it("a run of stamps within one minute and across minutes and days matches the hand-computed seconds exactly", () => {
    const stamps = ["2026-06-14T13:05:00Z", "2026-06-14T13:05:01Z", "2026-06-14T13:05:59Z", "2026-06-14T13:06:00Z", "2026-06-14T13:06:30", "2026-06-14 13:06:31", "2026-06-15T00:00:00Z"];
    const want = [at(13, 5, 0), at(13, 5, 1), at(13, 5, 59), at(13, 6, 0), at(13, 6, 30), at(13, 6, 31), day + 86400];
    // exact: whole seconds below 2^53 add without rounding
    expect(stamps.map((s) => parseDateTime(s, "ymd"))).toEqual(want);
  });

  it("milliseconds are added to the whole seconds (.250 → +0.25 s, exact in binary)", () => {
    expect(parseDateTime("2026-06-14T13:05:10Z", "ymd")).toBe(at(13, 5, 10));
    expect(parseDateTime("2026-06-14T13:05:11.250Z", "ymd")).toBe(at(13, 5, 11) + 0.25);
    expect(parseDateTime("2026-06-14T13:05:12.500", "ymd")).toBe(at(13, 5, 12) + 0.5);
  });

  it("bad seconds right after a valid stamp of the same minute are refused: '61', '6x', a missing Z, a stray suffix", () => {
    expect(parseDateTime("2026-06-14T13:05:00Z", "ymd")).toBe(at(13, 5, 0));
    expect(parseDateTime("2026-06-14T13:05:61Z", "ymd")).toBeNaN();
    expect(parseDateTime("2026-06-14T13:05:6xZ", "ymd")).toBeNaN();
    expect(parseDateTime("2026-06-14T13:05:0", "ymd")).toBeNaN();
    expect(parseDateTime("2026-06-14T13:05:01Q", "ymd")).toBeNaN();
    // a leap second is accepted as in the full parse (ss ≤ 60)
    expect(parseDateTime("2026-06-14T13:05:60Z", "ymd")).toBe(at(13, 5, 60));
  });

  it("an invalid date (2026-02-30) between valid stamps is refused and does not disturb the next stamp", () => {
    expect(parseDateTime("2026-06-14T13:05:00Z", "ymd")).toBe(at(13, 5, 0));
    expect(parseDateTime("2026-02-30T13:05:01Z", "ymd")).toBeNaN();
    expect(parseDateTime("2026-02-30T13:05:02Z", "ymd")).toBeNaN();
    expect(parseDateTime("2026-06-14T13:05:03Z", "ymd")).toBe(at(13, 5, 3));
    expect(parseDateTime("2026-06-14T13:60:03Z", "ymd")).toBeNaN();
  });
});
