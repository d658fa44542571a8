import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { organization } from "better-auth/plugins";
import { createAccessControl } from "better-auth/plugins/access";
import { defaultStatements, ownerAc, memberAc } from "better-auth/plugins/organization/access";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import * as schema from "@/db/schema";
import { env, authRateLimitEnabled } from "@/lib/env";
import { composeMail, sendMail } from "@/lib/mail";
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
    rateLimit: { enabled: authRateLimitEnabled(), window: 60, max: 30 },
    // One joined query for a session and its user instead of two (every request reads them).
    advanced: { useSecureCookies: e.RISELINE_MODE === "production", database: { joins: true } },
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
        sendInvitationEmail: async ({ id, email, role, organization: org, inviter }) => {
          const label = isRole(role) ? ROLE_LABELS[role] : role;
          await sendMail(
            composeMail({
              to: email,
              subject: `${inviter.user.name} invited you to ${org.name} on Riseline`,
              paragraphs: [
                `${inviter.user.name} invited you to join ${org.name} on Riseline as ${label}.`,
                "Riseline keeps the record of every evacuation and decay test your crew runs. Open the link to accept; it works for seven days.",
              ],
              link: { label: "Accept the invitation", url: `${e.BETTER_AUTH_URL}/invite/${id}` },
            }),
          );
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
