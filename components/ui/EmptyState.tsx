import type { ReactNode } from "react";
import { cx } from "./cx";

/** What a list shows when it has nothing yet: a line of why, and the one thing to do next. */
export function EmptyState({ title, children, action, icon, className }: { title: ReactNode; children?: ReactNode; action?: ReactNode; icon?: ReactNode; className?: string }) {
  return (
    <div className={cx("flex flex-col items-center gap-3 rounded-card border-2 border-dashed border-surface-line px-6 py-10 text-center", className)}>
      <span aria-hidden className="text-fg-faint">
        {icon ?? (
          <svg width="40" height="40" viewBox="0 0 32 32" fill="none">
            <path d="M4 8 C8 20, 10 23, 13 23 S18 21, 28 11" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" strokeDasharray="3 4" />
          </svg>
        )}
      </span>
      <p className="text-lead font-semibold text-fg">{title}</p>
      {children && <div className="max-w-prose text-body text-fg-soft">{children}</div>}
      {action && <div className="mt-1">{action}</div>}
    </div>
  );
}
