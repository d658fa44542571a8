/**
 * An analysis the database can hold, checked before the insert: a log whose time column steps by
 * 1e305 s reads without error, but its numbers overflow the `real` columns (PostgreSQL's float4
 * holds up to about 3.4e38) and the insert would fail. Caught here it is a 422 that says what is
 * wrong with the file, instead of a database error.
 */
import { AppError } from "@/lib/errors";

/** Largest magnitude a PostgreSQL `real` (IEEE 754 single precision) holds. */
const FLOAT4_MAX = 3.4028234663852886e38;

/** No gauge log spans more than this: readings over 30 years apart mean a wrong time column or unit. */
const LONGEST_LOG_SECONDS = 30 * 365.25 * 86_400;

/** The first number in `value` (at most 12 levels deep) that is not finite or overflows a float4, with its path. */
function firstOutOfRange(value: unknown, path: string): { path: string; value: number } | null {
  const stack: { value: unknown; path: string; depth: number }[] = [{ value, path, depth: 0 }];
  while (stack.length > 0) {
    const at = stack.pop()!;
    if (typeof at.value === "number") {
      if (!(Number.isFinite(at.value) && Math.abs(at.value) <= FLOAT4_MAX)) return { path: at.path, value: at.value };
      continue;
    }
    if (!at.value || typeof at.value !== "object" || at.depth > 12) continue;
    const children = Object.entries(at.value).map(([k, v]) => ({ value: v, path: at.path ? `${at.path}.${k}` : k, depth: at.depth + 1 }));
    for (let i = children.length - 1; i >= 0; i--) stack.push(children[i]);
  }
  return null;
}

function spanSeconds(t: ArrayLike<number>): number {
  return t.length > 1 ? Math.abs(t[t.length - 1] - t[0]) : 0;
}

/** 422 invalid_file when the readings span an impossible time or a number overflows what is stored. */
export function assertStorableRun(run: { result: unknown; series: { t: ArrayLike<number>; p: ArrayLike<number> } }): void {
  const span = spanSeconds(run.series.t);
  if (!(span <= LONGEST_LOG_SECONDS))
    throw new AppError(
      "invalid_file",
      `time column: the readings span ${span.toPrecision(3)} s (more than 30 years), which no gauge log does. Check that the right column is read as time, and its unit.`,
      { reason: "time_out_of_range", spanSeconds: Number.isFinite(span) ? span : null },
    );
  const hit = firstOutOfRange(run.result, "");
  if (hit)
    throw new AppError(
      "invalid_file",
      `The log's numbers are out of range (${hit.path} = ${String(hit.value)}); check the time and pressure columns and their units.`,
      { reason: "value_out_of_range", field: hit.path },
    );
}
