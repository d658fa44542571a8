import type { Verdict } from "@/analysis/decay/types";

/** A distinct shape per verdict, so the verdict reads without colour. Decorative: pair with words. */
export function VerdictIcon({ verdict, className = "h-6 w-6" }: { verdict: Verdict | null | undefined; className?: string }) {
  const common = { className, viewBox: "0 0 24 24", fill: "none", stroke: "currentColor", strokeWidth: 2.4, strokeLinecap: "round" as const, strokeLinejoin: "round" as const, "aria-hidden": true };
  switch (verdict) {
    case "pass":
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="9.5" />
          <path d="M7.5 12.5l3 3 6-6.5" />
        </svg>
      );
    case "leak":
      return (
        <svg {...common}>
          <path d="M4 19L19 5" />
          <path d="M11 5h8v8" />
        </svg>
      );
    case "moisture":
      return (
        <svg {...common}>
          <path d="M12 3.5c3.5 4.4 6 7.6 6 10.5a6 6 0 01-12 0c0-2.9 2.5-6.1 6-10.5z" />
        </svg>
      );
    case "leak_and_moisture":
      return (
        <svg {...common}>
          <path d="M9 6c2.4 3 4 5.2 4 7.2a4 4 0 01-8 0C5 11.2 6.6 9 9 6z" />
          <path d="M14 20l6-6" />
          <path d="M16 14h4v4" />
        </svg>
      );
    default:
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="9.5" />
          <path d="M9.5 9.3a2.6 2.6 0 015 .9c0 1.8-2.5 2.2-2.5 3.8" />
          <path d="M12 17.2v.1" />
        </svg>
      );
  }
}
