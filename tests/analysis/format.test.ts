/**
 * groupedInteger writes whole numbers as Number.prototype.toLocaleString("en-US") does (the reference
 * is the ECMAScript Internationalization API as this Node build implements it, ECMA-402 §15.5.4).
 */
import { describe, expect, it } from "vitest";
import { groupedInteger } from "@/analysis/shared/format";

describe("groupedInteger — en-US grouping (ECMA-402 Number.prototype.toLocaleString as reference)", () => {
  it("matches toLocaleString('en-US') on whole numbers from 0 to 10^20, negatives, -0 and non-integers", () => {
    const values = [0, -0, 1, 9, 10, 99, 100, 999, 1000, 1001, 9999, 12_345, 100_000, 999_999, 1_000_000, 123_456_789, 2 ** 31, 2 ** 53, 1e20, 1e21];
    for (const v of [...values, ...values.map((x) => -x), 0.5, 1234.5678, NaN, Infinity, -Infinity]) {
      expect(groupedInteger(v), String(v)).toBe(v.toLocaleString("en-US"));
    }
  });
});
