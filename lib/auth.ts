import { betterAuth } from "better-auth";
import { APIError, createAuthMiddleware, isAPIError } from "better-auth/api";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { organization } from "better-auth/plugins";
import { createAccessControl } from "better-auth/plugins/access";
import { defaultStatements, ownerAc, memberAc } from "better-auth/plugins/organization/access";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import * as schema from "@/db/schema";
import { env, authRateLimitEnabled } from "@/lib/env";
import { invitationLink } from "@/lib/invitation-key";
import { clearFailures, countFailure, lockedMessage, normalisedEmail, secondsLocked } from "@/lib/lockout";
import { describeError, log } from "@/lib/log";
import { composeMail, sendMail } from "@/lib/mail";
import { queueMail } from "@/lib/notify/outbox";
import { CLIENT_IP_HEADER } from "@/lib/security/client-ip";
import { ROLE_LABELS, isRole } from "@/lib/permissions";

/**
 * better-auth's own access control covers the organization plugin's actions (members,
 * invitations). Only owners manage members, as in lib/permissions.ts ("members.manage").
 */
const ac = createAccessControl(defaultStatements);
const roles = {
  owner: ac.newRole(ownerAc.statements),
  lead: ac.newRole(memberAc.statements),
  technician: ac.newRole(memberAc.statements),
  trainer: ac.newRole(memberAc.statements),
  apprentice: ac.newRole(memberAc.statements),
};

const SIGN_IN = "/sign-in/email";

/** Before a password sign-in: a locked account is refused with the time to wait (lib/lockout.ts). */
const lockoutBefore = createAuthMiddleware(async (ctx) => {
  if (ctx.path !== SIGN_IN) return;
  const email = normalisedEmail((ctx.body as { email?: unknown } | undefined)?.email);
  if (!email) return;
  const seconds = await secondsLocked(email);
  if (seconds > 0) throw new APIError("TOO_MANY_REQUESTS", { message: lockedMessage(seconds), code: "ACCOUNT_LOCKED" }, { "Retry-After": String(seconds) });
});

/** After one: a wrong password counts (and may lock), a right one clears the count. */
const lockoutAfter = createAuthMiddleware(async (ctx) => {
  if (ctx.path !== SIGN_IN) return;
  const email = normalisedEmail((ctx.body as { email?: unknown } | undefined)?.email);
  if (!email) return;
  const returned = ctx.context.returned;
  if (isAPIError(returned)) {
    if (returned.statusCode === 401) await countFailure(email);
  } else if (ctx.context.newSession) await clearFailures(email);
});

/** better-auth's own log lines through ours, secrets taken out. */
const authLogger = {
  level: "warn" as const,
  log: (level: "debug" | "info" | "warn" | "error", message: string, ...args: unknown[]) => {
    const fields = { args: args.map((a) => describeError(a)) };
    if (level === "error") log.error(`auth: ${message}`, fields);
    else if (level === "warn") log.warn(`auth: ${message}`, fields);
    else log.info(`auth: ${message}`, fields);
  },
};

function buildAuth() {
  const e = env();
  const trusted = [e.BETTER_AUTH_URL, ...e.TRUSTED_ORIGINS.split(",").map((s) => s.trim()).filter(Boolean)];
  return betterAuth({
    appName: "Riseline",
    baseURL: e.BETTER_AUTH_URL,
    secret: e.BETTER_AUTH_SECRET,
    trustedOrigins: trusted,
    database: drizzleAdapter(db(), { provider: "pg", schema }),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: 10,
      revokeSessionsOnPasswordReset: true,
      sendResetPassword: async ({ user, url }) => {
        await sendMail(
          composeMail({
            to: user.email,
            subject: "Reset your Riseline password",
            paragraphs: [
              `Someone asked to reset the password of ${user.email} on Riseline.`,
              "If it was you, choose a new password with the link below; it works for one hour. If not, ignore this message: your password stays as it is.",
            ],
            link: { label: "Choose a new password", url },
          }),
        );
      },
    },
    session: { expiresIn: 60 * 60 * 24 * 14, updateAge: 60 * 60 * 24 },
    // In PostgreSQL, so every app server counts the same requests; keyed by the client address
    // resolved in app/api/auth/[...all]/route.ts (X-Forwarded-For only from a trusted proxy).
    rateLimit: { enabled: authRateLimitEnabled(), window: 60, max: 30, storage: "database" },
    hooks: { before: lockoutBefore, after: lockoutAfter },
    logger: authLogger,
    // Unexpected errors (a database that does not answer) reach our route handler, which logs them
    // without their query parameters and answers 503; better-auth would print them whole.
    onAPIError: { throw: true },
    advanced: {
      useSecureCookies: e.RISELINE_MODE === "production",
      // One joined query for a session and its user instead of two (every request reads them).
      database: { joins: true },
      ipAddress: { ipAddressHeaders: [CLIENT_IP_HEADER] },
    },
    databaseHooks: {
      session: {
        create: {
          // Start each session in the member's first shop, so pages never open without one.
          before: async (session) => {
            const [m] = await db()
              .select({ organizationId: schema.member.organizationId })
              .from(schema.member)
              .where(eq(schema.member.userId, session.userId))
              .orderBy(schema.member.createdAt)
              .limit(1);
            return { data: { ...session, activeOrganizationId: m?.organizationId ?? null } };
          },
        },
      },
    },
    plugins: [
      organization({
        ac,
        roles,
        creatorRole: "owner",
        invitationExpiresIn: 60 * 60 * 24 * 7,
        // Only from a verified address: an account made under someone's address cannot take their place.
        requireEmailVerificationOnInvitation: true,
        sendInvitationEmail: async ({ id, email, role, organization: org, inviter }) => {
          const label = isRole(role) ? ROLE_LABELS[role] : role;
          // Through the outbox: the mail waits in PostgreSQL and retries if the mail server is away.
          // (The link is not a credential: it opens only for the invited, verified address.)
          await db().transaction((tx) => queueMail(tx, [
            {
              organizationId: org.id,
              ...composeMail({
              to: email,
              subject: `${inviter.user.name} invited you to ${org.name} on Riseline`,
              paragraphs: [
                `${inviter.user.name} invited you to join ${org.name} on Riseline as ${label}.`,
                "Riseline keeps the record of every evacuation and decay test your crew runs. Open the link to accept; it works for seven days.",
              ],
              link: { label: "Accept the invitation", url: invitationLink(id, email) },
              }),
            },
          ]));
        },
      }),
    ],
  });
}

type Auth = ReturnType<typeof buildAuth>;
const g = globalThis as unknown as { rlAuth?: Auth };

/** The better-auth instance, built on first use (configuration is read then, not at import). */
export function getAuth(): Auth {
  if (!g.rlAuth) g.rlAuth = buildAuth();
  return g.rlAuth;
}
