/**
 * The starter casebook: one collection, clearly marked "Simulated", of the curves every
 * apprentice should know — tight and dry, moisture levelling off, a steady leak, both, a gross
 * leak, a pull-down that never reaches target, oil oscillation during pull-down, and a
 * frozen-moisture stall and thaw. Each curve comes from the simulator and is stored as a test
 * through the real upload pipeline, with a title, notes and 1–3 pins. All data invented.
 *
 * Idempotent: an organization that already has the starter collection is left alone.
 * Call it after seedDemoTests (which skips an organization that already has tests).
 */
import type { Database } from "@/db/client";
import { getCollectionBySeedKey, insertCollection, insertEntry, insertPin } from "@/db/queries/casebook";
import { simulateLog, type Scenario, type SimulatedLog } from "@/analysis/decay/simulate";
import { createTestFromUpload } from "@/lib/vacuum-tests/upload";
import { testMetadataSchema } from "@/lib/vacuum-tests/schemas";

export const STARTER_SEED_KEY = "starter-simulated-v1";

type PinAt = (sim: SimulatedLog) => number | null;

interface StarterCase {
  scenario: Scenario;
  seed: number;
  title: string;
  notes: string;
  pins: { at: PinAt; text: string }[];
}

const isolation: PinAt = (s) => s.truth.isolationAtSeconds;
const intoHold = (fraction: number): PinAt => (s) => (s.truth.isolationAtSeconds ?? 0) + s.truth.holdSeconds * fraction;
/** First reading at or below `microns` (seconds from the first row), or null. */
const firstBelow = (microns: number): PinAt => (s) => {
  for (let i = 0; i < s.tSeconds.length; i++) {
    const p = s.microns[i];
    if (p !== null && p <= microns) return s.tSeconds[i];
  }
  return null;
};
/** The lowest reading of the log. */
const lowest: PinAt = (s) => {
  let best: number | null = null;
  let at: number | null = null;
  for (let i = 0; i < s.tSeconds.length; i++) {
    const p = s.microns[i];
    if (p !== null && (best === null || p < best)) [best, at] = [p, s.tSeconds[i]];
  }
  return at;
};

const CASES: StarterCase[] = [
  {
    scenario: "tight_dry", seed: 501, title: "Tight and dry",
    notes: "Small rise that settles well under the limit. This is what a good job looks like: isolate the gauge, then break the vacuum with refrigerant.",
    pins: [{ at: isolation, text: "Pump valved off here" }, { at: intoHold(0.9), text: "Settled low: tight and dry" }],
  },
  {
    scenario: "moisture", seed: 502, title: "Moisture levelling off",
    notes: "Fast rise after isolation, then it levels off above the limit: water boiling off until its vapour pressure is reached. Keep evacuating and add heat; never run the compressor under vacuum.",
    pins: [{ at: isolation, text: "Pump valved off here" }, { at: intoHold(0.15), text: "Fast early rise" }, { at: intoHold(0.9), text: "Levelled off: moisture, not a leak" }],
  },
  {
    scenario: "leak", seed: 503, title: "A steady leak",
    notes: "The reading keeps climbing at a near-constant rate: gas through a fixed opening. Test the rig on its own, check the valve stem O-rings, then pressure-test with nitrogen through a regulator.",
    pins: [{ at: isolation, text: "Pump valved off here" }, { at: intoHold(0.85), text: "Still climbing: leak" }],
  },
  {
    scenario: "leak_and_moisture", seed: 504, title: "Leak and moisture together",
    notes: "It bends like moisture but never flattens: a plateau with a steady climb on top. Find the leak first, then keep evacuating.",
    pins: [{ at: isolation, text: "Pump valved off here" }, { at: intoHold(0.25), text: "Bends over like moisture…" }, { at: intoHold(0.9), text: "…but keeps climbing: leak too" }],
  },
  {
    scenario: "gross_leak", seed: 505, title: "Gross leak or an open valve",
    notes: "Thousands of microns within minutes. Stop and check every connection, the hoses and the valves before anything else.",
    pins: [{ at: isolation, text: "Valved off: shoots straight up" }],
  },
  {
    scenario: "target_not_reached", seed: 506, title: "Pull-down that never reaches target",
    notes: "The pump cannot get below the target although the setup looks right. Change the pump oil and do a blank-off test (pump alone on the gauge).",
    pins: [{ at: lowest, text: "Lowest it gets: above target" }],
  },
  {
    scenario: "oil_oscillation", seed: 507, title: "Oil oscillation during pull-down",
    notes: "The reading hops up and down by tens of microns around 100–200 microns: oil lying in the evaporator tubes. Blow it out with nitrogen and evacuate from both sides.",
    pins: [{ at: firstBelow(300), text: "Hopping here: oil in the tubes" }, { at: isolation, text: "Pump valved off here" }],
  },
  {
    scenario: "frozen_moisture", seed: 508, title: "Frozen moisture: stall and thaw",
    notes: "Below about 4,600 microns water at 0 °C boils and can freeze; the pull-down stalls while ice sublimes, and after isolation the melting ice shows as a rise. Keep the indoor blower running to add heat.",
    pins: [{ at: firstBelow(4600), text: "Below ~4,600: water can freeze" }, { at: isolation, text: "Valved off: the ice thaws and rises" }],
  },
];

