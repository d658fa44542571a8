import type { Metadata } from "next";
import { headers } from "next/headers";
import { AuthFrame, TextLink } from "@/components/shell/AuthFrame";
import { Alert } from "@/components/ui";
import { db } from "@/db/client";
import { getInvitationForAcceptById } from "@/db/queries/invitations";
import { getAuth } from "@/lib/auth";
import { ROLE_LABELS, isRole } from "@/lib/permissions";
import { InviteActions } from "./InviteActions";

export const metadata: Metadata = { title: "Invitation" };

export default async function InvitePage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ key?: string | string[] }> }) {
  const { id } = await params;
  const rawKey = (await searchParams).key;
  const inviteKey = typeof rawKey === "string" ? rawKey : null;
  const invitation = await getInvitationForAcceptById(db(), { id });
  const open = invitation && invitation.status === "pending" && invitation.expiresAt > new Date();

  if (!invitation || !open) {
    const why = !invitation
      ? "This invitation link is not known. Check that the whole link was copied."
      : invitation.status === "accepted"
        ? "This invitation was already accepted. Sign in to open the shop."
        : invitation.status === "canceled"
          ? "The shop owner cancelled this invitation. Ask them for a new one."
          : "This invitation has expired (links work for seven days). Ask the shop owner for a new one.";
    return (
      <AuthFrame title="Invitation not open">
        <Alert tone="warning" action={<TextLink href="/sign-in">Go to sign in</TextLink>}>
          {why}
        </Alert>
      </AuthFrame>
    );
  }

  const session = await getAuth().api.getSession({ headers: await headers() });
  const roleLabel = isRole(invitation.role) ? ROLE_LABELS[invitation.role] : (invitation.role ?? "member");
  return (
    <AuthFrame
      title={`Join ${invitation.organizationName}`}
      intro={
        <>
          {invitation.inviterName} invited <strong className="font-semibold text-fg">{invitation.email}</strong> to join as <strong className="font-semibold text-fg">{roleLabel}</strong>.
        </>
      }
    >
      <InviteActions
        invitationId={invitation.id}
        invitationKey={inviteKey}
        invitedEmail={invitation.email}
        shopName={invitation.organizationName}
        signedInEmail={session?.user.email ?? null}
      />
    </AuthFrame>
  );
}
