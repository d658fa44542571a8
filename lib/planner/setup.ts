/**
 * What the planner needs for a recorded vacuum test, read from the records: the rig (pump,
 * hoses, core tools), the system's volume and the condition it was in. Pure; the rules are our
 * own (common practice, no published source) and each one used is said in words beside the plan.
 */
import type { PlannerInput } from "@/analysis/calculators/planner";
import type { SystemCondition } from "@/analysis/calculators/planner-load";
import { systemVolumeLitres, tubeInsideDiameterIn } from "@/analysis/shared/volume";

export interface RigItemForPlan {
  id: string;
  kind: string;
  freeAirCfm: number | null;
  blankOffRatingMicrons: number | null;
  insideDiameterIn: number | null;
  lengthFt: number | null;
}

export interface BlankOffForPlan {
  itemId: string | null;
  occurredOn: string;
  lowestMicrons: number | null;
}

export type RigSetup = Pick<PlannerInput, "pump" | "hoses" | "coresRemoved" | "manifold">;

/** A blank-off the planner uses when the rig has none recorded and no rating (a fair pump; common practice). */
export const FALLBACK_BLANK_OFF_MICRONS = 50;

/**
 * The planner's setup from a rig: its pump's free-air displacement; the last blank-off on or
 * before the test (else the maker's rating, else 50 microns); its hoses (their number, the first
 * one's bore and length); core tools on the rig → cores removed and the hoses straight to them (no
 * manifold), none → cores left in and the hoses through a manifold. Null without a pump or hoses.
 */
export function setupFromRig(items: readonly RigItemForPlan[], blankOffs: readonly BlankOffForPlan[], testedOn: string): { setup: RigSetup; words: string[] } | null {
  const pump = items.find((i) => i.kind === "pump" && i.freeAirCfm);
  const hoses = items.filter((i) => i.kind === "hose" && i.insideDiameterIn && i.lengthFt);
  if (!pump || hoses.length === 0) return null;
  const coreTools = items.some((i) => i.kind === "core_tool");
  const before = blankOffs.filter((b) => b.lowestMicrons !== null && b.occurredOn <= testedOn && (b.itemId === null || b.itemId === pump.id));
  const last = before[before.length - 1];
  const blankOff = last?.lowestMicrons ?? pump.blankOffRatingMicrons ?? FALLBACK_BLANK_OFF_MICRONS;
  const words = [
    `Pump ${pump.freeAirCfm} CFM, blank-off ${blankOff} microns (${last ? `tested ${last.occurredOn}` : pump.blankOffRatingMicrons ? "the maker's rating" : "none recorded: a fair pump assumed"}).`,
    `${hoses.length} hose${hoses.length > 1 ? "s" : ""} ${hoses[0].insideDiameterIn} in × ${hoses[0].lengthFt} ft.`,
    coreTools ? "Core tools on the rig: cores taken out, hoses straight to the core tools (no manifold)." : "No core tools on the rig: cores left in, hoses through a manifold.",
  ];
  return {
    setup: {
      pump: { displacement: pump.freeAirCfm!, displacementUnit: "cfm", blankOffMicrons: blankOff },
      hoses: { count: hoses.length, insideDiameterIn: hoses[0].insideDiameterIn!, lengthFt: hoses[0].lengthFt! },
      coresRemoved: coreTools,
      manifold: !coreTools,
    },
    words,
  };
}

/** Whether a job or title says the test was on a new install (the outdoor unit's valves still closed). */
export function isNewInstall(reason: string | null, title: string | null): boolean {
  return /new install/i.test(`${reason ?? ""} ${title ?? ""}`);
}

/**
 * The volume that was evacuated: the test's own volume if recorded; else the line set (the test's,
 * else the system's) plus the indoor coil, plus the outdoor unit unless it was a new install (its
 * service valves still closed on its factory charge). Null when nothing is known.
 */
export function volumeForPlan(
  test: { volumeLitres: number | null; lineSetFeet: number | null; liquidOd: string | null; suctionOd: string | null },
  system: { lineSetFeet: number | null; liquidOd: string | null; suctionOd: string | null; indoorCoilLitres: number | null; outdoorUnitLitres: number | null },
  newInstall: boolean,
): { litres: number; lineSet: PlannerInput["lineSet"]; words: string } | null {
  const feet = test.lineSetFeet ?? system.lineSetFeet;
  const liquid = test.lineSetFeet ? test.liquidOd : system.liquidOd;
  const suction = test.lineSetFeet ? test.suctionOd : system.suctionOd;
  const lineSet = feet && liquid && suction ? { lengthFt: feet, suctionInsideDiameterIn: tubeInsideDiameterIn(suction) } : null;
  if (test.volumeLitres) return { litres: test.volumeLitres, lineSet, words: `${test.volumeLitres} L, as recorded on the test.` };
  const coil = (system.indoorCoilLitres ?? 0) + (newInstall ? 0 : (system.outdoorUnitLitres ?? 0));
  const litres = systemVolumeLitres({ ...(lineSet ? { lineSet: [{ lengthFeet: feet!, liquidOd: liquid!, suctionOd: suction! }] } : {}), coilLitres: coil });
  if (!litres) return null;
  const parts = [lineSet ? `${feet} ft of ${liquid} + ${suction} line set` : null, system.indoorCoilLitres ? `indoor coil ${system.indoorCoilLitres} L` : null, !newInstall && system.outdoorUnitLitres ? `outdoor unit ${system.outdoorUnitLitres} L` : null, newInstall ? "outdoor unit closed off (new install)" : null];
  return { litres, lineSet, words: `${litres.toFixed(1)} L: ${parts.filter(Boolean).join(", ")}.` };
}

/** The condition a recorded test was in: moisture in its own hold → wet; a new install → dry; otherwise typical. */
export function conditionOfTest(verdict: string | null, newInstall: boolean): { condition: SystemCondition; words: string } {
  if (verdict === "moisture" || verdict === "leak_and_moisture") return { condition: "wet", words: "Wet: its own hold levelled off high (moisture)." };
  if (newInstall) return { condition: "dry", words: "Dry: a new install." };
  return { condition: "typical", words: "Typical: a circuit opened for work." };
}