export async function seedStarterCasebook(
  db: Database,
  params: { organizationId: string; trainerId: string },
): Promise<{ collectionId: string; created: number; skipped: boolean }> {
  const { organizationId, trainerId } = params;
  const existing = await getCollectionBySeedKey(db, { organizationId, seedKey: STARTER_SEED_KEY });
  if (existing) return { collectionId: existing.id, created: 0, skipped: true };

  const made: { c: StarterCase; sim: SimulatedLog; testId: string }[] = [];
  for (const c of CASES) {
    const sim = simulateLog({ scenario: c.scenario, seed: c.seed, layout: "elapsed_s", sampleSeconds: 5 });
    const metadata = testMetadataSchema.parse({
      title: `Simulated: ${c.title.toLowerCase()}`,
      notes: "Simulated curve for the casebook (no real job, customer or site).",
      isPractice: false,
    });
    const bytes = new TextEncoder().encode(sim.text);
    const { testId } = await createTestFromUpload(db, { organizationId, userId: trainerId }, {
      metadata,
      source: "file",
      filename: `simulated-${c.scenario.replace(/_/g, "-")}.csv`,
      contentType: "text/csv",
      bytes,
      text: sim.text,
      idempotencyKey: `${STARTER_SEED_KEY}:${c.scenario}`,
    });
    made.push({ c, sim, testId });
  }

  return db.transaction(async (tx) => {
    const again = await getCollectionBySeedKey(tx, { organizationId, seedKey: STARTER_SEED_KEY });
    if (again) return { collectionId: again.id, created: 0, skipped: true };
    const collection = await insertCollection(tx, {
      organizationId,
      createdById: trainerId,
      title: "Starter casebook (simulated)",
      description: "Simulated curves, not from real jobs: the eight shapes every apprentice should be able to read.",
      isSimulated: true,
      seedKey: STARTER_SEED_KEY,
    });
    let order = 0;
    for (const { c, sim, testId } of made) {
      const entry = await insertEntry(tx, { organizationId, collectionId: collection.id, testId, title: `Simulated: ${c.title}`, notes: c.notes, order: order++ });
      for (const pin of c.pins) {
        const at = pin.at(sim);
        if (at === null || !Number.isFinite(at)) continue;
        await insertPin(tx, { organizationId, entryId: entry.id, atSeconds: Math.round(at), text: pin.text });
      }
    }
    return { collectionId: collection.id, created: made.length, skipped: false };
  });
}
