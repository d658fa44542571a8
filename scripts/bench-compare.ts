/**
 * Prints how long /compare's data takes on a demo-sized shop: a fresh organization with the demo
 * month (scripts/seed-tests.ts, ≈ 48 real uploads), then GET /api/overlay for 2, 4 and 8 of its tests,
 * called in-process through the route (session, visibility, series, alignment), 3 warm-ups then 15
 * timed runs each; prints p50 and the slowest. Figures only, no pass/fail.
 *   bash scripts/dev-env.sh && set -a && . .data/dev/env && set +a && ./node_modules/.bin/tsx scripts/bench-compare.ts
 */
import { performance } from "node:perf_hooks";
import { db, closeDb } from "@/db/client";
import { listTestsByOrganization } from "@/db/queries/vacuum-tests";
import { GET as overlayGet } from "@/app/api/overlay/route";
import { addMember, appRequest, createShop } from "@/tests/helpers/members";
import { seedDemoTests } from "./seed-tests";

async function main() {
  const owner = await createShop("Bench Comfort (invented)");
  const tech = await addMember(owner.organizationId, "technician", "Bench Tech");
  const trainer = await addMember(owner.organizationId, "trainer", "Bench Trainer");
  const t0 = performance.now();
  const seeded = await seedDemoTests(db(), { organizationId: owner.organizationId, members: [{ userId: tech.userId, role: "technician", name: tech.name }] });
  console.log(`demo month seeded: ${seeded.created} tests in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
  const tests = await listTestsByOrganization(db(), { viewer: { organizationId: owner.organizationId, userId: trainer.userId, role: "trainer" }, filters: { limit: 8 } });
  for (const n of [2, 4, 8]) {
    const ids = tests.slice(0, n).map((t) => t.id).join(",");
    const once = async () => {
      const start = performance.now();
      const res = await overlayGet(appRequest(`/api/overlay?tests=${ids}`, { as: trainer }), { params: Promise.resolve({}) });
      if (res.status !== 200) throw new Error(`overlay answered ${res.status}`);
      await res.arrayBuffer();
      return performance.now() - start;
    };
    for (let i = 0; i < 3; i++) await once();
    const runs: number[] = [];
    for (let i = 0; i < 15; i++) runs.push(await once());
    runs.sort((a, b) => a - b);
    console.log(`GET /api/overlay, ${n} curves: p50 ${runs[7].toFixed(1)} ms, slowest ${runs[14].toFixed(1)} ms (15 runs)`);
  }
  await closeDb();
}

void main();
