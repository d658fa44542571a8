/**
 * A re-test on a sent-back test: the technician uploads the new gauge log onto the same test.
 * Same pipeline as the first upload (lib/vacuum-tests/upload.ts): analyse in memory → store the raw
 * file → one transaction, with the same compensation (storeThenCommit, lib/vacuum-tests/stored-commit.ts):
 *
 *  - An unreadable log throws LogError before anything is stored (422; the test stays sent back).
 *  - Storage failing → 503, no rows written.
 *  - The transaction failing → the stored object is deleted again, 503.
 *  - In the transaction: the new upload row, analysis version n + 1 made current (earlier versions
 *    stay in the history), sent_back → waiting_review, the audit event "retest_uploaded" and the
 *    leads' e-mail in the outbox with its delivery job.
 *  - An Idempotency-Key the same person already used for this same re-test answers with the same
 *    analysis; used for a different request it is a 422 (lib/vacuum-tests/idempotency.ts); two identical
 *    concurrent requests race on the idempotency_keys primary key, the loser rolls back and
 *    deletes its object.
 *
 * The new log is read with the test's profile, volume and ambient, but not the first file's
 * column choices, isolation or hold window: those described the old file.
 */
import { randomUUID } from "node:crypto";
import type { AnalysisResult, AnalyzeOptions } from "@/analysis/decay/types";
import type { Database, Tx } from "@/db/client";
import { getAnalysisById, saveNewAnalysis } from "@/db/queries/analyses";
import { insertTestEvent, listReviewerEmailsByOrganization, lockTestReviewStateById, updateTestStatusById } from "@/db/queries/review";
import { getIdempotencyKeyByKey, insertIdempotencyKey, insertUpload, updateIdempotencyKeyAnalysis } from "@/db/queries/vacuum-tests";
import type { TestStatus } from "@/db/schema";
import type { Actor } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { retestUploadedMail } from "@/lib/notify/messages";
import { queueMail } from "@/lib/notify/outbox";
import { allows } from "@/lib/permissions";
import { RAW_LOG_CONTENT_TYPE, rawLogKey } from "@/lib/storage";
import { analyseLog } from "@/lib/engine/door";
import { sha256Hex } from "@/lib/vacuum-tests/files";
import { assertSameRequest, requestFingerprint, type SpentKey } from "@/lib/vacuum-tests/idempotency";
import { KeyTaken, storeThenCommit } from "@/lib/vacuum-tests/stored-commit";
import { compactOptions, resolveProfile } from "@/lib/vacuum-tests/options";
import { requireVisibleTest } from "@/lib/vacuum-tests/read";
import type { ReceivedFile } from "@/lib/vacuum-tests/request";
import { checkTransition } from "./state";

export interface RetestInput {
  file: ReceivedFile;
  note?: string | null;
  idempotencyKey?: string;
  /** The request's signal: once it aborts (the client went away), nothing is committed. */
  signal?: AbortSignal;
}

export interface RetestOutcome {
  testId: string;
  status: TestStatus;
  analysisId: string;
  version: number;
  analysis: AnalysisResult;
  /** False when an earlier request with the same Idempotency-Key is answered again. */
  created: boolean;
  mailIds: string[];
}

type FaultHook = (tx: Tx, ctx: { testId: string; objectKey: string }) => Promise<void>;
let faultBeforeCommit: FaultHook | null = null;

/** Test seam: runs inside the re-test transaction just before it commits; a throw rolls it back. */
export function setRetestFaultForTests(hook: FaultHook | null): void {
  faultBeforeCommit = hook;
}

/** The policy "vacuumTest.retest" (lib/permissions.ts): the test's technician, or anyone who reviews (owner, lead). */
export function mayUploadRetest(actor: Pick<Actor, "userId" | "role">, createdById: string): boolean {
  return allows(actor, "vacuumTest.retest", { createdById });
}

/** Where a re-test's raw file lives: beside the test's first file, under its own id (never overwriting it). */
export function retestLogKey(organizationId: string, testId: string, retestId: string, filename: string): string {
  return rawLogKey(organizationId, `${testId}/retests/${retestId}`, filename);
}

async function optionsForRetest(db: Database, org: string, currentAnalysisId: string | null): Promise<AnalyzeOptions> {
  const current = currentAnalysisId ? await getAnalysisById(db, { organizationId: org, analysisId: currentAnalysisId }) : null;
  const base: AnalyzeOptions = current?.options ?? {};
  const profile = base.profile ?? (await resolveProfile(db, { organizationId: org }));
  return compactOptions({ profile, volume: base.volume, ambientC: base.ambientC });
}

