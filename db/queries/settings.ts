import { eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { organizationSettings } from "@/db/schema";

/** The shop's time zone (IANA name); "UTC" until the shop sets one. */
export async function getOrganizationTimeZoneById(db: Db, params: { organizationId: string }): Promise<string> {
  const [row] = await db
    .select({ timeZone: organizationSettings.timeZone })
    .from(organizationSettings)
    .where(eq(organizationSettings.organizationId, params.organizationId))
    .limit(1);
  return row?.timeZone ?? "UTC";
}

/** Set the shop's time zone (one row per organization, written or replaced). */
export async function upsertOrganizationTimeZone(db: Db, params: { organizationId: string; timeZone: string }): Promise<void> {
  await db
    .insert(organizationSettings)
    .values({ organizationId: params.organizationId, timeZone: params.timeZone })
    .onConflictDoUpdate({ target: organizationSettings.organizationId, set: { timeZone: params.timeZone, updatedAt: sql`now()` } });
}
