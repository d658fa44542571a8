/**
 * Demo month of tests for one organization: an invented company's customers, sites, systems,
 * jobs and the crew's three evacuation kits (rig register, with blank-off tests), and ≈ 48
 * evacuation and decay tests over the 30 days before now, simulated with known truth (passes,
 * leaks, moisture, both, a few inconclusive and other findings) and pull-downs that fit each
 * system and kit (scripts/seed-month.ts), each uploaded through the real pipeline (raw file in S3,
 * analysis by the real engine) and linked to its kit. All names and data are invented.
 *
 * Idempotent: an organization that already has tests is left alone.
 */
import type { Database } from "@/db/client";
import { createCustomer, createJob, createSite, createSystem } from "@/db/queries/records";
import { createRig, createRigEvent, createRigItem, upsertTestRig } from "@/db/queries/rigs";
import { countTestsByOrganization } from "@/db/queries/vacuum-tests";
import { backdateSeededTestEventsByOrganization } from "@/db/queries/seed-history";
import type { Role } from "@/lib/permissions";
import { createTestFromUpload } from "@/lib/vacuum-tests/upload";
import { testMetadataSchema } from "@/lib/vacuum-tests/schemas";
import { DEMO_SITES, planDemoMonth } from "./seed-month";
import { SEED_RIGS } from "./seed-pulldowns";

export interface SeedMember {
  userId: string;
  role: Role;
  name: string;
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

  const systemIds: { siteId: string; systemId: string }[] = [];
  for (const s of DEMO_SITES) {
    const customer = await createCustomer(db, { organizationId, name: s.customer });
    const site = await createSite(db, { organizationId, name: s.site, address: s.address, customerId: customer.id });
    for (const sys of s.systems) {
      const system = await createSystem(db, { organizationId, siteId: site.id, ...sys });
      systemIds.push({ siteId: site.id, systemId: system.id });
    }
  }

  const now = Date.now();
  const month = planDemoMonth(now, crew.length);
  // Each field member keeps one kit: pump, hoses, core tools where the kit has them, a blank-off a month ago.
  const rigIds: string[] = [];
  for (let k = 0; k < crew.length; k++) {
    const kit = SEED_RIGS[k % SEED_RIGS.length];
    const rig = await createRig(db, { organizationId, createdById: crew[k].userId, name: kit.name, truck: kit.truck, keeperId: crew[k].userId });
    const pump = await createRigItem(db, { organizationId, rigId: rig.id, values: { kind: "pump", label: `${kit.pumpCfm} CFM two-stage pump`, freeAirCfm: kit.pumpCfm, blankOffRatingMicrons: 15, oilEveryDays: 30 } });
    for (let h = 0; h < kit.hoseCount; h++)
      await createRigItem(db, { organizationId, rigId: rig.id, values: { kind: "hose", label: `Hose ${h + 1}`, insideDiameterIn: kit.hoseInsideDiameterIn, lengthFt: kit.hoseLengthFt } });
    if (kit.coreTools) for (const side of ["suction", "liquid"]) await createRigItem(db, { organizationId, rigId: rig.id, values: { kind: "core_tool", label: `Core tool, ${side}` } });
    const blankOffOn = new Date(now - 32 * 86_400_000).toISOString().slice(0, 10);
    await createRigEvent(db, { organizationId, rigId: rig.id, values: { kind: "blank_off", itemId: pump.id, occurredOn: blankOffOn, lowestMicrons: kit.blankOffMicrons, createdById: crew[k].userId } });
    rigIds.push(rig.id);
  }

  let created = 0;
  for (const t of month) {
    const place = systemIds[t.systemIndex];
    const tech = crew[t.crewIndex];
    const job = await createJob(db, {
      organizationId,
      visitedOn: t.testedAt.toISOString().slice(0, 10),
      siteId: place.siteId,
      systemId: place.systemId,
      technicianId: tech.userId,
      reason: t.reason,
      reference: `WO-${4100 + t.index}`,
    });
    const metadata = testMetadataSchema.parse({
      title: `${t.system.name} — ${t.reason.toLowerCase()}`,
      jobId: job.id,
      siteId: place.siteId,
      systemId: place.systemId,
      refrigerant: t.system.refrigerant,
      lineSetFeet: t.system.lineSetFeet,
      liquidOd: t.system.liquidOd,
      suctionOd: t.system.suctionOd,
      isPractice: false,
      testedAt: t.testedAt.toISOString(),
      rigNote: t.rig.coreTools ? `Core tools on both valves, ${t.rig.hoseInsideDiameterIn === 0.375 ? "3/8" : "1/4"}" hoses, gauge at the suction core tool` : undefined,
      notes: t.scenario === "leak" && t.index % 2 === 0 ? "Flare at the indoor coil re-made after the test." : undefined,
    });
    const bytes = new TextEncoder().encode(t.sim.text);
    const upload = await createTestFromUpload(db, { organizationId, userId: tech.userId }, {
      metadata,
      source: "file",
      filename: `${t.system.name.toLowerCase().replace(/[^a-z0-9]+/g, "-")}-${t.testedAt.toISOString().slice(0, 10)}.csv`,
      contentType: "text/csv",
      bytes,
      text: t.sim.text,
    });
    await upsertTestRig(db, { organizationId, testId: upload.testId, rigId: rigIds[t.crewIndex] });
    created++;
  }
  // The queue's "waiting" age reads the event that moved a test in: dated as on the test's day.
  await backdateSeededTestEventsByOrganization(db, { organizationId, minutesAfterTest: 20 });
  return { created, skipped: false };
}
