/** Chart labels never collide (components/curve/label-rows.ts; common practice, no published source). */
import { describe, expect, it } from "vitest";
import { labelRows } from "@/components/curve/label-rows";

describe("labels along the top of a chart take rows so that none overlaps another (common practice, no source)", () => {
  it("puts a pin's disc that would cover the 'Isolated' label on the next row, and one far away back on the first", () => {
    const isolated = { x0: 204, x1: 250 }; // the label beside the isolation line at x = 200
    const pinNearIt = { x0: 210, x1: 230 }; // pin 1, a disc of 20 px at x = 220
    const pinFar = { x0: 400, x1: 420 };
    expect(labelRows([isolated, pinNearIt, pinFar])).toEqual([0, 1, 0]);
  });

  it("never leaves two overlapping spans in one row, whatever the order", () => {
    const spans = Array.from({ length: 40 }, (_, i) => ({ x0: (i * 37) % 300, x1: ((i * 37) % 300) + 25 }));
    const rows = labelRows(spans);
    for (let a = 0; a < spans.length; a++)
      for (let b = a + 1; b < spans.length; b++)
        if (rows[a] === rows[b]) expect(spans[a].x0 >= spans[b].x1 + 4 || spans[b].x0 >= spans[a].x1 + 4).toBe(true);
  });
});
