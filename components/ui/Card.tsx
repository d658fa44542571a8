import type { HTMLAttributes, ReactNode } from "react";
import { cx } from "./cx";

export interface CardProps extends Omit<HTMLAttributes<HTMLElement>, "title"> {
  /** Heading shown at the top (an h2 unless `headingLevel` says otherwise). */
  title?: ReactNode;
  headingLevel?: 2 | 3;
  /** Controls shown at the right of the heading (a button, a link). */
  actions?: ReactNode;
  /** Remove the inner padding (for tables and lists that run edge to edge). */
  flush?: boolean;
}

/** A raised panel on the page surface. */
export function Card({ title, headingLevel = 2, actions, flush, className, children, ...rest }: CardProps) {
  const H = headingLevel === 2 ? "h2" : "h3";
  return (
    <section className={cx("rounded-card border border-surface-line bg-surface-raised shadow-card", className)} {...rest}>
      {(title || actions) && (
        <header className={cx("flex flex-wrap items-center justify-between gap-3", flush ? "px-4 pt-4 pb-2" : "px-4 pt-4 sm:px-5")}>
          {title && <H className="text-title text-fg">{title}</H>}
          {actions && <div className="flex items-center gap-2">{actions}</div>}
        </header>
      )}
      <div className={flush ? "" : cx("px-4 pb-4 sm:px-5", title || actions ? "pt-3" : "pt-4")}>{children}</div>
    </section>
  );
}
