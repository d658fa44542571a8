/**
 * Re-analysis: re-read the raw file from storage (never modified), run the engine with the
 * test's earlier options plus the caller's overrides, store version n + 1 and point the test at it.
 * With an Idempotency-Key, a retry of the same request answers with the version it made (never a
 * second one), and the key with other overrides is a 422 (lib/vacuum-tests/idempotency.ts).
 */
import type { AnalysisResult, AnalyzeOptions } from "@/analysis/decay/types";
import type { Database, Tx } from "@/db/client";
import type { EngineRun } from "./engine";
import { getAnalysisById, saveNewAnalysis as writeNewAnalysis } from "@/db/queries/analyses";
import { getIdempotencyKeyByKey, getUploadByTest, insertIdempotencyKey } from "@/db/queries/vacuum-tests";
import type { Viewer } from "@/db/queries/visibility";
import { AppError } from "@/lib/errors";
import { allows } from "@/lib/permissions";
import { describeError, log } from "@/lib/log";
import { randomUUID } from "node:crypto";
import { assertSameRequest, requestFingerprint, type SpentKey } from "./idempotency";
import { getObjectBytes } from "@/lib/storage";
import { analyseLog } from "@/lib/engine/door";
import { decodeLogText } from "./files";
import { compactOptions, importOptionsOf, resolveProfile } from "./options";
import { requireRevealedTest } from "./read";
import type { ReanalysisInput } from "./schemas";

/** The policy "vacuumTest.reanalyse" (lib/permissions.ts): owners and leads re-analyse any test they see; everyone else only their own. */
export function mayReanalyse(viewer: Viewer, createdById: string): boolean {
  return allows(viewer, "vacuumTest.reanalyse", { createdById });
}

export interface ReanalysisOutcome {
  analysis: AnalysisResult;
  version: number;
  analysisId: string;
  /** False when a retried Idempotency-Key answers with the version it made before. */
  created: boolean;
}

class KeyTaken extends Error {}

/** The version an earlier request with this key made, when it was the same request (422 otherwise). */
async function replay(db: Database, org: string, testId: string, spent: SpentKey, fingerprint: string): Promise<ReanalysisOutcome> {
  assertSameRequest(spent, fingerprint);
  const earlier = spent.analysisId && spent.testId === testId ? await getAnalysisById(db, { organizationId: org, analysisId: spent.analysisId }) : null;
  if (!earlier) throw new AppError("idempotency_mismatch", "Idempotency-Key: you already used this key for another request; send a new key.", { field: "Idempotency-Key" });
  return { analysis: earlier.result, version: earlier.version, analysisId: earlier.id, created: false };
}

export async function reanalyseTest(
  db: Database,
  viewer: Viewer,
  testId: string,
  input: ReanalysisInput,
  idempotencyKey?: string,
): Promise<ReanalysisOutcome> {
  const row = await requireRevealedTest(db, viewer, testId);
  if (!mayReanalyse(viewer, row.test.createdById))
    throw new AppError("forbidden", "Only the technician who uploaded this test, a lead or the owner can re-analyse it.");
  const org = viewer.organizationId;
  const fingerprint = requestFingerprint("POST /api/tests/:id/analyses", { testId, input });
  const keyOf = { organizationId: org, userId: viewer.userId, key: idempotencyKey ?? "" };
  if (idempotencyKey) {
    const spent = await getIdempotencyKeyByKey(db, keyOf);
    if (spent) return replay(db, org, testId, spent, fingerprint);
  }
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

  const run = await analyseLog(await readStoredLogText(upload.objectKey), options); // LogError → 422 naming the option

  const analysisId = randomUUID();
  const saving = db.transaction(async (tx) => {
    const saved = await saveNewAnalysis(tx, { id: analysisId, organizationId: org, testId, options, run, reason: input.reason ?? null, createdById: viewer.userId }, async () => {
      // A concurrent twin with the same key waits on this row, then finds it taken and rolls back.
      if (idempotencyKey && !(await insertIdempotencyKey(tx, { ...keyOf, testId, analysisId, requestFingerprint: fingerprint }))) throw new KeyTaken();
    });
    return { ...saved, created: true };
  });
  return saving.catch(async (err: unknown) => {
    if (!(err instanceof KeyTaken)) throw err;
    const spent = await getIdempotencyKeyByKey(db, keyOf);
    if (!spent) throw new AppError("conflict", "The same re-analysis is being saved by another request; try again.");
    return replay(db, org, testId, spent, fingerprint);
  });
}

/** The stored raw log's text; storage away → 503 and nothing changes. */
export async function readStoredLogText(objectKey: string): Promise<string> {
  let bytes: Uint8Array;
  try {
    bytes = await getObjectBytes(objectKey);
  } catch (err) {
    log.error("raw log not readable", { objectKey, err: describeError(err) });
    throw new AppError("storage_unavailable", "File storage is not answering; the analysis was not changed. Please try again.");
  }
  return decodeLogText(bytes);
}

/**
 * Inside a transaction: store a run as the test's next analysis version and make it current,
 * through the one writer (saveNewAnalysis, db/queries/analyses.ts); 404 when the test is gone.
 */
export async function saveNewAnalysis(
  tx: Tx,
  p: { id?: string; organizationId: string; testId: string; options: AnalyzeOptions; run: EngineRun; reason: string | null; createdById: string },
  beforeCurrent?: () => Promise<void>,
): Promise<{ analysis: AnalysisResult; version: number; analysisId: string }> {
  const { run, ...rest } = p;
  const saved = await writeNewAnalysis(tx, { ...rest, result: run.result, series: run.series }, beforeCurrent);
  if (!saved) throw new AppError("not_found", "No such test.");
  return { analysis: run.result, ...saved };
}
