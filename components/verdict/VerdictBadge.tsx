import type { Verdict } from "@/analysis/types";
import { VerdictIcon } from "./VerdictIcon";
import { verdictText } from "./words";

/** Compact verdict chip for lists: icon + words on the verdict colour. */
export function VerdictBadge({ verdict, className = "" }: { verdict: Verdict | null | undefined; className?: string }) {
  const t = verdictText(verdict);
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-full px-2.5 py-1 text-caption font-semibold ${t.solid} ${className}`}>
      <VerdictIcon verdict={verdict ?? "inconclusive"} className="h-4 w-4" />
      {verdict ? t.label : "Not analysed"}
    </span>
  );
}
