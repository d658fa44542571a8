/**
 * One of the demo month's systems recorded in a test shop through the real pipeline: the system
 * with its line set and coils, the kits its tests were made with (rig register), and its tests
 * uploaded and linked to their kits. Invented data (scripts/seed-month.ts), for tests only.
 */
import { db } from "@/db/client";
import { createCustomer, createSite, createSystem } from "@/db/queries/records";
import { createRig, createRigEvent, createRigItem, upsertTestRig } from "@/db/queries/rigs";
import { createTestFromUpload } from "@/lib/vacuum-tests/upload";
import { testMetadataSchema } from "@/lib/vacuum-tests/schemas";
import { planDemoMonth } from "@/scripts/seed-month";
import type { TestMember } from "./members";

export async function recordDemoSystem(tech: TestMember, systemName = "Unit B7 heat pump", maxTests = 3) {
  const organizationId = tech.organizationId;
  const tests = planDemoMonth(Date.now(), 3).filter((t) => t.system.name === systemName).slice(0, maxTests);
  const demo = tests[0].system;
  const customer = await createCustomer(db(), { organizationId, name: "Planner test customer" });
  const site = await createSite(db(), { organizationId, name: "Planner test site", customerId: customer.id });
  const system = await createSystem(db(), { organizationId, siteId: site.id, ...demo });
  const rigByKit = new Map<string, string>();
  for (const t of tests) {
    if (rigByKit.has(t.rig.name)) continue;
    const rig = await createRig(db(), { organizationId, createdById: tech.userId, name: t.rig.name, truck: t.rig.truck, keeperId: tech.userId });
    const pump = await createRigItem(db(), { organizationId, rigId: rig.id, values: { kind: "pump", label: "pump", freeAirCfm: t.rig.pumpCfm, blankOffRatingMicrons: 15 } });
    for (let h = 0; h < t.rig.hoseCount; h++) await createRigItem(db(), { organizationId, rigId: rig.id, values: { kind: "hose", label: `hose ${h}`, insideDiameterIn: t.rig.hoseInsideDiameterIn, lengthFt: t.rig.hoseLengthFt } });
    if (t.rig.coreTools) await createRigItem(db(), { organizationId, rigId: rig.id, values: { kind: "core_tool", label: "core tool" } });
    await createRigEvent(db(), { organizationId, rigId: rig.id, values: { kind: "blank_off", itemId: pump.id, occurredOn: "2000-01-01", lowestMicrons: t.rig.blankOffMicrons, createdById: tech.userId } });
    rigByKit.set(t.rig.name, rig.id);
  }
  const testIds: string[] = [];
  for (const t of tests) {
    const metadata = testMetadataSchema.parse({
      title: `${demo.name} — ${t.reason.toLowerCase()}`,
      siteId: site.id,
      systemId: system.id,
      lineSetFeet: demo.lineSetFeet,
      liquidOd: demo.liquidOd,
      suctionOd: demo.suctionOd,
      isPractice: false,
      testedAt: t.testedAt.toISOString(),
    });
    const bytes = new TextEncoder().encode(t.sim.text);
    const up = await createTestFromUpload(db(), { organizationId, userId: tech.userId }, { metadata, source: "file", filename: `demo-${t.index}.csv`, contentType: "text/csv", bytes, text: t.sim.text });
    await upsertTestRig(db(), { organizationId, testId: up.testId, rigId: rigByKit.get(t.rig.name)! });
    testIds.push(up.testId);
  }
  return { systemId: system.id, systemName: demo.name, siteName: "Planner test site", testIds, tests };
}
