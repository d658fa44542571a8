/** Building the engine's options from a test's metadata, the org's profile and overrides. */
import type { AcceptanceProfile, AnalyzeOptions, ImportOptions, SystemVolume } from "@/analysis/decay/types";
import type { Db } from "@/db/client";
import { getDefaultProfileByOrganization, getProfileById } from "@/db/queries/profiles";
import { AppError } from "@/lib/errors";

/** The organization's chosen profile (by id) or its default; unknown id → 400 naming profileId. */
export async function resolveProfile(db: Db, params: { organizationId: string; profileId?: string }): Promise<AcceptanceProfile> {
  const row = params.profileId
    ? await getProfileById(db, { organizationId: params.organizationId, profileId: params.profileId })
    : await getDefaultProfileByOrganization(db, { organizationId: params.organizationId });
  if (!row) throw new AppError("invalid_input", "profileId: no such acceptance profile in your organization", { field: "profileId" });
  const { name, targetMicrons, holdMinutes, limitMicrons, leakRateMicronsPerMinute } = row;
  return { name, targetMicrons, holdMinutes, limitMicrons, leakRateMicronsPerMinute };
}

export function volumeOf(m: { lineSetFeet?: number; liquidOd?: string; suctionOd?: string; volumeLitres?: number }): SystemVolume | undefined {
  if (m.volumeLitres !== undefined) return { litres: m.volumeLitres };
  if (m.lineSetFeet !== undefined && m.liquidOd && m.suctionOd)
    return { lineSet: [{ lengthFeet: m.lineSetFeet, liquidOd: m.liquidOd, suctionOd: m.suctionOd }] };
  return undefined;
}

/** Only the importer fields that were given (the engine's schema is strict). */
export function importOptionsOf(m: Partial<Pick<ImportOptions, "timeColumn" | "pressureColumn" | "unit" | "timeUnit" | "decimalMark">>): ImportOptions | undefined {
  const out: ImportOptions = {};
  if (m.timeColumn !== undefined) out.timeColumn = m.timeColumn;
  if (m.pressureColumn !== undefined) out.pressureColumn = m.pressureColumn;
  if (m.unit !== undefined) out.unit = m.unit;
  if (m.timeUnit !== undefined) out.timeUnit = m.timeUnit;
  if (m.decimalMark !== undefined) out.decimalMark = m.decimalMark;
  return Object.keys(out).length ? out : undefined;
}

/** Drop undefined keys so the stored options are exactly what was passed. */
export function compactOptions(o: AnalyzeOptions): AnalyzeOptions {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as AnalyzeOptions;
}
