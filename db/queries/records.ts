import { and, asc, desc, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { customers, jobs, sites, systems } from "@/db/schema";

/** Customers, sites, systems and jobs of one organization. Every query is scoped inside. */

/**
 * The organization's customers by name. Their e-mail and phone come only `withContact` (roles that
 * manage records, lib/permissions.ts canSeeCustomerContact); otherwise they are null.
 */
export async function listCustomersByOrganization(db: Db, params: { organizationId: string; withContact: boolean }) {
  const rows = await db
    .select({ id: customers.id, name: customers.name, email: customers.email, phone: customers.phone })
    .from(customers)
    .where(eq(customers.organizationId, params.organizationId))
    .orderBy(asc(customers.name));
  return params.withContact ? rows : rows.map((r) => ({ ...r, email: null, phone: null }));
}

export async function createCustomer(db: Db, params: { organizationId: string; name: string; email?: string | null; phone?: string | null }) {
  const [row] = await db
    .insert(customers)
    .values({ organizationId: params.organizationId, name: params.name, email: params.email ?? null, phone: params.phone ?? null })
    .returning({ id: customers.id, name: customers.name, email: customers.email, phone: customers.phone });
  return row;
}

export async function getCustomerById(db: Db, params: { organizationId: string; customerId: string }) {
  const [row] = await db
    .select({ id: customers.id, name: customers.name })
    .from(customers)
    .where(and(eq(customers.organizationId, params.organizationId), eq(customers.id, params.customerId)))
    .limit(1);
  return row ?? null;
}

const siteColumns = {
  id: sites.id,
  name: sites.name,
  address: sites.address,
  customerId: sites.customerId,
  customerName: customers.name,
  createdAt: sites.createdAt,
};

export async function listSitesByOrganization(db: Db, params: { organizationId: string }) {
  return db
    .select(siteColumns)
    .from(sites)
    .leftJoin(customers, eq(customers.id, sites.customerId))
    .where(eq(sites.organizationId, params.organizationId))
    .orderBy(asc(sites.name));
}

export async function getSiteById(db: Db, params: { organizationId: string; siteId: string }) {
  const [row] = await db
    .select(siteColumns)
    .from(sites)
    .leftJoin(customers, eq(customers.id, sites.customerId))
    .where(and(eq(sites.organizationId, params.organizationId), eq(sites.id, params.siteId)))
    .limit(1);
  return row ?? null;
}

export async function createSite(db: Db, params: { organizationId: string; name: string; address?: string | null; customerId?: string | null }) {
  const [row] = await db
    .insert(sites)
    .values({ organizationId: params.organizationId, name: params.name, address: params.address ?? null, customerId: params.customerId ?? null })
    .returning({ id: sites.id, name: sites.name, address: sites.address, customerId: sites.customerId, createdAt: sites.createdAt });
  return row;
}

const systemColumns = {
  id: systems.id,
  siteId: systems.siteId,
  name: systems.name,
  kind: systems.kind,
  refrigerant: systems.refrigerant,
  factoryChargeKg: systems.factoryChargeKg,
  lineSetFeet: systems.lineSetFeet,
  liquidOd: systems.liquidOd,
  suctionOd: systems.suctionOd,
  indoorCoilLitres: systems.indoorCoilLitres,
  outdoorUnitLitres: systems.outdoorUnitLitres,
  installedOn: systems.installedOn,
  createdAt: systems.createdAt,
};

export async function listSystemsByOrganization(db: Db, params: { organizationId: string; siteId?: string }) {
  const where = params.siteId
    ? and(eq(systems.organizationId, params.organizationId), eq(systems.siteId, params.siteId))
    : eq(systems.organizationId, params.organizationId);
  return db.select(systemColumns).from(systems).where(where).orderBy(asc(systems.name));
}

export async function getSystemById(db: Db, params: { organizationId: string; systemId: string }) {
  const [row] = await db
    .select(systemColumns)
    .from(systems)
    .where(and(eq(systems.organizationId, params.organizationId), eq(systems.id, params.systemId)))
    .limit(1);
  return row ?? null;
}

export interface NewSystem {
  siteId: string;
  name: string;
  kind?: string | null;
  refrigerant?: string | null;
  factoryChargeKg?: number | null;
  lineSetFeet?: number | null;
  liquidOd?: string | null;
  suctionOd?: string | null;
  indoorCoilLitres?: number | null;
  outdoorUnitLitres?: number | null;
  installedOn?: string | null;
}

/** The site must belong to the organization; the caller checks it (getSiteById) in the same transaction. */
export async function createSystem(db: Db, params: { organizationId: string } & NewSystem) {
  const { organizationId, ...rest } = params;
  const [row] = await db.insert(systems).values({ organizationId, ...rest }).returning(systemColumns);
  return row;
}

const jobColumns = {
  id: jobs.id,
  siteId: jobs.siteId,
  systemId: jobs.systemId,
  technicianId: jobs.technicianId,
  visitedOn: jobs.visitedOn,
  reason: jobs.reason,
  reference: jobs.reference,
  createdAt: jobs.createdAt,
};

export async function listJobsByOrganization(db: Db, params: { organizationId: string; siteId?: string }) {
  const where = params.siteId
    ? and(eq(jobs.organizationId, params.organizationId), eq(jobs.siteId, params.siteId))
    : eq(jobs.organizationId, params.organizationId);
  // With the site's and its customer's names, so a job picker can say whose visit it was.
  return db
    .select({ ...jobColumns, siteName: sites.name, customerName: customers.name })
    .from(jobs)
    .leftJoin(sites, and(eq(sites.id, jobs.siteId), eq(sites.organizationId, jobs.organizationId)))
    .leftJoin(customers, and(eq(customers.id, sites.customerId), eq(customers.organizationId, sites.organizationId)))
    .where(where)
    .orderBy(desc(jobs.visitedOn), desc(jobs.createdAt))
    .limit(500);
}

export async function getJobById(db: Db, params: { organizationId: string; jobId: string }) {
  const [row] = await db
    .select(jobColumns)
    .from(jobs)
    .where(and(eq(jobs.organizationId, params.organizationId), eq(jobs.id, params.jobId)))
    .limit(1);
  return row ?? null;
}

export async function createJob(
  db: Db,
  params: { organizationId: string; visitedOn: string; siteId?: string | null; systemId?: string | null; technicianId?: string | null; reason?: string | null; reference?: string | null },
) {
  const [row] = await db
    .insert(jobs)
    .values({
      organizationId: params.organizationId,
      visitedOn: params.visitedOn,
      siteId: params.siteId ?? null,
      systemId: params.systemId ?? null,
      technicianId: params.technicianId ?? null,
      reason: params.reason ?? null,
      reference: params.reference ?? null,
    })
    .returning(jobColumns);
  return row;
}
