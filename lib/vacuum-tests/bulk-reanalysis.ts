/**
 * Re-checking every test of a profile after the profile was edited, as background jobs whose
 * progress the profiles page follows (GET /api/tasks/:id).
 *
 * An edit changes new analyses only (app/api/settings/profiles/[id]); a lead who wants the old
 * tests judged by the edited numbers asks for a re-check. It covers the shop's non-practice tests
 * whose current analysis used a profile of that name (practice tests keep the answer the
 * apprentice was set), or of its name before a rename. Each test gets a new analysis version with the profile's numbers of now
 * and its other options as they were; earlier versions stay in its history.
 *
 * The work goes in chunks of CHUNK tests, one job each: a chunk ends by queuing the next, so no
 * job runs longer than its expiry and any server or worker may take the next. Each test's new
 * analysis and the task's progress (count and cursor) commit together, so a job retried after a
 * crash carries on after the last test done, never doing one twice. A test whose log no longer
 * reads counts as done and failed.
 */
import { randomUUID } from "node:crypto";
import { LogError } from "@/analysis/shared/errors";
import type { AnalyzeOptions } from "@/analysis/decay/types";
import type { Database } from "@/db/client";
import { getAnalysisById } from "@/db/queries/analyses";
import { getProfileById } from "@/db/queries/profiles";
import { finishTaskById, getTaskById, insertTask, updateTaskProgressById, type TaskRow } from "@/db/queries/tasks";
import { countTestsByCurrentProfileName, getTestById, getUploadByTest, listTestIdsByCurrentProfileName } from "@/db/queries/vacuum-tests";
import type { Actor } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { sendJob } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";
import type { JobContext } from "@/lib/jobs/runner";
import { readStoredLogText, saveNewAnalysis } from "./analyse";
import { analyseLog } from "@/lib/engine/door";
import { compactOptions, resolveProfile } from "./options";

/** Tests per job. */
const CHUNK = 25;

interface BulkInput {
  profileId: string;
  /** The profile's name now, and before an edit that renamed it. */
  profileNames: string[];
}

export interface BulkJobData {
  organizationId: string;
  taskId: string;
}

/** Start a re-check of the profile's tests (by its name, or the name it had before a rename); null when no test used it. */
export async function startProfileReanalysis(db: Database, actor: Actor, params: { profileId: string; previousName?: string }): Promise<TaskRow | null> {
  const profile = await getProfileById(db, { organizationId: actor.organizationId, profileId: params.profileId });
  if (!profile) throw new AppError("not_found", "No such profile.");
  const profileNames = [...new Set([profile.name, ...(params.previousName ? [params.previousName] : [])])];
  const total = await countTestsByCurrentProfileName(db, { organizationId: actor.organizationId, profileNames });
  if (total === 0) return null;
  return db.transaction(async (tx) => {
    const task = await insertTask(tx, {
      id: randomUUID(), organizationId: actor.organizationId, requestedById: actor.userId, kind: "bulk_reanalysis", total,
      input: { profileId: params.profileId, profileNames } satisfies BulkInput,
    });
    await sendJob(tx, QUEUES.bulkReanalysis.name, { organizationId: actor.organizationId, taskId: task.id } satisfies BulkJobData);
    return task;
  });
}

/** Re-analyse one test with the profile; "failed" when its log no longer reads or is gone. */
async function recheckOne(db: Database, task: TaskRow, testId: string, profile: AnalyzeOptions["profile"]): Promise<void> {
  const org = task.organizationId;
  const progress = (failed: boolean) => (tx: Parameters<Parameters<Database["transaction"]>[0]>[0]) =>
    updateTaskProgressById(tx, { organizationId: org, taskId: task.id, stage: "analysing", addDone: 1, addFailed: failed ? 1 : 0, cursor: testId });
  const [detail, upload] = await Promise.all([
    getTestById(db, { viewer: { organizationId: org, userId: task.requestedById, role: "owner" }, testId }),
    getUploadByTest(db, { organizationId: org, testId }),
  ]);
  const current = detail?.test.currentAnalysisId ? await getAnalysisById(db, { organizationId: org, analysisId: detail.test.currentAnalysisId }) : null;
  if (!detail || !upload || !current) return db.transaction(progress(true));
  const options = compactOptions({ ...current.options, profile });
  let run;
  try {
    run = await analyseLog(await readStoredLogText(upload.objectKey), options, { background: true });
  } catch (err) {
    if (err instanceof LogError) return db.transaction(progress(true));
    throw err; // storage or an engine worker away: the job retries from this test
  }
  await db.transaction(async (tx) => {
    await saveNewAnalysis(tx, { organizationId: org, testId, options, run, reason: `Re-checked with the edited profile "${profile?.name}"`, createdById: task.requestedById });
    await progress(false)(tx);
  });
}

/** One chunk of the re-check; queues the next chunk, or marks the task done. */
export async function runBulkReanalysisJob(db: Database, data: BulkJobData, ctx: Pick<JobContext, "stopping">): Promise<void> {
  const task = await getTaskById(db, { organizationId: data.organizationId, taskId: data.taskId });
  if (!task || task.state === "done" || task.state === "failed") return;
  const input = task.input as BulkInput;
  let profile: AnalyzeOptions["profile"];
  try {
    profile = await resolveProfile(db, { organizationId: task.organizationId, profileId: input.profileId });
  } catch {
    return finishTaskById(db, { organizationId: task.organizationId, taskId: task.id, error: "The profile was deleted before every test was re-checked." });
  }
  const ids = await listTestIdsByCurrentProfileName(db, { organizationId: task.organizationId, profileNames: input.profileNames, afterId: task.cursor, limit: CHUNK });
  for (const testId of ids) {
    if (ctx.stopping()) break; // the next chunk starts from the cursor, on whichever runner is alive
    await recheckOne(db, task, testId, profile);
  }
  if (ids.length < CHUNK && !ctx.stopping()) return finishTaskById(db, { organizationId: task.organizationId, taskId: task.id });
  await sendJob(db, QUEUES.bulkReanalysis.name, data);
}
