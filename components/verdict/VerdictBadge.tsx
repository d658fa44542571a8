import type { Verdict } from "@/analysis/decay/types";
import { outcomeOf } from "@/lib/verdict/words";
import { VerdictIcon } from "./VerdictIcon";
import { outcomeClasses } from "./words";

/**
 * Compact outcome chip for lists: icon + words on the verdict colour. "Passed" only when the curve
 * is tight and dry and the profile was met; a tight curve that missed the profile says so, in amber.
 */
export function VerdictBadge({ verdict, meetsProfile, className = "" }: { verdict: Verdict | null | undefined; meetsProfile?: boolean | null; className?: string }) {
  const o = outcomeOf(verdict, meetsProfile);
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-full px-2.5 py-1 text-caption font-semibold ${outcomeClasses(o)} ${className}`} data-testid="outcome-badge">
      <VerdictIcon verdict={verdict ?? "inconclusive"} className="h-4 w-4" />
      {verdict ? o.label : "Not analysed"}
    </span>
  );
}
