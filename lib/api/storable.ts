/**
 * Input PostgreSQL cannot hold, found before it gets there: a NUL character (U+0000 is refused in
 * text and jsonb alike) or a number that JSON turned into Infinity. Caught here it is a 422 naming
 * the field; reaching the database it would be an error that looks like an outage.
 * OWASP ASVS 4.0.3 V5.1.3 (input validated against what is allowed) and V13.2.2.
 */
import { AppError } from "@/lib/errors";

/** The first unstorable value in a parsed request part, as `path: what is wrong`, or null. */
export function unstorableIn(value: unknown, path: string, depth = 0): string | null {
  if (typeof value === "string") return value.includes("\u0000") ? `${path}: contains a NUL character (U+0000), which cannot be stored` : null;
  if (typeof value === "number") return Number.isFinite(value) ? null : `${path}: the number is too large to store`;
  if (!value || typeof value !== "object" || depth > 32) return null;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = unstorableIn(value[i], `${path}[${i}]`, depth + 1);
      if (found) return found;
    }
    return null;
  }
  for (const [k, v] of Object.entries(value)) {
    const keyProblem = k.includes("\u0000") ? `${path}: a field name contains a NUL character (U+0000)` : null;
    const found = keyProblem ?? unstorableIn(v, path ? `${path}.${k}` : k, depth + 1);
    if (found) return found;
  }
  return null;
}

/** 422 unstorable_input naming the first value the database could not hold. */
export function assertStorable(value: unknown, where: string): void {
  const found = unstorableIn(value, where);
  if (found) throw new AppError("unstorable_input", `${found}. Nothing was saved; correct it and send again.`, { field: found.split(":")[0] });
}
