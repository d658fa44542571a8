import { cx } from "@/components/ui/cx";

/** Riseline's name mark: a pump-down curve that settles, with the isolation point in flare amber. */
export function Mark({ size = 32, className }: { size?: number; className?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden className={cx("shrink-0", className)}>
      <rect width="32" height="32" rx="8" fill="#0b6e69" />
      <path d="M5 9 C9 21, 11 24, 14 24 S19 22, 27 12" fill="none" stroke="#ffffff" strokeWidth="3" strokeLinecap="round" />
      <circle cx="14" cy="24" r="2.6" fill="#e8a317" />
    </svg>
  );
}

/** Mark plus the word "Riseline". */
export function Wordmark({ size = 32, className }: { size?: number; className?: string }) {
  return (
    <span className={cx("inline-flex items-center gap-2", className)}>
      <Mark size={size} />
      <span className="text-title font-semibold tracking-tight text-fg">Riseline</span>
    </span>
  );
}
