/**
 * The gauge and rig a test was made with, and the last upkeep of each piece on or before the test
 * day, in words for the report. Pure: the rows come in, the lines go out.
 */
import type { RigEventRow, RigItemRow } from "@/db/queries/rigs";

export interface EquipmentLine {
  /** "Micron gauge", "Vacuum pump", … */
  kind: string;
  label: string;
  /** "checked 2026-05-02 (read 498 against a 500-micron reference)", or "no upkeep logged". */
  upkeep: string;
}

const KIND_WORDS: Record<string, string> = { gauge: "Micron gauge", pump: "Vacuum pump", hose: "Hose", core_tool: "Core tool" };
const ORDER = ["gauge", "pump", "hose", "core_tool"];
const n = (x: number) => Math.round(x).toLocaleString("en-US");

function eventWords(e: RigEventRow): string {
  switch (e.kind) {
    case "gauge_checked":
      return `checked ${e.occurredOn}${e.referenceMicrons != null && e.gaugeMicrons != null ? ` (read ${n(e.gaugeMicrons)} against a ${n(e.referenceMicrons)}-micron reference)` : ""}`;
    case "gauge_cleaned":
      return `cleaned ${e.occurredOn}`;
    case "oil_changed":
      return `oil changed ${e.occurredOn}`;
    case "blank_off":
      return `blank-off ${e.occurredOn}${e.lowestMicrons != null ? ` reached ${n(e.lowestMicrons)} microns` : ""}`;
    case "hose_gaskets_replaced":
      return `gaskets replaced ${e.occurredOn}`;
    case "pump_hours":
      return `hour meter ${e.pumpHours ?? "?"} h on ${e.occurredOn}`;
    default:
      return `${String(e.kind).replace(/_/g, " ")} ${e.occurredOn}`;
  }
}

/** Upkeep kinds that count for each piece (the hour meter is a reading, not upkeep). */
const UPKEEP: Record<string, string[]> = {
  gauge: ["gauge_checked", "gauge_cleaned"],
  pump: ["oil_changed", "blank_off"],
  hose: ["hose_gaskets_replaced"],
  core_tool: [],
};

/**
 * One line per piece of the rig, gauges first: its last upkeep of each kind on or before `testedOn`
 * (YYYY-MM-DD, the shop's calendar). `events` newest first, as listRigEventsByRig gives them.
 */
export function equipmentLines(items: RigItemRow[], events: RigEventRow[], testedOn: string): EquipmentLine[] {
  const sorted = [...items].sort((a, b) => ORDER.indexOf(a.kind) - ORDER.indexOf(b.kind));
  return sorted.map((item) => {
    const mine = events.filter((e) => e.itemId === item.id && e.occurredOn <= testedOn);
    const latest = (UPKEEP[item.kind] ?? []).map((k) => mine.find((e) => e.kind === k)).filter((e): e is RigEventRow => !!e);
    return { kind: KIND_WORDS[item.kind] ?? item.kind, label: item.label, upkeep: latest.length ? latest.map(eventWords).join("; ") : "no upkeep logged before the test" };
  });
}
