/**
 * Stores a test with one analysis through the tests engineer's query functions (no mocks):
 * an invented curve — pull-down from 20,000 microns to ~400, isolation at 20 min, a 15-minute
 * hold that stays flat (pass) or climbs at a steady rate (leak). Invented data, for tests only.
 */
import { randomUUID } from "node:crypto";
import { db } from "@/db/client";
import { insertAnalysis } from "@/db/queries/analyses";
import { insertTest, updateTestCurrentAnalysis } from "@/db/queries/vacuum-tests";
import type { AnalysisResult, Verdict } from "@/analysis/decay/types";
import type { TestMember } from "./members";

export interface SeedOptions {
  verdict?: Verdict;
  title?: string;
  siteId?: string | null;
  systemId?: string | null;
  testedAt?: Date;
  isPractice?: boolean;
  helpRequested?: boolean;
  rigNote?: string;
  /** Internal notes (never on the customer's copy) and the note for the customer. */
  notes?: string;
  customerNote?: string;
}

const ISOLATION_SECONDS = 20 * 60;
const HOLD_SECONDS = 15 * 60;

/** Readings every 30 s: exponential pull-down, then the hold (flat near 450 or +60 microns/min). */
export function seededSeries(verdict: Verdict): { t: number[]; p: number[] } {
  const t: number[] = [];
  const p: number[] = [];
  for (let s = 0; s <= ISOLATION_SECONDS + HOLD_SECONDS; s += 30) {
    t.push(s);
    if (s <= ISOLATION_SECONDS) p.push(400 + 19600 * Math.exp(-s / 180));
    else {
      const h = s - ISOLATION_SECONDS;
      p.push(verdict === "pass" ? 400 + 80 * (1 - Math.exp(-h / 120)) : 400 + (60 * h) / 60);
    }
  }
  return { t, p };
}

export function seededResult(verdict: Verdict): AnalysisResult {
  const series = seededSeries(verdict);
  const end = series.p[series.p.length - 1];
  const pass = verdict === "pass";
  const profile = { name: "Common practice (no published source)", targetMicrons: 500, holdMinutes: 10, limitMicrons: 1000, leakRateMicronsPerMinute: 20 };
  const hold = {
    isolatedAtSeconds: ISOLATION_SECONDS, endSeconds: ISOLATION_SECONDS + HOLD_SECONDS, startMicrons: 400, endMicrons: end,
    complete: true, endedBy: "end_of_log" as const, fit: null,
  };
  return {
    engineVersion: "seed-1",
    verdict,
    confidence: 0.9,
    reasons: [pass ? "The rise settled below the limit." : "The pressure kept climbing at a steady rate."],
    isolationAt: ISOLATION_SECONDS,
    decay: {
      startMicrons: 400, endMicrons: end, riseMicrons: end - 400, holdSeconds: HOLD_SECONDS,
      leakRateMicronsPerMinute: pass ? 0 : 60, plateauMicrons: pass ? 480 : null, timeConstantSeconds: pass ? 120 : null,
    },
    meetsProfile: pass,
    profile,
    profileRules: [
      { rule: "target", met: true, detail: "isolated at 400 microns (target 500)" },
      { rule: "hold_time", met: true, detail: "held 15 min (needs 10)" },
      { rule: "limit", met: pass, detail: `ended at ${Math.round(end)} microns (limit 1000)` },
      { rule: "leak_rate", met: pass, detail: pass ? "no steady climb" : "climbing 60 microns/min (threshold 20)" },
    ],
    forecast: null,
    holds: [hold],
    phases: { pulldown: { startSeconds: 0, endSeconds: ISOLATION_SECONDS, startMicrons: 20000, lowestMicrons: 400 }, holds: [hold], primary: 0, breakAtSeconds: null },
    leakRate: null,
    findings: pass
      ? []
      : [{ code: "steady_climb", severity: "warning", title: "Steady climb", message: "The reading climbs at a steady rate after isolation.", evidence: { risePerMinute: 60 }, checks: ["Test the rig on its own."], cautions: [], atSeconds: ISOLATION_SECONDS }],
    import: {
      rows: series.t.length, skipped: 0, overRange: 0, unit: "micron", timeFormat: "elapsed_s", delimiter: ",", decimalComma: false,
      headerLine: 0, columns: ["seconds", "microns"], timeColumn: "seconds", pressureColumn: "microns", temperatureColumn: null, unsure: false, assumptions: [],
    },
  };
}

/** A stored test by `member` with its current analysis; returns the test id. */
export async function seedTest(member: TestMember, opts: SeedOptions = {}): Promise<string> {
  const verdict = opts.verdict ?? "pass";
  const testId = randomUUID();
  const result = seededResult(verdict);
  await db().transaction(async (tx) => {
    await insertTest(tx, {
      id: testId,
      organizationId: member.organizationId,
      createdById: member.userId,
      title: opts.title ?? `Seeded ${verdict} test`,
      source: "typed",
      siteId: opts.siteId ?? null,
      systemId: opts.systemId ?? null,
      isPractice: opts.isPractice ?? false,
      helpRequested: opts.helpRequested ?? false,
      rigNote: opts.rigNote ?? "Gauge on a core tool at the suction valve; 3/8 in. hoses, cores out.",
      notes: opts.notes ?? null,
      customerNote: opts.customerNote ?? null,
      testedAt: opts.testedAt ?? new Date(),
    });
    const a = await insertAnalysis(tx, {
      organizationId: member.organizationId, testId, version: 1, options: {}, result, series: seededSeries(verdict), createdById: member.userId,
    });
    await updateTestCurrentAnalysis(tx, { organizationId: member.organizationId, testId, analysisId: a.id, verdict });
  });
  return testId;
}
