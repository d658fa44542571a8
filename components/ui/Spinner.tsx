import { cx } from "./cx";

/** A turning ring; `label` is read by screen readers (pass "" when the parent already says it). */
export function Spinner({ size = "md", label = "Loading", className }: { size?: "sm" | "md" | "lg"; label?: string; className?: string }) {
  const px = size === "sm" ? "h-4 w-4 border-2" : size === "lg" ? "h-10 w-10 border-4" : "h-6 w-6 border-[3px]";
  return (
    <span role={label ? "status" : undefined} className={cx("inline-flex items-center gap-2", className)}>
      <span aria-hidden className={cx("inline-block animate-spin rounded-full border-current border-r-transparent", px)} />
      {label && <span className="sr-only">{label}</span>}
    </span>
  );
}
