import { and, asc, desc, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { acceptanceProfiles } from "@/db/schema";
import { DEFAULT_PROFILE } from "@/analysis/decay/profile";
import type { AcceptanceProfile } from "@/analysis/decay/types";

export interface ProfileRow extends AcceptanceProfile {
  /** null for the engine's built-in default (no row in the database). */
  id: string | null;
  isDefault: boolean;
}

/** Name shown for the engine's default when an organization has no profiles of its own. */
export const BUILT_IN_PROFILE_NAME = "Common practice (default)";

/** The columns every profile read and write returns (the ProfileRow shape less the built-in case). */
export const profileColumns = {
  id: acceptanceProfiles.id,
  name: acceptanceProfiles.name,
  targetMicrons: acceptanceProfiles.targetMicrons,
  holdMinutes: acceptanceProfiles.holdMinutes,
  limitMicrons: acceptanceProfiles.limitMicrons,
  leakRateMicronsPerMinute: acceptanceProfiles.leakRateMicronsPerMinute,
  isDefault: acceptanceProfiles.isDefault,
};

export function builtInProfile(): ProfileRow {
  return { ...DEFAULT_PROFILE, name: BUILT_IN_PROFILE_NAME, id: null, isDefault: true };
}

/** The organization's profiles (default first); the built-in default when it has none. */
export async function listProfilesByOrganization(db: Db, params: { organizationId: string }): Promise<ProfileRow[]> {
  const rows = await db
    .select(profileColumns)
    .from(acceptanceProfiles)
    .where(eq(acceptanceProfiles.organizationId, params.organizationId))
    .orderBy(desc(acceptanceProfiles.isDefault), asc(acceptanceProfiles.name));
  return rows.length ? rows : [builtInProfile()];
}

export async function getProfileById(db: Db, params: { organizationId: string; profileId: string }): Promise<ProfileRow | null> {
  const [row] = await db
    .select(profileColumns)
    .from(acceptanceProfiles)
    .where(and(eq(acceptanceProfiles.organizationId, params.organizationId), eq(acceptanceProfiles.id, params.profileId)))
    .limit(1);
  return row ?? null;
}

/** The organization's default profile, or the built-in one. */
export async function getDefaultProfileByOrganization(db: Db, params: { organizationId: string }): Promise<ProfileRow> {
  const [row] = await db
    .select(profileColumns)
    .from(acceptanceProfiles)
    .where(and(eq(acceptanceProfiles.organizationId, params.organizationId), eq(acceptanceProfiles.isDefault, true)))
    .limit(1);
  return row ?? builtInProfile();
}

/** Used by tests and the seed; editing profiles from the app is later work. */
export async function createProfile(db: Db, params: { organizationId: string; isDefault?: boolean } & AcceptanceProfile) {
  const [row] = await db
    .insert(acceptanceProfiles)
    .values({ ...params, isDefault: params.isDefault ?? false })
    .returning(profileColumns);
  return row;
}
