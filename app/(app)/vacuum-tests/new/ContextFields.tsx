"use client";

import { useState } from "react";
import dynamic from "next/dynamic";
import type { TestContext } from "./context";

const ContextForm = dynamic(() => import("./ContextForm").then((m) => m.ContextForm), {
  loading: () => (
    <p className="px-4 py-4 text-fg-soft" role="status">
      Loading…
    </p>
  ),
});

interface Props {
  value: TestContext;
  onChange: (next: TestContext) => void;
  canCreateJob: boolean;
}

/** Optional context, collapsed by default; the fields (and the shop's lists) load when opened. */
export function ContextFields({ value, onChange, canCreateJob }: Props) {
  const [open, setOpen] = useState(false);
  return (
    <details
      className="group rounded-card border border-surface-line bg-surface-raised"
      onToggle={(e) => setOpen((e.target as HTMLDetailsElement).open)}
    >
      <summary className="flex min-h-tap cursor-pointer list-none items-center justify-between gap-3 px-4 py-3 text-body font-semibold">
        <span>
          Add job, site and system <span className="font-normal text-fg-soft">(optional)</span>
        </span>
        <span aria-hidden="true" className="text-title transition-transform group-open:rotate-180">⌄</span>
      </summary>
      {open && <ContextForm value={value} onChange={onChange} canCreateJob={canCreateJob} />}
    </details>
  );
}
