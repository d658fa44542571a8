"use client";

import { useQuery } from "@tanstack/react-query";
import { Alert, Button, Card, EmptyState, LinkButton, Spinner } from "@/components/ui";
import { listTests, type VacuumTestListItem } from "@/lib/client/api";
import { TestRow } from "../vacuum-tests/TestRow";

/** Sent back first, then not passing or not decided, leaving out tests already signed off. */
export function needsAttention(items: VacuumTestListItem[]): VacuumTestListItem[] {
  const rank = (t: VacuumTestListItem) => (t.status === "sent_back" ? 0 : t.verdict === "inconclusive" || t.verdict == null ? 2 : 1);
  return items
    .filter((t) => t.status === "sent_back" || (t.status !== "signed_off" && t.verdict !== "pass"))
    .sort((a, b) => rank(a) - rank(b));
}

/**
 * My recent tests and what needs my attention. For a reviewer (`reviewQueueCount` given) the
 * attention count is the shop's review queue, with the member's own tests needing a look below it.
 */
export function HomeLists({ userId, reviewQueueCount = null }: { userId: string; reviewQueueCount?: number | null }) {
  const q = useQuery({
    queryKey: ["tests", "mine", userId],
    queryFn: ({ signal }) => listTests({ technicianId: userId, limit: 30 }, signal),
  });
  if (q.isPending)
    return (
      <div className="flex items-center gap-3 py-8 text-fg-soft" role="status">
        <Spinner label="" /> Loading your tests…
      </div>
    );
  if (q.isError)
    return (
      <Alert tone="error" title="Your tests could not be loaded" action={<Button onClick={() => q.refetch()}>Retry</Button>}>
        {(q.error as Error).message}
      </Alert>
    );
  const items = q.data.items;
  if (items.length === 0 && !reviewQueueCount)
    return (
      <EmptyState title="No tests yet">
        After your next evacuation, upload the micron gauge’s log or type the readings. The verdict and the curve show in seconds.
      </EmptyState>
    );
  const attention = needsAttention(items).slice(0, 5);
  const recent = items.slice(0, 5);
  const count = reviewQueueCount ?? attention.length;
  return (
    <div className="grid gap-5 lg:grid-cols-2">
      <Card title={`Needs your attention${count ? ` (${count})` : ""}`} data-testid="attention">
        {reviewQueueCount != null && (
          <p className="mb-3 text-body" data-testid="attention-queue">
            <LinkButton href="/review" variant="secondary">
              {reviewQueueCount === 1 ? "1 test waits" : `${reviewQueueCount} tests wait`} for your review
            </LinkButton>
          </p>
        )}
        {reviewQueueCount != null && attention.length > 0 && <h3 className="mb-2 text-body font-semibold">Your own tests</h3>}
        {attention.length === 0 ? (
          <p className="text-body text-fg-soft">{reviewQueueCount != null ? "None of your own recent tests needs a look." : "Nothing waiting on you. Every recent test passed or is signed off."}</p>
        ) : (
          <ul className="space-y-3">
            {attention.map((t) => (
              <li key={t.id}>
                <TestRow item={t} showTechnician={false} />
              </li>
            ))}
          </ul>
        )}
      </Card>
      {recent.length > 0 && <Card title="Your recent tests" data-testid="recent" actions={<LinkButton href={`/vacuum-tests?technicianId=${encodeURIComponent(userId)}`} variant="quiet">All</LinkButton>}>
        <ul className="space-y-3">
          {recent.map((t) => (
            <li key={t.id}>
              <TestRow item={t} showTechnician={false} />
            </li>
          ))}
        </ul>
      </Card>}
    </div>
  );
}
