import { and, eq, inArray, sql } from "drizzle-orm";
import { getTableConfig } from "drizzle-orm/pg-core";
import type { Db } from "@/db/client";
import { backgroundTasks, type TaskStage } from "@/db/schema";

export type TaskRow = typeof backgroundTasks.$inferSelect;
export type NewTask = typeof backgroundTasks.$inferInsert & { id: string; organizationId: string };

export async function insertTask(db: Db, params: NewTask): Promise<TaskRow> {
  const [row] = await db.insert(backgroundTasks).values(params).returning();
  return row;
}

/** The unique index on (organization, Idempotency-Key), as the schema names it. */
const taskKeyIndex = getTableConfig(backgroundTasks).indexes.find((i) => i.config.unique)!.config.name;

/** The error of insertTask when another request already holds its Idempotency-Key. */
export function isTaskKeyTaken(err: unknown): boolean {
  for (let e = err as { code?: string; constraint?: string; cause?: unknown } | undefined; e; e = e.cause as typeof e) {
    if (e.code === "23505" && e.constraint === taskKeyIndex) return true;
  }
  return false;
}

export async function getTaskById(db: Db, params: { organizationId: string; taskId: string }): Promise<TaskRow | null> {
  const [row] = await db
    .select()
    .from(backgroundTasks)
    .where(and(eq(backgroundTasks.organizationId, params.organizationId), eq(backgroundTasks.id, params.taskId)))
    .limit(1);
  return row ?? null;
}

/** Lock a task for the job working on it (inside its transaction). */
export async function lockTaskById(db: Db, params: { organizationId: string; taskId: string }): Promise<TaskRow | null> {
  const [row] = await db
    .select()
    .from(backgroundTasks)
    .where(and(eq(backgroundTasks.organizationId, params.organizationId), eq(backgroundTasks.id, params.taskId)))
    .for("update");
  return row ?? null;
}

export async function getTaskByIdempotencyKey(db: Db, params: { organizationId: string; userId: string; key: string }): Promise<TaskRow | null> {
  const [row] = await db
    .select()
    .from(backgroundTasks)
    .where(
      and(eq(backgroundTasks.organizationId, params.organizationId), eq(backgroundTasks.requestedById, params.userId), eq(backgroundTasks.idempotencyKey, params.key)),
    )
    .limit(1);
  return row ?? null;
}

/** Progress: the stage, and optionally items done (and failed) since the last call, a cursor. */
export async function updateTaskProgressById(
  db: Db,
  params: { organizationId: string; taskId: string; stage: TaskStage; addDone?: number; addFailed?: number; cursor?: string | null; total?: number },
): Promise<void> {
  await db
    .update(backgroundTasks)
    .set({
      state: "running",
      stage: params.stage,
      done: sql`${backgroundTasks.done} + ${params.addDone ?? 0}`,
      failedItems: sql`${backgroundTasks.failedItems} + ${params.addFailed ?? 0}`,
      ...(params.cursor !== undefined ? { cursor: params.cursor } : {}),
      ...(params.total !== undefined ? { total: params.total } : {}),
      updatedAt: new Date(),
    })
    .where(and(eq(backgroundTasks.organizationId, params.organizationId), eq(backgroundTasks.id, params.taskId)));
}

export async function finishTaskById(
  db: Db,
  params: { organizationId: string; taskId: string; testId?: string | null; error?: string; errorDetails?: unknown },
): Promise<void> {
  const failed = params.error !== undefined;
  await db
    .update(backgroundTasks)
    .set({
      state: failed ? "failed" : "done",
      stage: failed ? "failed" : "done",
      ...(params.testId !== undefined ? { testId: params.testId } : {}),
      ...(failed ? { error: params.error, errorDetails: params.errorDetails ?? null } : { done: sql`greatest(${backgroundTasks.done}, ${backgroundTasks.total})` }),
      // The stored file is a test's now (or was deleted): the sweeper need not keep it for the task.
      objectKey: null,
      updatedAt: new Date(),
      finishedAt: new Date(),
    })
    .where(and(eq(backgroundTasks.organizationId, params.organizationId), eq(backgroundTasks.id, params.taskId)));
}

/** Of these storage keys of one organization, the ones a queued or running task still needs. */
export async function listObjectKeysOfOpenTasksByOrganization(db: Db, params: { organizationId: string; keys: string[] }): Promise<Set<string>> {
  if (!params.keys.length) return new Set();
  const rows = await db
    .select({ key: backgroundTasks.objectKey })
    .from(backgroundTasks)
    .where(
      and(
        eq(backgroundTasks.organizationId, params.organizationId),
        inArray(backgroundTasks.state, ["queued", "running"]),
        inArray(backgroundTasks.objectKey, params.keys),
      ),
    );
  return new Set(rows.map((r) => r.key!).filter(Boolean));
}
