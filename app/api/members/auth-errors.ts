import { isAPIError } from "better-auth/api";
import { AppError } from "@/lib/errors";

/** better-auth's organization error codes that mean "already so", in our words. */
const CONFLICTS: Record<string, string> = {
  USER_IS_ALREADY_INVITED_TO_THIS_ORGANIZATION: "That e-mail already has an open invitation to this shop.",
  USER_IS_ALREADY_A_MEMBER_OF_THIS_ORGANIZATION: "That person is already a member of this shop.",
};

const PLAIN: Record<string, string> = {
  YOU_CANNOT_LEAVE_THE_ORGANIZATION_AS_THE_ONLY_OWNER: "A shop needs at least one owner.",
  YOU_CANNOT_LEAVE_THE_ORGANIZATION_WITHOUT_AN_OWNER: "A shop needs at least one owner.",
  INVITATION_LIMIT_REACHED: "This shop has too many open invitations; cancel some first.",
  ORGANIZATION_MEMBERSHIP_LIMIT_REACHED: "This shop has reached its member limit.",
  INVALID_EMAIL: "That does not look like an e-mail address.",
};

/**
 * Runs one better-auth server call and turns its errors into our AppError, so the route wrapper
 * answers with our codes and words instead of a 500.
 */
export async function viaAuth<T>(call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (err) {
    if (!isAPIError(err)) throw err;
    const code = (err.body as { code?: string } | undefined)?.code ?? "";
    if (CONFLICTS[code]) throw new AppError("conflict", CONFLICTS[code], { reason: code });
    if (err.statusCode === 401) throw new AppError("unauthenticated");
    if (err.statusCode === 403) throw new AppError("forbidden", PLAIN[code], { reason: code });
    if (err.statusCode === 429) throw new AppError("rate_limited");
    throw new AppError("invalid_input", PLAIN[code] ?? err.message, { reason: code });
  }
}
