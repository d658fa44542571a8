/** The report's pure parts: the rig's last upkeep, the review story, the shop's clock, the PDF's glyphs. */
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { equipmentLines } from "@/lib/reports/equipment";
import { reviewStoryOf } from "@/lib/reports/review-story";
import { dayInZone, whenInZone } from "@/lib/reports/time";
import { inPdfFont, pdfText, PDF_FONT_RANGES } from "@/lib/reports/glyphs";
import type { RigEventRow, RigItemRow } from "@/db/queries/rigs";

const item = (id: string, kind: RigItemRow["kind"], label: string) => ({ id, kind, label }) as RigItemRow;
const event = (itemId: string, kind: RigEventRow["kind"], occurredOn: string, extra: Partial<RigEventRow> = {}) =>
  ({ itemId, kind, occurredOn, referenceMicrons: null, gaugeMicrons: null, lowestMicrons: null, pumpHours: null, ...extra }) as RigEventRow;

describe("report parts", () => {
  it("names the gauge first and each piece's last upkeep on or before the test day, not after it", () => {
    const items = [item("p", "pump", "6 CFM pump"), item("g", "gauge", "Digital micron gauge")];
    const events = [
      event("g", "gauge_checked", "2026-03-10", { referenceMicrons: 500, gaugeMicrons: 510 }), // after the test: not shown
      event("g", "gauge_checked", "2026-02-01", { referenceMicrons: 500, gaugeMicrons: 498 }),
      event("p", "blank_off", "2026-02-20", { lowestMicrons: 38 }),
      event("p", "oil_changed", "2026-01-15"),
    ];
    expect(equipmentLines(items, events, "2026-03-03")).toEqual([
      { kind: "Micron gauge", label: "Digital micron gauge", upkeep: "checked 2026-02-01 (read 498 against a 500-micron reference)" },
      { kind: "Vacuum pump", label: "6 CFM pump", upkeep: "oil changed 2026-01-15; blank-off 2026-02-20 reached 38 microns" },
    ]);
    expect(equipmentLines([item("h", "hose", "3/8 in. hose")], [], "2026-03-03")[0].upkeep).toBe("no upkeep logged before the test");
  });

  it("tells each review status in its own words: a sent-back test is never 'not signed off'", () => {
    const at = new Date("2026-03-03T20:05:00Z");
    const sent = reviewStoryOf("sent_back", [{ kind: "sent_back", at, note: "Pull down again.", actorName: "Lena Lead" }], "America/Chicago");
    expect(sent.headline).toBe("Sent back by Lena Lead on March 3, 2026 at 2:05 PM CST: Pull down again.");
    expect(reviewStoryOf("signed_off", [{ kind: "signed_off", at, note: null, actorName: "Lena Lead" }], "UTC").headline).toBe("Signed off by Lena Lead on March 3, 2026 at 8:05 PM UTC.");
    expect(reviewStoryOf("waiting_review", [], "UTC").headline).toBe("Waiting for a lead's review; not reviewed yet.");
    expect(reviewStoryOf("submitted", [], "UTC").headline).toBe("Submitted; no review asked.");
  });

  it("writes instants in the shop's zone and its calendar day (IANA time zone database: Asia/Tokyo is UTC+9, no DST)", () => {
    expect(whenInZone("2026-03-03T20:05:00Z", "Asia/Tokyo")).toBe("March 4, 2026 at 5:05 AM GMT+9");
    expect(dayInZone("2026-03-03T20:05:00Z", "Asia/Tokyo")).toBe("2026-03-04");
    expect(dayInZone("2026-03-03T20:05:00Z", "Not/AZone")).toBe("2026-03-03");
  });

  it("keeps to the glyphs of the embedded font: the declared unicode-range is @fontsource's own, and arrows are written in words", () => {
    const css = readFileSync("node_modules/@fontsource/ibm-plex-sans/400.css", "utf8");
    const block = css.split("/* ibm-plex-sans-latin-400-normal */")[1];
    const declared = /unicode-range: ([^;]+);/.exec(block)![1].split(",").map((r) => r.trim().replace(/^U\+/, "").split("-").map((h) => parseInt(h, 16)));
    expect(declared.map(([lo, hi]) => [lo, hi ?? lo])).toEqual(PDF_FONT_RANGES.map(([lo, hi]) => [lo, hi]));
    expect(pdfText("Start → end 186 → 3,270 µ; ≤ 1,000 ✓")).toBe("Start to end 186 to 3,270 µ; <= 1,000 ");
    expect(inPdfFont("µ".codePointAt(0)!)).toBe(true);
    expect(inPdfFont("→".codePointAt(0)!)).toBe(false);
  });
});
