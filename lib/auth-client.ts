"use client";

import { createAuthClient } from "better-auth/react";
import { organizationClient } from "better-auth/client/plugins";

/**
 * The browser side of better-auth. Same origin as the app, so no baseURL: requests go to
 * /api/auth/* on whatever host served the page (which must be BETTER_AUTH_URL's origin).
 */
export const authClient = createAuthClient({ plugins: [organizationClient()] });

/** What better-auth's client returns on failure. */
export interface AuthClientError {
  code?: string;
  message?: string;
  status?: number;
}

const PLAIN: Record<string, string> = {
  INVALID_EMAIL_OR_PASSWORD: "That e-mail and password do not match. Check both, or reset the password.",
  INVALID_PASSWORD: "That password is not right.",
  INVALID_EMAIL: "That does not look like an e-mail address.",
  USER_ALREADY_EXISTS: "An account with this e-mail already exists. Sign in instead.",
  USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL: "An account with this e-mail already exists. Sign in instead.",
  PASSWORD_TOO_SHORT: "The password is too short: use at least 10 characters.",
  PASSWORD_TOO_LONG: "The password is too long.",
  INVALID_TOKEN: "This reset link is not valid any more. Ask for a new one.",
  TOKEN_EXPIRED: "This reset link has expired. Ask for a new one.",
  ORGANIZATION_SLUG_ALREADY_TAKEN: "That shop address is taken; try again.",
  INVITATION_NOT_FOUND: "This invitation is no longer open. Ask the shop owner for a new one.",
  YOU_ARE_NOT_THE_RECIPIENT_OF_THE_INVITATION: "This invitation was sent to a different e-mail address.",
  EMAIL_VERIFICATION_REQUIRED_BEFORE_ACCEPTING_OR_REJECTING_INVITATION: "Open the link in the invitation e-mail to join: it confirms the address is yours.",
  CROSS_SITE: "This request came from another site and was refused. Open Riseline itself and try again there.",
};

/** A failure from the auth client in plain words for the person at the form. */
export function authErrorMessage(err: AuthClientError | null | undefined): string {
  if (!err) return "Something went wrong. Please try again.";
  if (err.code === "ACCOUNT_LOCKED" && err.message) return err.message;
  if (err.status === 429) return "Too many attempts; wait a minute and try again.";
  if (err.status === 503) return "Riseline's database is not answering just now; nothing was changed. Try again in a moment.";
  if (err.code && PLAIN[err.code]) return PLAIN[err.code];
  if (err.status && err.status >= 500) return "Riseline could not finish this on its side. Please try again.";
  return err.message || "Something went wrong. Please try again.";
}

/** Only same-site paths are followed after sign-in ("/invite/abc"), never another host. */
export function safeNextPath(next: string | null | undefined, fallback = "/home"): string {
  if (!next || !next.startsWith("/") || next.startsWith("//") || next.startsWith("/\\")) return fallback;
  return next;
}
