/**
 * The demo month as data, before anything is written: an invented company's customers, sites and
 * systems, and ≈ 48 evacuation and decay tests over the 30 days before `now`, each with the kit it
 * was made with and a simulated log whose pull-down fits the system, the kit and the job
 * (seed-pulldowns.ts). Deterministic: the same `now` and crew size always give the same month.
 * scripts/seed-tests.ts writes it through the real pipeline; scripts/evaluate-planner.ts and the
 * planner's demo test read it without a database. All names and data are invented.
 */
import { seededUniform } from "@/analysis/decay/fit/prng";
import { makePulldownCurve, makeRng, scenarioParams, simulateFromParams, type Layout, type Scenario, type SimulatedLog } from "@/analysis/decay/simulate";
import { tubeLitresPerFoot } from "@/analysis/shared/volume";
import { SEED_RIGS, seedPulldown, type SeedCondition, type SeedRig } from "./seed-pulldowns";

export interface DemoSystem {
  name: string;
  kind: string;
  refrigerant: string;
  lineSetFeet: number;
  liquidOd: string;
  suctionOd: string;
  indoorCoilLitres: number;
  outdoorUnitLitres: number;
}

export interface DemoSite {
  customer: string;
  site: string;
  address: string;
  systems: DemoSystem[];
}

const hp = (name: string, feet: number, suction = "3/4", indoor = 1.8, outdoor = 3): DemoSystem => ({ name, kind: "heat_pump", refrigerant: "R-454B", lineSetFeet: feet, liquidOd: "3/8", suctionOd: suction, indoorCoilLitres: indoor, outdoorUnitLitres: outdoor });
const ac = (name: string, feet: number, suction = "7/8", indoor = 2, outdoor = 2.8): DemoSystem => ({ name, kind: "split_ac", refrigerant: "R-410A", lineSetFeet: feet, liquidOd: "3/8", suctionOd: suction, indoorCoilLitres: indoor, outdoorUnitLitres: outdoor });
const cold = (name: string, feet: number, indoor = 2.5, outdoor = 4): DemoSystem => ({ name, kind: "refrigeration", refrigerant: "R-448A", lineSetFeet: feet, liquidOd: "1/2", suctionOd: "1-1/8", indoorCoilLitres: indoor, outdoorUnitLitres: outdoor });

/** Seven invented customers with their sites and systems (coil and unit volumes invented, of the usual size). */
export const DEMO_SITES: DemoSite[] = [
  { customer: "Harbor Lane Dental", site: "Harbor Lane Dental — main office", address: "18 Harbor Lane", systems: [ac("Rooftop split, surgery wing", 45), hp("Ductless head, reception", 20, "1/2", 0.5, 1.2)] },
  { customer: "Orchard Row Apartments", site: "Orchard Row, building B", address: "240 Orchard Row", systems: [hp("Unit B4 heat pump", 30), hp("Unit B7 heat pump", 35)] },
  { customer: "Kestrel Bakery", site: "Kestrel Bakery", address: "9 Quarry Street", systems: [cold("Walk-in cooler", 60), ac("Shop floor split", 25)] },
  { customer: "Pinecrest Elementary", site: "Pinecrest Elementary — gym", address: "1 School Road", systems: [ac("Gym air handler circuit 1", 70, "1-1/8", 4.5, 6)] },
  { customer: "The Okafor household", site: "Okafor residence", address: "77 Fernhill Close", systems: [hp("Attic air handler", 28)] },
  { customer: "Saltmarsh Brewing Co.", site: "Saltmarsh brewhouse", address: "3 Tidewater Yard", systems: [cold("Glycol chiller", 40, 3.5, 6), cold("Keg cold room", 55, 3, 5)] },
  { customer: "Willowbank Vet Clinic", site: "Willowbank Vet Clinic", address: "52 Willowbank Road", systems: [hp("Kennel heat pump", 32), ac("Theatre split", 22, "3/4")] },
];

/** The month's mix of scenarios (48 tests). */
const SCENARIO_MIX: [Scenario, number][] = [
  ["tight_dry", 19],
  ["leak", 8],
  ["moisture", 7],
  ["leak_and_moisture", 4],
  ["short_hold", 3],
  ["gross_leak", 2],
  ["target_not_reached", 1],
  ["slow_pulldown", 1],
  ["oil_oscillation", 1],
  ["frozen_moisture", 1],
  ["multi_attempt", 1],
];

