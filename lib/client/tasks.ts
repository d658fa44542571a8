/**
 * The browser's side of followed background tasks (a large log being analysed, a profile's
 * re-check): the task as GET /api/tasks/:id answers it, and a TanStack Query that polls it
 * until it is done or failed.
 */
import { useQuery } from "@tanstack/react-query";
import { apiFetch, type CreatedTest } from "./api";

export interface TaskProgress {
  id: string;
  kind: "log_analysis" | "bulk_reanalysis";
  state: "queued" | "running" | "done" | "failed";
  stage: "queued" | "reading" | "analysing" | "saving" | "done" | "failed";
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

/** POST /api/vacuum-tests answers a new test, or (a large log) the task that will make it. */
export type UploadAnswer = CreatedTest | { task: TaskProgress };

export const taskKeys = { one: (id: string) => ["task", id] as const };

export function getTask(id: string, signal?: AbortSignal): Promise<{ task: TaskProgress }> {
  return apiFetch<{ task: TaskProgress }>(`/api/tasks/${encodeURIComponent(id)}`, {}, { signal });
}

const finished = (t: TaskProgress | undefined) => t?.state === "done" || t?.state === "failed";

/** The task, refreshed every second until it is done or failed. */
export function useTask(id: string | null) {
  return useQuery({
    queryKey: taskKeys.one(id ?? ""),
    queryFn: ({ signal }) => getTask(id!, signal).then((r) => r.task),
    enabled: !!id,
    refetchInterval: (q) => (finished(q.state.data) ? false : 1000),
  });
}

/** What a task is doing, in words. */
export const STAGE_WORDS: Record<TaskProgress["stage"], string> = {
  queued: "Waiting for a free analysis worker…",
  reading: "Reading the log…",
  analysing: "Analysing…",
  saving: "Saving the test…",
  done: "Done.",
  failed: "Stopped.",
};
