import { and, eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { memberPreferences, organizationSettings } from "@/db/schema";

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

/** The shop's unit system and the person's own choice (null = follows the shop's). */
export async function getUnitSettingsById(db: Db, params: { organizationId: string; userId: string }): Promise<{ shop: string; person: string | null }> {
  const [[shop], [person]] = await Promise.all([
    db.select({ unitSystem: organizationSettings.unitSystem }).from(organizationSettings).where(eq(organizationSettings.organizationId, params.organizationId)).limit(1),
    db
      .select({ unitSystem: memberPreferences.unitSystem })
      .from(memberPreferences)
      .where(and(eq(memberPreferences.organizationId, params.organizationId), eq(memberPreferences.userId, params.userId)))
      .limit(1),
  ]);
  return { shop: shop?.unitSystem ?? "imperial", person: person?.unitSystem ?? null };
}

/** Set the shop's unit system (the time zone row is shared; a new row keeps the default zone). */
export async function upsertOrganizationUnitSystem(db: Db, params: { organizationId: string; unitSystem: string }): Promise<void> {
  await db
    .insert(organizationSettings)
    .values({ organizationId: params.organizationId, unitSystem: params.unitSystem })
    .onConflictDoUpdate({ target: organizationSettings.organizationId, set: { unitSystem: params.unitSystem, updatedAt: sql`now()` } });
}

/** Set (or clear, with null) one member's own unit system in one shop. */
export async function upsertMemberUnitSystem(db: Db, params: { organizationId: string; userId: string; unitSystem: string | null }): Promise<void> {
  await db
    .insert(memberPreferences)
    .values({ organizationId: params.organizationId, userId: params.userId, unitSystem: params.unitSystem })
    .onConflictDoUpdate({ target: [memberPreferences.organizationId, memberPreferences.userId], set: { unitSystem: params.unitSystem, updatedAt: sql`now()` } });
}
