/**
 * Re-analysis: re-read the raw file from storage (never modified), run the engine with the
 * test's earlier options plus the caller's overrides, store version n + 1 and point the test at it.
 */
import type { AnalysisResult, AnalyzeOptions } from "@/analysis/types";
import type { Database } from "@/db/client";
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

  let bytes: Uint8Array;
  try {
    bytes = await getObjectBytes(upload.objectKey);
  } catch (err) {
    log.error("raw log not readable", { objectKey: upload.objectKey, err: String(err) });
    throw new AppError("storage_unavailable", "File storage is not answering; the analysis was not changed. Please try again.");
  }
  const run = await analyseOffThread(decodeLogText(bytes), options); // LogError → 422 naming the option

  return db.transaction(async (tx) => {
    if (!(await lockTestById(tx, { organizationId: org, testId }))) throw new AppError("not_found", "No such test.");
    const version = await getNextAnalysisVersionByTest(tx, { organizationId: org, testId });
    const saved = await insertAnalysis(tx, {
      organizationId: org,
      testId,
      version,
      options,
      result: run.result,
      series: run.series,
      reason: input.reason ?? null,
      createdById: viewer.userId,
    });
    await updateTestCurrentAnalysis(tx, { organizationId: org, testId, analysisId: saved.id, verdict: run.result.verdict });
    return { analysis: run.result, version, analysisId: saved.id };
  });
}
