/**
 * Per-account lockout with back-off for password sign-in, beside better-auth's per-address rate
 * limit: guessing one account's password from many addresses is slowed down too.
 *
 * The rule (OWASP ASVS 4.0.3 V2.2.1 soft lockout; OWASP Authentication Cheat Sheet "Account
 * Lockout"): 5 wrong passwords are free; the 6th locks the account for 30 s, and each further one
 * doubles it, up to 15 minutes. A day without failures forgets the count; a correct password
 * clears it. While locked, even the right password is refused, with the time to wait. The count
 * is kept for any e-mail asked for, existing or not, so the answer says nothing about which
 * addresses have accounts. At most about 100 guesses a day per account get through.
 */
import { db } from "@/db/client";
import { clearSignInFailuresByEmail, getSignInLockByEmail, recordSignInFailureByEmail } from "@/db/queries/sign-in-failures";
import { describeError, log } from "@/lib/log";

export const LOCKOUT_RULE = { freeFailures: 5, baseLockSeconds: 30, maxLockSeconds: 15 * 60, forgetSeconds: 24 * 3600 } as const;

export function normalisedEmail(value: unknown): string | null {
  return typeof value === "string" && value.includes("@") ? value.trim().toLowerCase().slice(0, 320) : null;
}

/** Seconds until the account may try again, or 0 when it is not locked. */
export async function secondsLocked(email: string): Promise<number> {
  const until = await getSignInLockByEmail(db(), { email });
  return until ? Math.max(1, Math.ceil((until.getTime() - Date.now()) / 1000)) : 0;
}

/** A wrong password for this account; returns the seconds it is now locked for (0: not yet). */
export async function countFailure(email: string): Promise<number> {
  try {
    const row = await recordSignInFailureByEmail(db(), { email, ...LOCKOUT_RULE });
    return row.lockedUntil ? Math.max(1, Math.ceil((row.lockedUntil.getTime() - Date.now()) / 1000)) : 0;
  } catch (err) {
    log.error("sign-in failure not counted", { err: describeError(err) });
    return 0;
  }
}

export async function clearFailures(email: string): Promise<void> {
  await clearSignInFailuresByEmail(db(), { email }).catch((err: unknown) => log.error("sign-in failures not cleared", { err: describeError(err) }));
}

/** The words for a locked account (no hint whether the address has an account). */
export function lockedMessage(seconds: number): string {
  const wait = seconds >= 90 ? `${Math.ceil(seconds / 60)} minutes` : `${seconds} seconds`;
  return `Too many wrong passwords for this e-mail. Wait ${wait}, then try again (or reset the password).`;
}
