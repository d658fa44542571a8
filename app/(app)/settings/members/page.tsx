import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db/client";
import { listInvitationsByOrganization, listMembersByOrganization } from "@/db/queries/members";
import { pageActor } from "@/lib/session";
import { can } from "@/lib/permissions";
import { getOrganizationTimeZoneById } from "@/db/queries/settings";
import { MembersManager, type InvitationRow, type MemberRow } from "./MembersManager";
import { ShopTimeZone } from "./ShopTimeZone";
import { UnitsSettings } from "./UnitsSettings";
import { unitSettingsOf } from "@/lib/units/settings";

export const metadata: Metadata = { title: "Shop" };

export default async function MembersPage() {
  const actor = await pageActor("members.read");
  const canManage = can(actor.role, "members.manage");
  const [members, invitations, timeZone, units] = await Promise.all([
    listMembersByOrganization(db(), { organizationId: actor.organizationId }),
    canManage ? listInvitationsByOrganization(db(), { organizationId: actor.organizationId }) : Promise.resolve([]),
    getOrganizationTimeZoneById(db(), { organizationId: actor.organizationId }),
    unitSettingsOf(db(), actor),
  ]);
  const memberRows: MemberRow[] = members.map((m) => ({ userId: m.userId, name: m.name, email: m.email, role: m.role, joinedAt: m.joinedAt.toISOString() }));
  const inviteRows: InvitationRow[] = invitations.map((i) => ({ id: i.id, email: i.email, role: i.role ?? "", expiresAt: i.expiresAt.toISOString() }));
  return (
    <div className="flex flex-col gap-6">
      <header>
        <p className="text-caption font-medium uppercase tracking-wide text-fg-soft">Shop</p>
        <h1 className="text-headline text-fg">{actor.organizationName}</h1>
        <p className="mt-1 text-body text-fg-soft">
          {canManage ? "Invite your crew and choose what each person may do." : "Who works in this shop. Only the owner changes the crew."}
        </p>
      </header>
      <MembersManager members={memberRows} invitations={inviteRows} canManage={canManage} selfUserId={actor.userId} />
      <ShopTimeZone timeZone={timeZone} canManage={canManage} />
      <UnitsSettings initial={units} canManage={canManage} />
      <p className="text-body text-fg-soft">
        Which e-mails you receive: <Link className="font-medium text-tide-700 underline" href="/settings/my-mail">My mail</Link>.
      </p>
    </div>
  );
}
