/**
 * A followed background task as the page sees it (GET /api/tasks/:id): what it is doing, how far
 * it got, the test it made or why it failed. Never its input (that holds the upload's metadata).
 */
import type { Db } from "@/db/client";
import { getTaskById, type TaskRow } from "@/db/queries/tasks";
import type { Actor } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/permissions";

export interface TaskDto {
  id: string;
  kind: TaskRow["kind"];
  state: TaskRow["state"];
  stage: TaskRow["stage"];
  total: number;
  done: number;
  failedItems: number;
  testId: string | null;
  error: string | null;
  errorDetails: Record<string, unknown> | null;
  createdAt: string;
  updatedAt: string;
  finishedAt: string | null;
}

export function taskDto(t: TaskRow): TaskDto {
  return {
    id: t.id,
    kind: t.kind,
    state: t.state,
    stage: t.stage,
    total: t.total,
    done: t.done,
    failedItems: t.failedItems,
    testId: t.testId,
    error: t.error,
    errorDetails: (t.errorDetails as Record<string, unknown> | null) ?? null,
    createdAt: t.createdAt.toISOString(),
    updatedAt: t.updatedAt.toISOString(),
    finishedAt: t.finishedAt?.toISOString() ?? null,
  };
}

/** The task, for the member who started it or one who sees every test of the shop; 404 otherwise. */
export async function requireVisibleTask(db: Db, actor: Actor, taskId: string): Promise<TaskRow> {
  const task = await getTaskById(db, { organizationId: actor.organizationId, taskId });
  if (!task || (task.requestedById !== actor.userId && !can(actor.role, "tests.read_all"))) throw new AppError("not_found", "No such task.");
  return task;
}
