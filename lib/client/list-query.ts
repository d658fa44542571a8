/**
 * The tests list's query (pages of 20 with "Load more"), apart from queries.ts so only the list
 * page loads the infinite-query code. Tested in tests/client/queries.test.ts (msw).
 */
import { useInfiniteQuery } from "@tanstack/react-query";
import { listTests, type TestFilters } from "./api";
import { testKeys } from "./queries";

/** Rows per page of the tests list. */
export const TEST_PAGE_SIZE = 20;

/** The tests the member may see with these filters, newest first; `fetchNextPage` follows the cursor. */
export function useTestList(filters: TestFilters) {
  return useInfiniteQuery({
    queryKey: testKeys.list(filters),
    queryFn: ({ pageParam, signal }) => listTests({ ...filters, cursor: pageParam, limit: TEST_PAGE_SIZE }, signal),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
  });
}
