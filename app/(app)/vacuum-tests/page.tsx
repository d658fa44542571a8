import type { Metadata } from "next";
import { Suspense } from "react";
import { LinkButton } from "@/components/ui";
import { canReadAllTests } from "@/lib/permissions";
import { pageActor } from "@/lib/session";
import { TestsList } from "./TestsList";

export const metadata: Metadata = { title: "Tests" };

export default async function TestsPage() {
  const actor = await pageActor();
  const all = canReadAllTests(actor.role);
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div>
          <h1 className="text-headline">Tests</h1>
          <p className="text-body text-fg-soft">{all ? `Every test in ${actor.organizationName}.` : "Your tests and those shared with you."}</p>
        </div>
        <LinkButton href="/vacuum-tests/new">New test</LinkButton>
      </div>
      <Suspense>
        <TestsList canSeeAll={all} />
      </Suspense>
    </div>
  );
}
