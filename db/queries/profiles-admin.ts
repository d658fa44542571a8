/**
 * Creating and editing acceptance profiles. Reading them is db/queries/profiles.ts.
 * An edit never touches stored analyses: each analysis keeps a copy of the profile it used.
 */
import { and, eq, ne, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { acceptanceProfiles } from "@/db/schema";
import type { AcceptanceProfile } from "@/analysis/decay/types";
import { profileColumns } from "./profiles";

/** Serialise default changes within one organization (call first in the transaction). */
async function lockProfilesOfOrganization(db: Db, organizationId: string) {
  await db.execute(sql`select pg_advisory_xact_lock(hashtext(${"profiles:" + organizationId}))`);
}

async function clearOtherDefaults(db: Db, organizationId: string, keepId: string) {
  await db
    .update(acceptanceProfiles)
    .set({ isDefault: false })
    .where(and(eq(acceptanceProfiles.organizationId, organizationId), ne(acceptanceProfiles.id, keepId), eq(acceptanceProfiles.isDefault, true)));
}

async function countProfiles(db: Db, organizationId: string): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(acceptanceProfiles)
    .where(eq(acceptanceProfiles.organizationId, organizationId));
  return row?.n ?? 0;
}

/** Create a profile; the organization's first profile becomes its default. Run in a transaction. */
export async function createProfileForOrganization(db: Db, params: { organizationId: string; makeDefault: boolean } & AcceptanceProfile) {
  const { organizationId, makeDefault, ...profile } = params;
  await lockProfilesOfOrganization(db, organizationId);
  const isDefault = makeDefault || (await countProfiles(db, organizationId)) === 0;
  const [row] = await db.insert(acceptanceProfiles).values({ organizationId, ...profile, isDefault }).returning(profileColumns);
  if (isDefault) await clearOtherDefaults(db, organizationId, row.id);
  return row;
}

/** Change a profile's numbers or name; null when it is not the organization's. */
export async function updateProfileById(db: Db, params: { organizationId: string; profileId: string } & AcceptanceProfile) {
  const { organizationId, profileId, ...profile } = params;
  const [row] = await db
    .update(acceptanceProfiles)
    .set(profile)
    .where(and(eq(acceptanceProfiles.organizationId, organizationId), eq(acceptanceProfiles.id, profileId)))
    .returning(profileColumns);
  return row ?? null;
}

/** Make one profile the organization's only default. Run in a transaction. */
export async function setDefaultProfileById(db: Db, params: { organizationId: string; profileId: string }) {
  await lockProfilesOfOrganization(db, params.organizationId);
  const [row] = await db
    .update(acceptanceProfiles)
    .set({ isDefault: true })
    .where(and(eq(acceptanceProfiles.organizationId, params.organizationId), eq(acceptanceProfiles.id, params.profileId)))
    .returning(profileColumns);
  if (!row) return null;
  await clearOtherDefaults(db, params.organizationId, row.id);
  return row;
}

/**
 * Delete a profile that is not the default (stored analyses keep their copy). Returns
 * "deleted", "is_default" or "not_found".
 */
export async function deleteProfileById(db: Db, params: { organizationId: string; profileId: string }) {
  const [row] = await db
    .select({ isDefault: acceptanceProfiles.isDefault })
    .from(acceptanceProfiles)
    .where(and(eq(acceptanceProfiles.organizationId, params.organizationId), eq(acceptanceProfiles.id, params.profileId)))
    .limit(1);
  if (!row) return "not_found" as const;
  if (row.isDefault) return "is_default" as const;
  await db
    .delete(acceptanceProfiles)
    .where(and(eq(acceptanceProfiles.organizationId, params.organizationId), eq(acceptanceProfiles.id, params.profileId)));
  return "deleted" as const;
}
