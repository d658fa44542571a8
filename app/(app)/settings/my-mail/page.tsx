import type { Metadata } from "next";
import { db } from "@/db/client";
import { listMailOptOuts } from "@/db/queries/mail-settings";
import { MAIL_KINDS } from "@/db/schema";
import { pageActor } from "@/lib/session";
import { MyMail } from "./MyMail";

export const metadata: Metadata = { title: "My mail" };

export default async function MyMailPage() {
  const actor = await pageActor("member");
  const off = await listMailOptOuts(db(), { organizationId: actor.organizationId, userId: actor.userId });
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <div>
        <h1 className="text-headline">My mail</h1>
        <p className="text-body text-fg-soft">Which e-mails Riseline sends you from {actor.organizationName}. The unsubscribe link in a mail turns its kind off here too.</p>
      </div>
      <MyMail kinds={MAIL_KINDS} off={off} />
    </div>
  );
}
