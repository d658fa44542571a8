/** The unit settings of a shop and of one of its members, read from the data layer. */
import { z } from "zod";
import type { Db } from "@/db/client";
import { getUnitSettingsById } from "@/db/queries/settings";
import { effectiveUnitSystem, isUnitSystem, UNIT_SYSTEMS, type UnitSystem } from "./convert";

export const unitSystemSchema = z.enum(UNIT_SYSTEMS, { message: 'unitSystem: "imperial" (°F, ft, lb·oz, psig) or "metric" (°C, m, kg, kPa)' });
export const shopUnitsSchema = z.object({ unitSystem: unitSystemSchema }).strict();
/** The person's own choice; null goes back to the shop's. */
export const personUnitsSchema = z.object({ unitSystem: unitSystemSchema.nullable() }).strict();

export interface UnitSettings {
  shop: UnitSystem;
  person: UnitSystem | null;
  /** What this person sees: their own choice, else the shop's. */
  effective: UnitSystem;
}

export async function unitSettingsOf(db: Db, actor: { organizationId: string; userId: string }): Promise<UnitSettings> {
  const raw = await getUnitSettingsById(db, { organizationId: actor.organizationId, userId: actor.userId });
  const shop = isUnitSystem(raw.shop) ? raw.shop : "imperial";
  const person = isUnitSystem(raw.person) ? raw.person : null;
  return { shop, person, effective: effectiveUnitSystem(shop, person) };
}
