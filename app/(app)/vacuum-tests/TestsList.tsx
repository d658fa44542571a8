"use client";

import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useMemo } from "react";
import { Alert, Button, EmptyState, LinkButton, Spinner } from "@/components/ui";
import { useTestList } from "@/lib/client/list-query";
import { FilterBar } from "./FilterBar";
import { activeCount, filtersForApi, filtersFromParams, filtersToParams, type ListFilters } from "./filters";
import { TestRow } from "./TestRow";

/** The tests the member may see, newest first, with filters in the address bar and "Load more". */
export function TestsList({ canSeeAll }: { canSeeAll: boolean }) {
  const params = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const filters = useMemo(() => filtersFromParams(new URLSearchParams(params?.toString() ?? "")), [params]);
  const setFilters = (f: ListFilters) => {
    const q = filtersToParams(f).toString();
    router.replace(q ? `${pathname}?${q}` : pathname, { scroll: false });
  };
  const api = filtersForApi(filters);
  const q = useTestList(api);
  const items = q.data?.pages.flatMap((p) => p.items) ?? [];

  return (
    <div className="space-y-4">
      <FilterBar value={filters} onChange={setFilters} canSeeAll={canSeeAll} />
      {q.isPending ? (
        <div className="flex items-center gap-3 py-8 text-fg-soft" role="status">
          <Spinner label="" /> Loading tests…
        </div>
      ) : q.isError ? (
        <Alert tone="error" title="The tests could not be loaded" action={<Button onClick={() => q.refetch()}>Retry</Button>}>
          {(q.error as Error).message}
        </Alert>
      ) : items.length === 0 ? (
        activeCount(filters) > 0 ? (
          <EmptyState title="No tests match these filters" action={<Button variant="secondary" onClick={() => setFilters(filtersFromParams(new URLSearchParams()))}>Clear filters</Button>}>
            Try a wider date range or another verdict.
          </EmptyState>
        ) : (
          <EmptyState title="No tests yet" action={<LinkButton href="/vacuum-tests/new" size="lg">New test</LinkButton>}>
            Upload the micron gauge’s log after your next evacuation, or type the readings.
          </EmptyState>
        )
      ) : (
        <>
          <p className="text-caption text-fg-soft" aria-live="polite">
            Showing {items.length} test{items.length === 1 ? "" : "s"}
            {q.hasNextPage ? " — more below" : ""}
          </p>
          <ul className="space-y-3" data-testid="tests-list">
            {items.map((t) => (
              <li key={t.id}>
                <TestRow item={t} showTechnician={canSeeAll} />
              </li>
            ))}
          </ul>
          {q.hasNextPage && (
            <Button variant="secondary" block size="lg" busy={q.isFetchingNextPage} onClick={() => q.fetchNextPage()}>
              Load more
            </Button>
          )}
          {q.isFetchNextPageError && <Alert tone="error">Could not load more. Check the signal and try again.</Alert>}
        </>
      )}
    </div>
  );
}
