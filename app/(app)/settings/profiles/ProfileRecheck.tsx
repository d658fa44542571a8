"use client";

import { useEffect, useState } from "react";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { Alert, Button } from "@/components/ui";
import { apiFetch } from "@/lib/client/api";
import { useTask, type TaskProgress } from "@/lib/client/tasks";

/**
 * "Re-check its tests": every test judged by this profile (or by its name before the last rename)
 * gets a new analysis with the profile's numbers of now, as background jobs; the bar follows the task.
 */
export function ProfileRecheck({ profileId, previousName }: { profileId: string; previousName?: string }) {
  const qc = useQueryClient();
  const [taskId, setTaskId] = useState<string | null>(null);
  const start = useMutation({
    mutationFn: () =>
      apiFetch<{ task: TaskProgress | null }>(`/api/settings/profiles/${profileId}/reanalysis`, { method: "POST", body: JSON.stringify(previousName ? { previousName } : {}) }),
    onSuccess: (r) => setTaskId(r.task?.id ?? null),
  });
  const task = useTask(taskId);
  const t = task.data ?? start.data?.task ?? null;
  const running = !!t && (t.state === "queued" || t.state === "running");
  const doneNow = t?.state === "done";
  useEffect(() => {
    if (doneNow) void qc.invalidateQueries({ queryKey: ["tests"] });
  }, [doneNow, qc]);

  return (
    <div className="mt-3 space-y-2" data-testid="profile-recheck">
      <Button variant="quiet" busy={start.isPending || running} disabled={running} onClick={() => start.mutate()}>
        Re-check its tests
      </Button>
      {start.isSuccess && !start.data.task && <p className="text-caption text-fg-soft">No test was judged by this profile yet.</p>}
      {t && (
        <div role="status" aria-live="polite" className="space-y-1">
          <div className="h-2 overflow-hidden rounded-full bg-surface-sunken">
            <div className="h-full rounded-full bg-tide-600 transition-[width] dark:bg-tide-400" style={{ width: `${Math.max(4, Math.round((100 * Math.min(t.done, t.total)) / Math.max(1, t.total)))}%` }} />
          </div>
          <p className="text-caption text-fg-soft">
            {t.state === "done"
              ? `Re-checked ${t.done} test${t.done === 1 ? "" : "s"}${t.failedItems ? `; ${t.failedItems} could not be read again` : ""}. Each keeps its earlier analysis in its history.`
              : t.state === "failed"
                ? t.error
                : `Re-checking: ${Math.min(t.done, t.total)} of ${t.total} done…`}
          </p>
        </div>
      )}
      {start.isError && <Alert tone="error">{(start.error as Error).message}</Alert>}
    </div>
  );
}
