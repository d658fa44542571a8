/** The casebook's test picker tells identical titles apart and says the verdict in words (pure). */
import { describe, expect, it } from "vitest";
import { pickerLabel } from "@/app/(app)/casebook/[id]/picker";

describe("casebook test picker", () => {
  it("shows site, technician, date and the verdict in words, never a raw code", () => {
    const a = pickerLabel({ id: "1", title: "Heat pump start-up", verdict: "leak_and_moisture", meetsProfile: false, siteName: "Harbor Lane Dental", technicianName: "Theo Tech", testedAt: "2026-11-20T15:00:00Z" });
    const b = pickerLabel({ id: "2", title: "Heat pump start-up", verdict: "pass", meetsProfile: true, siteName: "Maple Street Bakery", technicianName: "Ada Apprentice", testedAt: "2026-11-21T15:00:00Z" });
    expect(a).toBe("Heat pump start-up · Harbor Lane Dental · Theo Tech · Nov 20, 2026 · Levels off and climbs");
    expect(b).toBe("Heat pump start-up · Maple Street Bakery · Ada Apprentice · Nov 21, 2026 · Passed");
    expect(a).not.toMatch(/_/);
  });
});