/** Scenarios whose first pull-down is an ordinary one, made to fit the system and the kit; the others keep the fault they show. */
const FITTED: ReadonlySet<Scenario> = new Set(["tight_dry", "leak", "moisture", "leak_and_moisture", "short_hold", "gross_leak", "oil_oscillation", "frozen_moisture"]);
const WET: ReadonlySet<Scenario> = new Set(["moisture", "leak_and_moisture", "frozen_moisture"]);

export const REASONS = ["New install", "Compressor change", "Coil replacement", "Leak repair", "Line set replaced", "Service valve repair"];
const LAYOUT_ROTATION: Layout[] = ["iso", "datetime", "clock_preamble", "elapsed_s", "semicolon_comma", "tab", "extra_columns", "elapsed_min"];

/** The engine's seeded generator (mulberry32), so the demo month is the same every time. */
const rng = seededUniform;

export interface DemoTest {
  index: number;
  scenario: Scenario;
  /** Index into the flat list of systems (site by site, in DEMO_SITES order). */
  systemIndex: number;
  site: DemoSite;
  system: DemoSystem;
  /** Which member of the field crew (in order) made it, and the kit they carry. */
  crewIndex: number;
  rig: SeedRig;
  reason: string;
  condition: SeedCondition | null;
  volumeLitres: number;
  testedAt: Date;
  sim: SimulatedLog;
}

/** Litres of a system's line set (ASTM B280 annealed bores) plus its coil, and the unit unless it is a new install. */
export function demoVolumeLitres(s: DemoSystem, newInstall: boolean): number {
  return s.lineSetFeet * (tubeLitresPerFoot(s.liquidOd) + tubeLitresPerFoot(s.suctionOd)) + s.indoorCoilLitres + (newInstall ? 0 : s.outdoorUnitLitres);
}

/** The demo month (see the file comment). `crewCount` field members take the tests in turn, each with their own kit. */
export function planDemoMonth(now: number, crewCount: number): DemoTest[] {
  const random = rng(20261101);
  const places = DEMO_SITES.flatMap((site) => site.systems.map((system) => ({ site, system })));
  const scenarios = SCENARIO_MIX.flatMap(([s, n]) => Array.from({ length: n }, () => s));
  // shuffle deterministically so verdicts are spread over the month
  for (let i = scenarios.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [scenarios[i], scenarios[j]] = [scenarios[j], scenarios[i]];
  }
  return scenarios.map((scenario, i) => {
    const systemIndex = Math.floor(random() * places.length);
    const { site, system } = places[systemIndex];
    const crewIndex = i % Math.max(1, crewCount);
    const rig = SEED_RIGS[crewIndex % SEED_RIGS.length];
    // working hours on a day of the last 30, oldest first
    const day = 30 - Math.floor((i * 30) / scenarios.length);
    const testedAt = new Date(now - day * 86_400_000);
    testedAt.setUTCHours(8 + Math.floor(random() * 9), Math.floor(random() * 60), 0, 0);
    const reason = REASONS[Math.floor(random() * REASONS.length)];
    const options = { scenario, seed: 1000 + i, layout: LAYOUT_ROTATION[i % LAYOUT_ROTATION.length], sampleSeconds: 2 + Math.floor(random() * 9) };
    const newInstall = reason === "New install";
    const volumeLitres = demoVolumeLitres(system, newInstall);
    const { params, findings } = scenarioParams(options);
    let condition: SeedCondition | null = null;
    const first = params.attempts[0];
    if (FITTED.has(scenario) && first.pulldown) {
      condition = WET.has(scenario) ? "wet" : newInstall ? "dry" : "typical";
      const isolateAtMicrons = makePulldownCurve(first.pulldown, makeRng(options.seed)).endMicrons;
      const pulldown = seedPulldown({ volumeLitres, rig, condition, isolateAtMicrons, seed: options.seed * 31 + 7, keep: { oilOscillation: first.pulldown.oilOscillation, freezeStall: first.pulldown.freezeStall } });
      params.attempts[0] = { ...first, pulldown };
    }
    const sim = simulateFromParams(params, scenario, findings);
    return { index: i, scenario, systemIndex, site, system, crewIndex, rig, reason, condition, volumeLitres, testedAt, sim };
  });
}
