import type { Metadata } from "next";
import { Suspense } from "react";
import { db } from "@/db/client";
import { listMembersByOrganization } from "@/db/queries/members";
import { pageActor } from "@/lib/session";
import { ReviewQueue } from "./ReviewQueue";

export const metadata: Metadata = { title: "Review" };
export const dynamic = "force-dynamic";

/** The lead's queue: tests waiting for review, the longest waiting first. */
export default async function ReviewPage() {
  const actor = await pageActor("tests.review");
  const members = await listMembersByOrganization(db(), { organizationId: actor.organizationId });
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <div>
        <h1 className="text-headline">Review</h1>
        <p className="text-body text-fg-soft">Tests waiting for you, the longest waiting first. Failing tests and requests for help arrive here on their own.</p>
      </div>
      <Suspense>
        <ReviewQueue technicians={members.map((m) => ({ id: m.userId, name: m.name }))} />
      </Suspense>
    </div>
  );
}
