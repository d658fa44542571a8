/**
 * A large log (over ANALYSIS_JOB_MIN_KB) is analysed by a queued job, not by the server that
 * received it: a 30 MB log must not hold one server's engine for seconds, nor be lost with that
 * server, and any server or worker may take it.
 *
 *  - The request stores the raw file and, in one transaction, a task (background_tasks) and its
 *    job; it answers 202 with the task, which the page follows (GET /api/tasks/:id). A storage
 *    failure is a 503 with nothing written; a failed transaction deletes the file again.
 *  - The Idempotency-Key is the task's too: a retry answers with the same task, and two identical
 *    requests race on the task's unique key (the loser deletes its file).
 *  - The job reads the file, analyses it on an engine worker (progress: reading → analysing →
 *    saving) and commits the test with commitNewTest (./upload.ts) in the same transaction that
 *    marks the task done, so a retried job never makes a second test. An unreadable log ends the
 *    task "failed" with the importer's words and deletes the file.
 */
import { randomUUID } from "node:crypto";
import { LogError } from "@/analysis/shared/errors";
import type { AnalyzeOptions } from "@/analysis/decay/types";
import type { Database } from "@/db/client";
import { finishTaskById, getTaskByIdempotencyKey, getTaskById, insertTask, isTaskKeyTaken, lockTaskById, updateTaskProgressById, type TaskRow } from "@/db/queries/tasks";
import { AppError } from "@/lib/errors";
import { sendJob } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";
import { log } from "@/lib/log";
import { deleteObject, getObjectBytes, rawLogKey } from "@/lib/storage";
import { analyseLog } from "@/lib/engine/door";
import { decodeLogText } from "./files";
import { assertSameRequest } from "./idempotency";
import { KeyTaken, storeThenCommit } from "./stored-commit";
import { commitNewTest, type StoredLog, type Uploader, type UploadInput, type UploadOutcome } from "./upload";

/** What the job needs, kept in the task. */
interface LogTaskInput {
  testId: string;
  analysisId: string;
  log: StoredLog;
  options: AnalyzeOptions;
  who: Uploader;
}

export interface LogJobData {
  organizationId: string;
  taskId: string;
}

/** A retried request for a log already queued: the same task (and its test once made); the key with another request is a 422. */
export function queuedReplayOf(task: TaskRow, fingerprint: string): UploadOutcome {
  const input = task.input as LogTaskInput;
  assertSameRequest({ testId: input.testId, analysisId: null, requestFingerprint: input.log.fingerprint ?? null }, fingerprint);
  return { testId: input.testId, created: false, task };
}

/** Store the log and queue its analysis; the outcome carries the task to follow. */
export async function queueLogAnalysis(
  db: Database,
  who: Uploader,
  input: UploadInput,
  options: AnalyzeOptions,
  req: { sha256: string; fingerprint: string },
): Promise<UploadOutcome> {
  const org = who.organizationId;
  const testId = randomUUID();
  const objectKey = rawLogKey(org, testId, input.filename);
  const { sha256, fingerprint } = req;
  const stored: StoredLog = {
    metadata: input.metadata, source: input.source, filename: input.filename, contentType: input.contentType,
    sizeBytes: input.bytes.byteLength, sha256, objectKey, idempotencyKey: input.idempotencyKey, fingerprint,
  };
  const taskInput: LogTaskInput = { testId, analysisId: randomUUID(), log: stored, options, who: { organizationId: org, userId: who.userId, role: who.role, name: who.name } };
  return storeThenCommit<UploadOutcome>(
    db,
    { key: objectKey, bytes: input.bytes, filename: input.filename, sha256 },
    "raw log",
    async (tx) => {
      const task = await insertTask(tx, {
        id: randomUUID(), organizationId: org, requestedById: who.userId, kind: "log_analysis", input: taskInput, objectKey, idempotencyKey: input.idempotencyKey ?? null,
      }).catch((err: unknown) => {
        throw isTaskKeyTaken(err) ? new KeyTaken() : err;
      });
      await sendJob(tx, QUEUES.logAnalysis.name, { organizationId: org, taskId: task.id } satisfies LogJobData);
      return { testId, created: true, task };
    },
    async () => {
      const seen = await getTaskByIdempotencyKey(db, { organizationId: org, userId: who.userId, key: input.idempotencyKey! });
      if (seen) return queuedReplayOf(seen, fingerprint);
      throw new AppError("conflict", "The same upload is being saved by another request; try again.");
    },
    input.signal,
  );
}

async function failTask(db: Database, task: TaskRow, error: string, details?: unknown): Promise<void> {
  await finishTaskById(db, { organizationId: task.organizationId, taskId: task.id, error, errorDetails: details });
  if (task.objectKey) await deleteObject(task.objectKey).catch((err) => log.warn("raw file of a failed task left for the sweeper", { objectKey: task.objectKey, err: String(err) }));
}

/** The job. Throws only for what a retry may cure (storage or the database away). */
export async function runLogAnalysisJob(db: Database, data: LogJobData): Promise<void> {
  const task = await getTaskById(db, { organizationId: data.organizationId, taskId: data.taskId });
  if (!task || task.state === "done" || task.state === "failed" || !task.objectKey) return;
  const input = task.input as LogTaskInput;
  const progress = (stage: "reading" | "analysing" | "saving") => updateTaskProgressById(db, { organizationId: task.organizationId, taskId: task.id, stage });

  await progress("reading");
  const text = decodeLogText(await getObjectBytes(task.objectKey));
  await progress("analysing");
  let run;
  try {
    run = await analyseLog(text, input.options, { background: true });
  } catch (err) {
    if (err instanceof LogError) return failTask(db, task, err.message, { reason: err.code, line: err.line, column: err.column });
    throw err;
  }
  await progress("saving");
  try {
    await db.transaction(async (tx) => {
      const locked = await lockTaskById(tx, { organizationId: task.organizationId, taskId: task.id });
      if (!locked || locked.state === "done" || locked.state === "failed") return;
      await commitNewTest(tx, input.who, input.log, { testId: input.testId, analysisId: input.analysisId, options: input.options, run });
      await finishTaskById(tx, { organizationId: task.organizationId, taskId: task.id, testId: input.testId });
    });
  } catch (err) {
    // A record named by the upload went away meanwhile, say: the log cannot become a test.
    if (err instanceof AppError && err.status < 500) return failTask(db, task, err.message, err.details);
    if (err instanceof KeyTaken) return failTask(db, task, "Idempotency-Key: this key was already used for another test.");
    throw err;
  }
}
