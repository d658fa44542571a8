/**
 * Merging a duplicate record into the one to keep: every test, job, site or system that names the
 * duplicate is moved to the kept one, then the duplicate is deleted — one transaction, both
 * records checked to belong to the organization inside it. Nothing a test recorded is changed
 * apart from which record it points to.
 */
import { and, eq, sql } from "drizzle-orm";
import type { Database } from "@/db/client";
import { customers, jobs, sites, systems, vacuumTests } from "@/db/schema";
import type { RecordKind } from "./similar-names";

export interface MergeOutcome {
  kind: RecordKind;
  intoId: string;
  moved: { tests: number; jobs: number; sites: number; systems: number };
}

const TABLE = { customer: customers, site: sites, system: systems } as const;

/** The merge, or which of the two ids names no record of this kind in the organization (nothing changed). */
export async function mergeRecordsById(
  db: Database,
  params: { organizationId: string; kind: RecordKind; fromId: string; intoId: string },
): Promise<MergeOutcome | { missing: "fromId" | "intoId" }> {
  const { organizationId: org, kind, fromId, intoId } = params;
  return db.transaction(async (tx) => {
    const table = TABLE[kind];
    const found = await tx
      .select({ id: table.id })
      .from(table)
      .where(and(eq(table.organizationId, org), sql`${table.id} in (${fromId}, ${intoId})`))
      .for("update");
    if (!found.some((r) => r.id === fromId)) return { missing: "fromId" as const };
    if (!found.some((r) => r.id === intoId)) return { missing: "intoId" as const };
    const moved = { tests: 0, jobs: 0, sites: 0, systems: 0 };
    if (kind === "customer") {
      moved.sites = (await tx.update(sites).set({ customerId: intoId }).where(and(eq(sites.organizationId, org), eq(sites.customerId, fromId)))).rowCount ?? 0;
      await tx.delete(customers).where(and(eq(customers.organizationId, org), eq(customers.id, fromId)));
    } else if (kind === "site") {
      moved.tests = (await tx.update(vacuumTests).set({ siteId: intoId }).where(and(eq(vacuumTests.organizationId, org), eq(vacuumTests.siteId, fromId)))).rowCount ?? 0;
      moved.jobs = (await tx.update(jobs).set({ siteId: intoId }).where(and(eq(jobs.organizationId, org), eq(jobs.siteId, fromId)))).rowCount ?? 0;
      moved.systems = (await tx.update(systems).set({ siteId: intoId }).where(and(eq(systems.organizationId, org), eq(systems.siteId, fromId)))).rowCount ?? 0;
      await tx.delete(sites).where(and(eq(sites.organizationId, org), eq(sites.id, fromId)));
    } else {
      moved.tests = (await tx.update(vacuumTests).set({ systemId: intoId }).where(and(eq(vacuumTests.organizationId, org), eq(vacuumTests.systemId, fromId)))).rowCount ?? 0;
      moved.jobs = (await tx.update(jobs).set({ systemId: intoId }).where(and(eq(jobs.organizationId, org), eq(jobs.systemId, fromId)))).rowCount ?? 0;
      await tx.delete(systems).where(and(eq(systems.organizationId, org), eq(systems.id, fromId)));
    }
    return { kind, intoId, moved };
  });
}
