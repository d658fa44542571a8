"use client";

import { useState } from "react";
import { Button } from "@/components/ui";
import { VISIT_REASONS, type TestContext } from "./context";

interface Props {
  value: TestContext;
  onChange: (next: TestContext) => void;
  technicianName: string;
}

function whereWords(ctx: TestContext): string {
  const site = ctx.siteName.trim();
  const system = ctx.systemName.trim();
  if (!site) return "";
  return ` at ${site}${system ? `, ${system}` : ""}`;
}

/**
 * A new visit (job) in two taps: "New visit" shows the reasons, a reason confirms. The job is
 * made by the server together with the test (today, this technician, the site and system of
 * the form), so nothing is created until the log is sent.
 */
export function NewVisit({ value, onChange, technicianName }: Props) {
  const [choosing, setChoosing] = useState(false);
  if (value.isPractice || value.jobId) return null;

  if (value.newJob)
    return (
      <div className="flex items-center justify-between gap-3 rounded-card border border-tide-600 bg-surface-raised px-4 py-2 dark:border-tide-300" data-testid="new-visit">
        <p className="text-body" role="status">
          <span className="font-semibold">New visit today</span>
          {value.newJobReason ? ` — ${value.newJobReason}` : ""} · {technicianName}
          {whereWords(value)}. <span className="text-fg-soft">Made with this test.</span>
        </p>
        <Button variant="quiet" onClick={() => onChange({ ...value, newJob: false, newJobReason: "" })}>
          Remove
        </Button>
      </div>
    );

  if (!choosing)
    return (
      <div data-testid="new-visit">
        <Button variant="secondary" block onClick={() => setChoosing(true)}>
          New visit
        </Button>
      </div>
    );

  return (
    <fieldset className="space-y-2 rounded-card border border-surface-line bg-surface-raised px-4 py-3" data-testid="new-visit">
      <legend className="px-1 text-body font-semibold">Why the visit?</legend>
      <p className="text-caption text-fg-soft">
        Today · {technicianName}
        {whereWords(value)}
      </p>
      <div className="flex flex-wrap gap-2">
        {VISIT_REASONS.map((r) => (
          <Button
            key={r}
            variant="secondary"
            className="rounded-full"
            onClick={() => {
              setChoosing(false);
              onChange({ ...value, newJob: true, newJobReason: r, jobId: "" });
            }}
          >
            {r}
          </Button>
        ))}
        <Button variant="quiet" onClick={() => setChoosing(false)}>
          Cancel
        </Button>
      </div>
    </fieldset>
  );
}
