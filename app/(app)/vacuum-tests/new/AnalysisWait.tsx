"use client";

import { useEffect, useRef } from "react";
import { ApiError, getTest, type CreatedTest } from "@/lib/client/api";
import { STAGE_WORDS, useTask, type TaskProgress } from "@/lib/client/tasks";

/**
 * A large log is analysed by a queued job: follow its task (polled through TanStack Query) and
 * hand back the test once it is made, or the importer's error as an upload would have given it.
 */
export function AnalysisWait({ task, filename, onDone, onError }: { task: TaskProgress; filename: string; onDone: (c: CreatedTest) => void; onError: (e: unknown) => void }) {
  const q = useTask(task.id);
  const t = q.data ?? task;
  const handled = useRef(false);

  useEffect(() => {
    if (handled.current) return;
    if (t.state === "done" && t.testId) {
      handled.current = true;
      getTest(t.testId).then((d) => onDone({ test: d.test, analysis: d.analysis }), onError);
    } else if (t.state === "failed") {
      handled.current = true;
      onError(new ApiError(422, "invalid_file", t.error ?? "The log could not be read.", t.errorDetails ?? undefined));
    } else if (q.isError) {
      handled.current = true;
      onError(q.error);
    }
  }, [t, q.isError, q.error, onDone, onError]);

  return (
    <div className="space-y-2 rounded-card border border-surface-line bg-surface-raised p-4" role="status" aria-live="polite" data-testid="analysis-wait" data-stage={t.stage}>
      <p className="text-body font-medium">{filename} is a long log: {STAGE_WORDS[t.stage]}</p>
      <div className="h-3 overflow-hidden rounded-full bg-surface-sunken">
        <div className="h-full w-1/3 animate-pulse rounded-full bg-tide-600 dark:bg-tide-400" />
      </div>
      <p className="text-caption text-fg-soft">It is saved; you may leave this page and find the test in the list when it is ready.</p>
    </div>
  );
}
