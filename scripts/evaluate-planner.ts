/**
 * `npm run eval:planner`: the planner against the demo month's recorded pull-downs, with no
 * database. Each demo test's log is analysed by the real engine (lib/vacuum-tests/engine.ts), then
 * planned and compared exactly as the planner page does it for a system's own tests
 * (lib/planner/recorded.ts: the kit from the rig register, the volume from the line set and
 * coils, the condition from the job and the test's own hold). Prints one line per test and the
 * share within a factor of 2 of the likely plan.
 */
import { durationWords } from "@/analysis/shared/format";
import { runAnalysis } from "@/lib/vacuum-tests/engine";
import { planRecordedPullDown } from "@/lib/planner/recorded";
import type { RigItemForPlan } from "@/lib/planner/setup";
import { planDemoMonth, type DemoTest } from "./seed-month";
import type { SeedRig } from "./seed-pulldowns";

/** The rig register rows the seed writes for a kit (scripts/seed-tests.ts). */
export function rigItemsOf(kit: SeedRig): RigItemForPlan[] {
  const items: RigItemForPlan[] = [{ id: "pump", kind: "pump", freeAirCfm: kit.pumpCfm, blankOffRatingMicrons: 15, insideDiameterIn: null, lengthFt: null }];
  for (let h = 0; h < kit.hoseCount; h++) items.push({ id: `hose${h}`, kind: "hose", freeAirCfm: null, blankOffRatingMicrons: null, insideDiameterIn: kit.hoseInsideDiameterIn, lengthFt: kit.hoseLengthFt });
  if (kit.coreTools) items.push({ id: "ct1", kind: "core_tool", freeAirCfm: null, blankOffRatingMicrons: null, insideDiameterIn: null, lengthFt: null }, { id: "ct2", kind: "core_tool", freeAirCfm: null, blankOffRatingMicrons: null, insideDiameterIn: null, lengthFt: null });
  return items;
}

/** Every demo test analysed and set beside its plan. */
export function evaluateDemoMonth(now = Date.UTC(2026, 10, 1), crewCount = 3) {
  return planDemoMonth(now, crewCount).map((t: DemoTest) => {
    const run = runAnalysis(t.sim.text, {});
    const recorded = planRecordedPullDown(
      {
        id: String(t.index),
        title: `${t.system.name} — ${t.reason.toLowerCase()}`,
        testedAt: t.testedAt,
        technicianName: `crew ${t.crewIndex}`,
        verdict: run.result.verdict,
        lineSetFeet: t.system.lineSetFeet,
        liquidOd: t.system.liquidOd,
        suctionOd: t.system.suctionOd,
        volumeLitres: null,
        jobReason: t.reason,
        rigId: "rig",
        rigName: t.rig.name,
        targetMicrons: run.result.profile.targetMicrons,
        pulldownEndSeconds: run.result.phases.pulldown?.endSeconds ?? null,
        series: run.series,
      },
      t.system,
      { items: rigItemsOf(t.rig), blankOffs: [{ itemId: "pump", occurredOn: "2000-01-01", lowestMicrons: t.rig.blankOffMicrons }] },
    );
    return { test: t, recorded, verdict: run.result.verdict };
  });
}

function main() {
  const rows = evaluateDemoMonth();
  const f = (s: number | null | undefined) => (s === null || s === undefined ? "—" : durationWords(s));
  console.log("test  scenario            system                          kit     condition  recorded     plan fast / likely / slow          ratio");
  const ratios: { scenario: string; ratio: number }[] = [];
  for (const { test: t, recorded: r } of rows) {
    const plan = r.plan ? `${f(r.plan.fastSeconds)} / ${f(r.plan.likelySeconds)} / ${f(r.plan.slowSeconds)}` : r.notPlanned ?? "—";
    if (r.ratio !== null) ratios.push({ scenario: t.scenario, ratio: r.ratio });
    console.log(
      `${String(t.index).padStart(4)}  ${t.scenario.padEnd(18)}  ${t.system.name.slice(0, 30).padEnd(30)}  ${t.rig.truck.padEnd(6)}  ${(r.condition ?? "—").padEnd(9)}  ${f(r.recordedSeconds).padEnd(11)}  ${plan.padEnd(34)} ${r.ratio === null ? "—" : r.ratio.toFixed(2)}`,
    );
  }
  const within = ratios.filter((x) => x.ratio >= 0.5 && x.ratio <= 2);
  console.log(`\nCompared ${ratios.length} of ${rows.length} tests (the rest never reached the target or have no pull-down).`);
  console.log(`Within a factor of 2 of the likely plan: ${within.length} of ${ratios.length}.`);
  const outside = ratios.filter((x) => !(x.ratio >= 0.5 && x.ratio <= 2));
  if (outside.length) console.log(`Outside: ${outside.map((x) => `${x.scenario} ${x.ratio.toFixed(2)}`).join(", ")}`);
  console.log("\nPer system: median of recorded ÷ likely plan over its tests");
  for (const s of perSystem(rows)) console.log(`  ${s.name.padEnd(32)} ${String(s.count).padStart(2)} tests  median ${s.median.toFixed(2)}`);
}

/** Median ratio per system, over the tests with a ratio. */
export function perSystem(rows: ReturnType<typeof evaluateDemoMonth>): { name: string; count: number; median: number }[] {
  const by = new Map<string, number[]>();
  for (const { test, recorded } of rows) if (recorded.ratio !== null) by.set(test.system.name, [...(by.get(test.system.name) ?? []), recorded.ratio]);
  return [...by.entries()].map(([name, xs]) => {
    const s = [...xs].sort((a, b) => a - b);
    const m = s.length >> 1;
    return { name, count: s.length, median: s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2 };
  });
}

if (process.argv[1] && /evaluate-planner/.test(process.argv[1])) main();
