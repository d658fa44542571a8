import { randomUUID } from "node:crypto";
import { and, asc, eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { analyses, findings, user } from "@/db/schema";
import { lockTestById, updateTestCurrentAnalysis } from "./vacuum-tests";
import type { AnalysisResult, AnalyzeOptions } from "@/analysis/decay/types";

export interface NewAnalysis {
  id?: string;
  organizationId: string;
  testId: string;
  version: number;
  options: AnalyzeOptions;
  result: AnalysisResult;
  series: { t: number[]; p: number[] };
  reason?: string | null;
  createdById: string;
}

/** The rows of one analysis run and its findings, as inserted (the id is the caller's). */
export function analysisRowsOf(params: NewAnalysis & { id: string }) {
  const r = params.result;
  const analysis: typeof analyses.$inferInsert & { id: string } = {
    id: params.id,
    organizationId: params.organizationId,
    testId: params.testId,
    version: params.version,
    engineVersion: r.engineVersion,
    options: params.options,
    profile: r.profile,
    result: r,
    series: params.series,
    verdict: r.verdict,
    confidence: r.confidence,
    isolationAt: r.isolationAt,
    reason: params.reason ?? null,
    createdById: params.createdById,
  };
  const findingRows: (typeof findings.$inferInsert)[] = r.findings.map((f) => ({
    organizationId: params.organizationId,
    analysisId: params.id,
    testId: params.testId,
    code: f.code,
    severity: f.severity,
    title: f.title,
  }));
  return { analysis, findings: findingRows };
}

/** Store one analysis run and its findings rows. */
export async function insertAnalysis(db: Db, params: NewAnalysis) {
  const rows = analysisRowsOf({ ...params, id: params.id ?? randomUUID() });
  const [row] = await db.insert(analyses).values(rows.analysis).returning({ id: analyses.id, version: analyses.version, createdAt: analyses.createdAt });
  if (rows.findings.length) await db.insert(findings).values(rows.findings);
  return row;
}

/**
 * The one writer of a test's next analysis (re-analysis, re-test, bulk re-check; the upload's first
 * one goes in its single statement with the same analysisRowsOf): inside the caller's transaction,
 * lock the test, store the run as version n + 1 with its findings, and make it current.
 * `beforeCurrent` runs after the version is written and before the test points at it (a caller
 * spends its Idempotency-Key there). Null when the test is not in the organization.
 */
export async function saveNewAnalysis(
  tx: Db,
  p: { id?: string; organizationId: string; testId: string; options: AnalyzeOptions; result: AnalysisResult; series: NewAnalysis["series"]; reason: string | null; createdById: string },
  beforeCurrent?: (saved: { analysisId: string; version: number }) => Promise<void>,
): Promise<{ analysisId: string; version: number } | null> {
  if (!(await lockTestById(tx, { organizationId: p.organizationId, testId: p.testId }))) return null;
  const version = await getNextAnalysisVersionByTest(tx, { organizationId: p.organizationId, testId: p.testId });
  const saved = await insertAnalysis(tx, { ...p, version });
  await beforeCurrent?.({ analysisId: saved.id, version });
  await updateTestCurrentAnalysis(tx, { organizationId: p.organizationId, testId: p.testId, analysisId: saved.id, verdict: p.result.verdict });
  return { analysisId: saved.id, version };
}

/** The next version number of a test's analyses (call with the test row locked). */
export async function getNextAnalysisVersionByTest(db: Db, params: { organizationId: string; testId: string }): Promise<number> {
  const [row] = await db
    .select({ v: sql<number>`coalesce(max(${analyses.version}), 0)::int` })
    .from(analyses)
    .where(and(eq(analyses.organizationId, params.organizationId), eq(analyses.testId, params.testId)));
  return (row?.v ?? 0) + 1;
}

export async function getAnalysisById(db: Db, params: { organizationId: string; analysisId: string }) {
  const [row] = await db
    .select()
    .from(analyses)
    .where(and(eq(analyses.organizationId, params.organizationId), eq(analyses.id, params.analysisId)))
    .limit(1);
  return row ?? null;
}

/** Every analysis of a test, oldest first, without the bulky result and series. */
export async function listAnalysesByTest(db: Db, params: { organizationId: string; testId: string }) {
  return db
    .select({
      id: analyses.id,
      version: analyses.version,
      verdict: analyses.verdict,
      confidence: analyses.confidence,
      meetsProfile: sql<boolean | null>`(${analyses.result}->>'meetsProfile')::boolean`,
      createdAt: analyses.createdAt,
      createdById: analyses.createdById,
      createdByName: user.name,
      reason: analyses.reason,
      options: analyses.options,
    })
    .from(analyses)
    .innerJoin(user, eq(user.id, analyses.createdById))
    .where(and(eq(analyses.organizationId, params.organizationId), eq(analyses.testId, params.testId)))
    .orderBy(asc(analyses.version));
}

/** One analysis of one test (both must match, inside the organization), with its result and series. */
export async function getAnalysisByTestAndId(db: Db, params: { organizationId: string; testId: string; analysisId: string }) {
  const [row] = await db
    .select()
    .from(analyses)
    .where(and(eq(analyses.organizationId, params.organizationId), eq(analyses.testId, params.testId), eq(analyses.id, params.analysisId)))
    .limit(1);
  return row ?? null;
}