/** The answer for a key already used: the same analysis, the test's status now. */
async function replay(db: Database, actor: Actor, testId: string, seen: SpentKey, fingerprint: string): Promise<RetestOutcome> {
  assertSameRequest(seen, fingerprint);
  if (seen.testId !== testId || !seen.analysisId)
    throw new AppError("idempotency_mismatch", "Idempotency-Key: you already used this key for another request; send a new key.", { field: "Idempotency-Key" });
  const [analysis, state] = await Promise.all([
    getAnalysisById(db, { organizationId: actor.organizationId, analysisId: seen.analysisId }),
    requireVisibleTest(db, actor, testId),
  ]);
  if (!analysis) throw new AppError("not_found", "No such analysis.");
  return { testId, status: state.test.status, analysisId: analysis.id, version: analysis.version, analysis: analysis.result, created: false, mailIds: [] };
}

/** Upload a re-test log onto a sent-back test and resubmit it. Throws LogError (422) or AppError. */
export async function uploadRetest(db: Database, actor: Actor, testId: string, input: RetestInput): Promise<RetestOutcome> {
  const org = actor.organizationId;
  const note = input.note?.trim() || null;
  const detail = await requireVisibleTest(db, actor, testId); // other organization or not visible → 404
  if (!mayUploadRetest(actor, detail.test.createdById))
    throw new AppError("forbidden", "Only the technician who made this test, a lead or the owner can upload its re-test.");
  const sha256 = sha256Hex(input.file.bytes);
  const fingerprint = requestFingerprint("POST /api/tests/:id/retests", { testId, sha256, filename: input.file.filename, note });
  const keyOf = { organizationId: org, userId: actor.userId, key: input.idempotencyKey ?? "" };
  if (input.idempotencyKey) {
    const seen = await getIdempotencyKeyByKey(db, keyOf);
    if (seen) return replay(db, actor, testId, seen, fingerprint);
  }
  const early = checkTransition(detail.test.status, "resubmit");
  if (!early.ok) throw new AppError("conflict", `${early.message} A re-test log goes onto a test that was sent back.`, { status: detail.test.status });

  const options = await optionsForRetest(db, org, detail.test.currentAnalysisId);
  const run = await analyseLog(input.file.text, options); // LogError → 422 before anything is stored

  const analysisId = randomUUID();
  const objectKey = retestLogKey(org, testId, randomUUID(), input.file.filename);
  const object = { key: objectKey, bytes: input.file.bytes, filename: input.file.filename, sha256 };

  const outcome = await storeThenCommit<RetestOutcome>(
    db,
    object,
    "re-test log",
    async (tx) => {
      const locked = await lockTestReviewStateById(tx, { organizationId: org, testId });
      if (!locked) throw new AppError("not_found", "No such test.");
      // The key first: a concurrent twin waits here for this row, then finds it taken.
      if (input.idempotencyKey) {
        const claimed = await insertIdempotencyKey(tx, { ...keyOf, testId, requestFingerprint: fingerprint });
        if (!claimed) throw new KeyTaken();
      }
      const check = checkTransition(locked.status, "resubmit");
      if (!check.ok) throw new AppError("conflict", check.message, { status: locked.status });
      await insertUpload(tx, {
        organizationId: org, testId, objectKey, sha256, sizeBytes: input.file.bytes.byteLength, filename: input.file.filename, contentType: RAW_LOG_CONTENT_TYPE,
      });
      const saved = await saveNewAnalysis(
        tx,
        { id: analysisId, organizationId: org, testId, options, result: run.result, series: run.series, reason: `Re-test: ${input.file.filename}`, createdById: actor.userId },
        async () => {
          if (input.idempotencyKey) await updateIdempotencyKeyAnalysis(tx, { ...keyOf, analysisId });
        },
      );
      if (!saved) throw new AppError("not_found", "No such test.");
      const { version } = saved;
      const moved = await updateTestStatusById(tx, { organizationId: org, testId, fromStatus: locked.status, toStatus: check.to });
      if (!moved) throw new AppError("conflict");
      await insertTestEvent(tx, {
        organizationId: org, testId, actorId: actor.userId, kind: "retest_uploaded", fromStatus: locked.status, toStatus: check.to,
        note: [`${input.file.filename} (analysis version ${version})`, note].filter(Boolean).join(" — "),
      });
      const summary = { id: testId, title: locked.title, verdict: run.result.verdict, meetsProfile: run.result.meetsProfile, technicianName: detail.createdByName, siteName: detail.siteName };
      const reviewers = (await listReviewerEmailsByOrganization(tx, { organizationId: org })).filter((e) => e !== actor.email);
      const mailIds = await queueMail(
        tx,
        reviewers.map((to) => ({ ...retestUploadedMail(to, summary, { by: actor.name, version, note }), organizationId: org, testId })),
      );
      if (faultBeforeCommit) await faultBeforeCommit(tx, { testId, objectKey });
      return { testId, status: check.to, analysisId, version, analysis: run.result, created: true, mailIds };
    },
    async () => {
      // Lost the race for the key: answer with the winner's re-test.
      const seen = await getIdempotencyKeyByKey(db, keyOf);
      if (seen) return replay(db, actor, testId, seen, fingerprint);
      throw new AppError("conflict", "The same re-test is being saved by another request; try again.");
    },
    input.signal,
  );
  return outcome;
}
