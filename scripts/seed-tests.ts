/**
 * Demo month of tests for one organization: an invented company's customers, sites, systems and
 * jobs, and ≈ 48 evacuation and decay tests over the 30 days before now, simulated with known truth
 * (passes, leaks, moisture, both, a few inconclusive and other findings), each uploaded through the
 * real pipeline (raw file in S3, analysis by the real engine). All names and data are invented.
 *
 * Idempotent: an organization that already has tests is left alone.
 */
import type { Database } from "@/db/client";
import { createCustomer, createJob, createSite, createSystem } from "@/db/queries/records";
import { countTestsByOrganization } from "@/db/queries/tests";
import { simulateLog, type Layout, type Scenario } from "@/analysis/simulate";
import type { Role } from "@/lib/permissions";
import { createTestFromUpload } from "@/lib/tests/upload";
import { testMetadataSchema } from "@/lib/tests/schemas";

export interface SeedMember {
  userId: string;
  role: Role;
  name: string;
}

interface DemoSystem {
  name: string;
  kind: string;
  refrigerant: string;
  lineSetFeet: number;
  liquidOd: string;
  suctionOd: string;
}

interface DemoSite {
  customer: string;
  site: string;
  address: string;
  systems: DemoSystem[];
}

const hp = (name: string, feet: number, suction = "3/4"): DemoSystem => ({ name, kind: "heat_pump", refrigerant: "R-454B", lineSetFeet: feet, liquidOd: "3/8", suctionOd: suction });
const ac = (name: string, feet: number, suction = "7/8"): DemoSystem => ({ name, kind: "split_ac", refrigerant: "R-410A", lineSetFeet: feet, liquidOd: "3/8", suctionOd: suction });
const cold = (name: string, feet: number): DemoSystem => ({ name, kind: "refrigeration", refrigerant: "R-448A", lineSetFeet: feet, liquidOd: "1/2", suctionOd: "1-1/8" });

/** Seven invented customers with their sites and systems. */
const DEMO_SITES: DemoSite[] = [
  { customer: "Harbor Lane Dental", site: "Harbor Lane Dental — main office", address: "18 Harbor Lane", systems: [ac("Rooftop split, surgery wing", 45), hp("Ductless head, reception", 20, "1/2")] },
  { customer: "Orchard Row Apartments", site: "Orchard Row, building B", address: "240 Orchard Row", systems: [hp("Unit B4 heat pump", 30), hp("Unit B7 heat pump", 35)] },
  { customer: "Kestrel Bakery", site: "Kestrel Bakery", address: "9 Quarry Street", systems: [cold("Walk-in cooler", 60), ac("Shop floor split", 25)] },
  { customer: "Pinecrest Elementary", site: "Pinecrest Elementary — gym", address: "1 School Road", systems: [ac("Gym air handler circuit 1", 70, "1-1/8")] },
  { customer: "The Okafor household", site: "Okafor residence", address: "77 Fernhill Close", systems: [hp("Attic air handler", 28)] },
  { customer: "Saltmarsh Brewing Co.", site: "Saltmarsh brewhouse", address: "3 Tidewater Yard", systems: [cold("Glycol chiller", 40), cold("Keg cold room", 55)] },
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

const REASONS = ["New install", "Compressor change", "Coil replacement", "Leak repair", "Line set replaced", "Service valve repair"];
const LAYOUT_ROTATION: Layout[] = ["iso", "datetime", "clock_preamble", "elapsed_s", "semicolon_comma", "tab", "extra_columns", "elapsed_min"];

/** Small deterministic generator (mulberry32) so the demo month is the same every time. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function uploaders(members: SeedMember[]): SeedMember[] {
  const field = members.filter((m) => m.role === "technician" || m.role === "apprentice" || m.role === "lead");
  const pick = (field.length ? field : members).slice(0, 3);
  if (!pick.length) throw new Error("seedDemoTests needs at least one member");
  return pick;
}

export async function seedDemoTests(
  db: Database,
  params: { organizationId: string; members: SeedMember[] },
): Promise<{ created: number; skipped: boolean }> {
  const { organizationId } = params;
  if ((await countTestsByOrganization(db, { organizationId })) > 0) return { created: 0, skipped: true };
  const crew = uploaders(params.members);
  const random = rng(20261101);

  const places: { siteId: string; systemId: string; system: DemoSystem; site: string }[] = [];
  for (const s of DEMO_SITES) {
    const customer = await createCustomer(db, { organizationId, name: s.customer });
    const site = await createSite(db, { organizationId, name: s.site, address: s.address, customerId: customer.id });
    for (const sys of s.systems) {
      const system = await createSystem(db, { organizationId, siteId: site.id, ...sys });
      places.push({ siteId: site.id, systemId: system.id, system: sys, site: s.site });
    }
  }

  const scenarios = SCENARIO_MIX.flatMap(([s, n]) => Array.from({ length: n }, () => s));
  // shuffle deterministically so verdicts are spread over the month
  for (let i = scenarios.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [scenarios[i], scenarios[j]] = [scenarios[j], scenarios[i]];
  }

  const now = Date.now();
  let created = 0;
  for (let i = 0; i < scenarios.length; i++) {
    const scenario = scenarios[i];
    const place = places[Math.floor(random() * places.length)];
    const tech = crew[i % crew.length];
    // working hours on a day of the last 30, oldest first
    const day = 30 - Math.floor((i * 30) / scenarios.length);
    const testedAt = new Date(now - day * 86_400_000);
    testedAt.setUTCHours(8 + Math.floor(random() * 9), Math.floor(random() * 60), 0, 0);
    const reason = REASONS[Math.floor(random() * REASONS.length)];
    const sim = simulateLog({ scenario, seed: 1000 + i, layout: LAYOUT_ROTATION[i % LAYOUT_ROTATION.length], sampleSeconds: 2 + Math.floor(random() * 9) });
    const job = await createJob(db, {
      organizationId,
      visitedOn: testedAt.toISOString().slice(0, 10),
      siteId: place.siteId,
      systemId: place.systemId,
      technicianId: tech.userId,
      reason,
      reference: `WO-${4100 + i}`,
    });
    const metadata = testMetadataSchema.parse({
      title: `${place.system.name} — ${reason.toLowerCase()}`,
      jobId: job.id,
      siteId: place.siteId,
      systemId: place.systemId,
      refrigerant: place.system.refrigerant,
      lineSetFeet: place.system.lineSetFeet,
      liquidOd: place.system.liquidOd,
      suctionOd: place.system.suctionOd,
      isPractice: false,
      testedAt: testedAt.toISOString(),
      rigNote: i % 5 === 0 ? "Core tools on both valves, 3/8\" hoses, gauge at the suction core tool" : undefined,
      notes: scenario === "leak" && i % 2 === 0 ? "Flare at the indoor coil re-made after the test." : undefined,
    });
    const bytes = new TextEncoder().encode(sim.text);
    await createTestFromUpload(db, { organizationId, userId: tech.userId }, {
      metadata,
      source: "file",
      filename: `${place.system.name.toLowerCase().replace(/[^a-z0-9]+/g, "-")}-${testedAt.toISOString().slice(0, 10)}.csv`,
      contentType: "text/csv",
      bytes,
      text: sim.text,
    });
    created++;
  }
  return { created, skipped: false };
}
