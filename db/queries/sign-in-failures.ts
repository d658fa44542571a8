/** Failed sign-ins per account (the lockout's counts), shared by every app server through PostgreSQL. */
import { eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { signInFailures } from "@/db/schema";

/** When the account may next try to sign in, if it is locked now. */
export async function getSignInLockByEmail(db: Db, params: { email: string }): Promise<Date | null> {
  const [row] = await db.select({ lockedUntil: signInFailures.lockedUntil }).from(signInFailures).where(eq(signInFailures.email, params.email)).limit(1);
  return row?.lockedUntil && row.lockedUntil.getTime() > Date.now() ? row.lockedUntil : null;
}

/**
 * Counts one more failure in one statement (a count older than `forgetSeconds` starts again at 1)
 * and sets the lock the rule gives for the new count: none for the first `freeFailures`, then
 * `baseLockSeconds` doubling with each further failure, at most `maxLockSeconds`.
 */
export async function recordSignInFailureByEmail(
  db: Db,
  params: { email: string; freeFailures: number; baseLockSeconds: number; maxLockSeconds: number; forgetSeconds: number },
): Promise<{ failures: number; lockedUntil: Date | null }> {
  const t = signInFailures;
  const next = sql`(case when ${t.lastFailureAt} < now() - make_interval(secs => ${params.forgetSeconds}) then 1 else ${t.failures} + 1 end)`;
  const lockFor = (n: unknown) =>
    sql`(case when ${n} > ${params.freeFailures} then now() + make_interval(secs => least(${params.maxLockSeconds}::float8, ${params.baseLockSeconds}::float8 * power(2, ${n} - ${params.freeFailures} - 1))) else null end)`;
  const [row] = await db
    .insert(t)
    .values({ email: params.email, failures: 1, lastFailureAt: sql`now()`, lockedUntil: params.freeFailures < 1 ? sql`now() + make_interval(secs => ${params.baseLockSeconds})` : null })
    .onConflictDoUpdate({ target: t.email, set: { failures: next, lastFailureAt: sql`now()`, lockedUntil: lockFor(next) } })
    .returning({ failures: t.failures, lockedUntil: t.lockedUntil });
  return row;
}

/** A successful sign-in clears the account's count. */
export async function clearSignInFailuresByEmail(db: Db, params: { email: string }): Promise<void> {
  await db.delete(signInFailures).where(eq(signInFailures.email, params.email));
}
