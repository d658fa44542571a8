/**
 * Re-analysis: re-read the raw file from storage (never modified), run the engine with the
 * test's earlier options plus the caller's overrides, store version n + 1 and point the test at it.
 */
import type { AnalysisResult, AnalyzeOptions } from "@/analysis/types";
import type { Database, Tx } from "@/db/client";
import type { EngineRun } from "./engine";
import { getAnalysisById, getNextAnalysisVersionByTest, insertAnalysis } from "@/db/queries/analyses";
import { getUploadByTest, lockTestById, updateTestCurrentAnalysis } from "@/db/queries/tests";
import type { Viewer } from "@/db/queries/visibility";
import { AppError } from "@/lib/errors";
import { log } from "@/lib/log";
import { getObjectBytes } from "@/lib/storage";
import { analyseOffThread } from "./engine-pool";
import { decodeLogText } from "./files";
import { compactOptions, importOptionsOf, resolveProfile } from "./options";
import { requireRevealedTest } from "./read";
import type { ReanalysisInput } from "./schemas";

/** Owners and leads re-analyse any test they see; everyone else only their own. */
export function mayReanalyse(viewer: Viewer, createdById: string): boolean {
  return viewer.role === "owner" || viewer.role === "lead" || viewer.userId === createdById;
}

export async function reanalyseTest(
  db: Database,
  viewer: Viewer,
  testId: string,
  input: ReanalysisInput,
): Promise<{ analysis: AnalysisResult; version: number; analysisId: string }> {
  const row = await requireRevealedTest(db, viewer, testId);
  if (!mayReanalyse(viewer, row.test.createdById))
    throw new AppError("forbidden", "Only the technician who uploaded this test, a lead or the owner can re-analyse it.");
  const org = viewer.organizationId;
  const [current, upload] = await Promise.all([
    row.test.currentAnalysisId ? getAnalysisById(db, { organizationId: org, analysisId: row.test.currentAnalysisId }) : null,
    getUploadByTest(db, { organizationId: org, testId }),
  ]);
  if (!upload) throw new AppError("not_found", "The raw file of this test is missing.");
  const base: AnalyzeOptions = current?.options ?? {};
  const overrides = importOptionsOf(input);
  const options = compactOptions({
    ...base,
    import: overrides ? { ...(base.import ?? {}), ...overrides } : base.import,
    profile: input.profileId ? await resolveProfile(db, { organizationId: org, profileId: input.profileId }) : base.profile,
    isolationAtSeconds: input.isolationAtSeconds ?? base.isolationAtSeconds,
    holdWindow: input.holdWindow ?? base.holdWindow,
  });

  const run = await analyseOffThread(await readStoredLogText(upload.objectKey), options); // LogError → 422 naming the option
  return db.transaction((tx) => saveNewAnalysis(tx, { organizationId: org, testId, options, run, reason: input.reason ?? null, createdById: viewer.userId }));
}

/** The stored raw log's text; storage away → 503 and nothing changes. */
export async function readStoredLogText(objectKey: string): Promise<string> {
  let bytes: Uint8Array;
  try {
    bytes = await getObjectBytes(objectKey);
  } catch (err) {
    log.error("raw log not readable", { objectKey, err: String(err) });
    throw new AppError("storage_unavailable", "File storage is not answering; the analysis was not changed. Please try again.");
  }
  return decodeLogText(bytes);
}

/** Inside a transaction: store a run as the test's next analysis version and make it current. */
export async function saveNewAnalysis(
  tx: Tx,
  p: { organizationId: string; testId: string; options: AnalyzeOptions; run: EngineRun; reason: string | null; createdById: string },
): Promise<{ analysis: AnalysisResult; version: number; analysisId: string }> {
  if (!(await lockTestById(tx, { organizationId: p.organizationId, testId: p.testId }))) throw new AppError("not_found", "No such test.");
  const version = await getNextAnalysisVersionByTest(tx, { organizationId: p.organizationId, testId: p.testId });
  const saved = await insertAnalysis(tx, {
    organizationId: p.organizationId,
    testId: p.testId,
    version,
    options: p.options,
    result: p.run.result,
    series: p.run.series,
    reason: p.reason,
    createdById: p.createdById,
  });
  await updateTestCurrentAnalysis(tx, { organizationId: p.organizationId, testId: p.testId, analysisId: saved.id, verdict: p.run.result.verdict });
  return { analysis: p.run.result, version, analysisId: saved.id };
}
