"use client";

import { useId, useState, useSyncExternalStore } from "react";

export const MAX_UPLOAD_BYTES = 64 * 1024 * 1024;

interface Props {
  onFile: (file: File) => void;
  disabled?: boolean;
}

/** Pick the gauge's CSV with the phone's file picker, or drop it here on a desktop. */
const noSubscription = () => () => {};

export function DropZone({ onFile, disabled }: Props) {
  const id = useId();
  // False in the server's HTML and until the page is live (hydrated): a file picked before then
  // would reach no handler and be lost, so the picker waits (slow phones on a poor line).
  const live = useSyncExternalStore(noSubscription, () => true, () => false);
  const [over, setOver] = useState(false);
  return (
    <div
      data-testid="drop-zone"
      onDragOver={(e) => {
        e.preventDefault();
        if (!disabled) setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={(e) => {
        e.preventDefault();
        setOver(false);
        const f = e.dataTransfer.files?.[0];
        if (f && !disabled && live) onFile(f);
      }}
      className={`flex flex-col items-center gap-3 rounded-card border-2 border-dashed px-4 py-8 text-center transition-colors ${
        over ? "border-tide-500 bg-tide-50 dark:bg-tide-900" : "border-surface-line bg-surface-raised"
      }`}
    >
      <svg aria-hidden="true" width="44" height="44" viewBox="0 0 32 32" fill="none" className="text-tide-600 dark:text-tide-300">
        <path d="M9 4h10l6 6v18H9z" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />
        <path d="M19 4v6h6" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />
        <path d="M12 23c2-6 3-8 5-8s2 3 4 3" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
      </svg>
      <input
        id={id}
        type="file"
        accept=".csv,text/csv,text/plain"
        aria-label="Gauge log file (CSV)"
        className="peer sr-only"
        disabled={disabled || !live}
        onChange={(e) => {
          const f = e.target.files?.[0];
          e.target.value = "";
          if (f) onFile(f);
        }}
      />
      <label
        htmlFor={id}
        className="inline-flex min-h-14 w-full max-w-sm cursor-pointer items-center justify-center gap-2 rounded-xl bg-tide-600 px-6 text-lead font-semibold text-white hover:bg-tide-700 peer-focus-visible:outline peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-flare-500 peer-disabled:opacity-55 dark:bg-tide-500 dark:text-tide-900"
      >
        Choose the gauge’s CSV
      </label>
      <p className="text-body text-fg-soft">
        <span className="hidden sm:inline">or drop the file here · </span>CSV or text export, up to 64 MB
      </p>
    </div>
  );
}
