import type { Metadata } from "next";
import { Alert, LinkButton } from "@/components/ui";
import { db } from "@/db/client";
import { listSentBackRequestsByTechnician } from "@/db/queries/home";
import { countTestsWaitingReviewByOrganization } from "@/db/queries/review";
import { getOrganizationTimeZoneById } from "@/db/queries/settings";
import { can } from "@/lib/permissions";
import { pageActor } from "@/lib/session";
import { HomeLists } from "./HomeLists";
import { SentBackCard } from "./SentBackCard";

export const metadata: Metadata = { title: "Home" };

export default async function HomePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await pageActor();
  const sp = await searchParams;
  const first = actor.name.split(/\s+/)[0] || actor.name;
  const viewer = { organizationId: actor.organizationId, userId: actor.userId, role: actor.role };
  const [sentBack, queueCount, timeZone] = await Promise.all([
    listSentBackRequestsByTechnician(db(), { organizationId: actor.organizationId, userId: actor.userId, limit: 5 }),
    can(actor.role, "tests.review") ? countTestsWaitingReviewByOrganization(db(), { viewer }) : Promise.resolve(null),
    getOrganizationTimeZoneById(db(), { organizationId: actor.organizationId }),
  ]);
  return (
    <div className="mx-auto w-full max-w-5xl space-y-5 px-4 py-5 sm:py-8">
      {sp.denied && <Alert tone="warning" title="Not allowed">Your role does not open that page.</Alert>}
      <div>
        <h1 className="text-headline">Hello, {first}</h1>
        <p className="text-body text-fg-soft">{actor.organizationName}</p>
      </div>
      <SentBackCard requests={sentBack} timeZone={timeZone} />
      <LinkButton href="/vacuum-tests/new" size="lg" block className="min-h-16 text-title sm:w-auto sm:px-10" data-testid="home-new-test">
        <svg aria-hidden="true" width="26" height="26" viewBox="0 0 24 24" fill="none" stroke="currentColor" strokeWidth="2.6" strokeLinecap="round">
          <path d="M12 5v14M5 12h14" />
        </svg>
        New test
      </LinkButton>
      <HomeLists userId={actor.userId} reviewQueueCount={queueCount} />
    </div>
  );
}
