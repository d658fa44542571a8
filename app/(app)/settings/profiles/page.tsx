import type { Metadata } from "next";
import { pageActor } from "@/lib/session";
import { ProfilesAdmin } from "./ProfilesAdmin";

export const metadata: Metadata = { title: "Acceptance profiles" };

export default async function ProfilesPage() {
  await pageActor("profiles.manage");
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <div>
        <h1 className="text-headline">Acceptance profiles</h1>
        <p className="text-body text-fg-soft">
          The shop&apos;s rules for a passing decay test. New tests use the default unless the technician picks another. Changing a profile never changes tests already analysed: each keeps the profile it was judged by.
        </p>
      </div>
      <ProfilesAdmin />
    </div>
  );
}
