import { integer, pgTable, text, timestamp } from "drizzle-orm/pg-core";

/**
 * Failed sign-ins per account, for the lockout with back-off (lib/auth/lockout.ts). Keyed by the
 * normalised e-mail asked for, whether or not such an account exists, so the answer never tells
 * which addresses have accounts. Kept in PostgreSQL so every app server sees the same count.
 */
export const signInFailures = pgTable("sign_in_failures", {
  email: text("email").primaryKey(),
  /** Wrong passwords since the last successful sign-in (or since the count lapsed). */
  failures: integer("failures").notNull().default(0),
  lastFailureAt: timestamp("last_failure_at", { withTimezone: true }).notNull().defaultNow(),
  /** No sign-in for this account before this instant; null when not locked. */
  lockedUntil: timestamp("locked_until", { withTimezone: true }),
});
