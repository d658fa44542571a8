import type { ReactNode } from "react";
import { cx } from "./cx";

export type BadgeTone = "neutral" | "brand" | "attention" | "pass" | "leak" | "moisture" | "both" | "unsure";

const tones: Record<BadgeTone, string> = {
  neutral: "bg-surface-sunken text-fg border-surface-line",
  brand: "bg-tide-50 text-tide-800 border-tide-200 dark:bg-tide-900 dark:text-tide-100 dark:border-tide-700",
  attention: "bg-flare-100 text-ink border-flare-300 dark:bg-flare-700 dark:text-white dark:border-flare-500",
  pass: "bg-verdict-pass text-white border-verdict-pass",
  leak: "bg-verdict-leak text-white border-verdict-leak",
  moisture: "bg-verdict-moisture text-white border-verdict-moisture",
  both: "bg-verdict-both text-white border-verdict-both",
  unsure: "bg-verdict-unsure text-white border-verdict-unsure",
};

/** A short label (role, status, verdict). Verdict tones are solid; always put words inside, never colour alone. */
export function Badge({ tone = "neutral", icon, children, className }: { tone?: BadgeTone; icon?: ReactNode; children: ReactNode; className?: string }) {
  return (
    <span className={cx("inline-flex items-center gap-1 rounded-full border px-2.5 py-0.5 text-caption font-medium whitespace-nowrap", tones[tone], className)}>
      {icon && <span aria-hidden>{icon}</span>}
      {children}
    </span>
  );
}
