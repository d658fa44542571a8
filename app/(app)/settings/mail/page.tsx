import type { Metadata } from "next";
import { pageActor } from "@/lib/session";
import { MailOutbox } from "./MailOutbox";

export const metadata: Metadata = { title: "Outgoing mail" };

export default async function MailPage() {
  await pageActor("tests.review");
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <div>
        <h1 className="text-headline">Outgoing mail</h1>
        <p className="text-body text-fg-soft">
          Every e-mail Riseline sends for the shop: review requests, sign-offs, comments and reports. A change never waits for its mail. A message that did not go is tried again by itself (every half minute at most while the mail server is away, for a day); one Riseline gave up on can be sent again here.
        </p>
      </div>
      <MailOutbox />
    </div>
  );
}
