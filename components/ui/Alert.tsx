import type { ReactNode } from "react";
import { cx } from "./cx";

export type AlertTone = "info" | "success" | "warning" | "error";

const tones: Record<AlertTone, { box: string; mark: string }> = {
  info: { box: "border-tide-600 bg-tide-50 dark:bg-tide-900 dark:border-tide-400", mark: "i" },
  success: { box: "border-verdict-pass bg-surface-raised", mark: "✓" },
  warning: { box: "border-flare-500 bg-flare-100 dark:bg-surface-raised", mark: "!" },
  error: { box: "border-verdict-leak bg-surface-raised", mark: "×" },
};

const markColour: Record<AlertTone, string> = {
  info: "bg-tide-600 text-white",
  success: "bg-verdict-pass text-white",
  warning: "bg-flare-500 text-ink",
  error: "bg-verdict-leak text-white",
};

/**
 * A message in the page flow. Errors are announced at once (role="alert"), others politely (role="status").
 */
export function Alert({ tone = "info", title, children, className, action }: { tone?: AlertTone; title?: ReactNode; children?: ReactNode; className?: string; action?: ReactNode }) {
  return (
    <div role={tone === "error" ? "alert" : "status"} className={cx("flex gap-3 rounded-xl border-l-4 border px-4 py-3 text-fg", tones[tone].box, className)}>
      <span aria-hidden className={cx("mt-0.5 inline-flex h-6 w-6 shrink-0 items-center justify-center rounded-full text-caption font-semibold", markColour[tone])}>
        {tones[tone].mark}
      </span>
      <div className="min-w-0 flex-1">
        {title && <p className="font-semibold">{title}</p>}
        {children && <div className="text-body text-fg">{children}</div>}
        {action && <div className="mt-2">{action}</div>}
      </div>
    </div>
  );
}

/** Same as Alert; the name reads better for non-problems ("Invitation sent"). */
export const Notice = Alert;
