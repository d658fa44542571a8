import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db/client";
import { getShopMailSettings } from "@/db/queries/mail-settings";
import { listMembersByOrganization } from "@/db/queries/members";
import { env } from "@/lib/env";
import { can, isRole, ROLE_LABELS } from "@/lib/permissions";
import { pageActor } from "@/lib/session";
import { MailOutbox } from "./MailOutbox";
import { ShopMailSettings } from "./ShopMailSettings";

export const metadata: Metadata = { title: "Outgoing mail" };

export default async function MailPage() {
  const actor = await pageActor("tests.review");
  const owner = can(actor.role, "members.manage");
  const [settings, members] = owner
    ? await Promise.all([getShopMailSettings(db(), { organizationId: actor.organizationId }), listMembersByOrganization(db(), { organizationId: actor.organizationId })])
    : [null, []];
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <div>
        <h1 className="text-headline">Outgoing mail</h1>
        <p className="text-body text-fg-soft">
          Every e-mail Riseline sends for the shop: review requests, sign-offs, comments and reports. A change never waits for its mail. A message that did not go is tried again by itself (every half minute at most while the mail server is away, for a day); one Riseline gave up on can be sent again here.
        </p>
        <p className="text-body text-fg-soft">
          Which e-mails you receive yourself: <Link className="font-medium text-tide-700 underline" href="/settings/my-mail">My mail</Link>.
        </p>
      </div>
      {settings && (
        <ShopMailSettings
          senderName={settings.senderName}
          reviewMailTo={settings.reviewMailTo}
          members={members.map((m) => ({ userId: m.userId, name: m.name, roleLabel: isRole(m.role) ? ROLE_LABELS[m.role] : m.role }))}
          address={/<([^>]+)>/.exec(env().MAIL_FROM)?.[1] ?? env().MAIL_FROM}
        />
      )}
      <MailOutbox />
    </div>
  );
}
