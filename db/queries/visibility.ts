import { and, eq, exists, or, sql, type SQL } from "drizzle-orm";
import type { Db } from "@/db/client";
import { testShares, vacuumTests } from "@/db/schema";
import { canReadAllTests, type Role } from "@/db/roles";

/** Who is looking: the member and their role in the organization. */
export interface Viewer {
  organizationId: string;
  userId: string;
  role: Role;
}

/**
 * The row filter for vacuum_tests a viewer may read: always the viewer's organization; for
 * roles that read all tests, every test of it; for the rest, their own tests and those shared
 * with them (test_shares). Every query that reads tests includes this condition.
 */
export function visibleTestsWhere(viewer: Viewer): SQL {
  const org = eq(vacuumTests.organizationId, viewer.organizationId);
  if (canReadAllTests(viewer.role)) return org;
  const shared = exists(
    sql`(select 1 from ${testShares} where ${testShares.testId} = ${vacuumTests.id} and ${testShares.userId} = ${viewer.userId} and ${testShares.organizationId} = ${viewer.organizationId})`,
  );
  return and(org, or(eq(vacuumTests.createdById, viewer.userId), shared))!;
}

/** Share one test with one member of the same organization (idempotent). */
export async function createTestShare(db: Db, params: { organizationId: string; testId: string; userId: string }) {
  await db.insert(testShares).values(params).onConflictDoNothing();
}
