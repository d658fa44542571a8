import type { Metadata } from "next";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { AuthFrame } from "@/components/shell/AuthFrame";
import { SignOutButton } from "@/components/shell/SignOutButton";
import { db } from "@/db/client";
import { listMembershipsByUser } from "@/db/queries/members";
import { getAuth } from "@/lib/auth";
import { CreateShopForm } from "./CreateShopForm";

export const metadata: Metadata = { title: "Start a shop" };

/** Signed in but in no shop (left, removed, or the shop step failed at sign-up). */
export default async function NoShopPage() {
  const session = await getAuth().api.getSession({ headers: await headers() });
  if (!session) redirect("/sign-in");
  const memberships = await listMembershipsByUser(db(), { userId: session.user.id });
  return (
    <AuthFrame
      title="You are not in a shop yet"
      intro="Riseline keeps test records per shop. Start your own, or ask a shop owner to invite this e-mail."
      footer={<SignOutButton className="self-start" />}
    >
      <CreateShopForm firstShopId={memberships[0]?.organizationId ?? null} firstShopName={memberships[0]?.organizationName ?? null} email={session.user.email} />
    </AuthFrame>
  );
}
