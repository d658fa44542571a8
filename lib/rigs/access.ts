/**
 * Who may see and manage which rig. Not a row of lib/permissions.ts: the rule is row-level
 * ("own rig vs all"), so it lives here and in the rig queries, the way test visibility does.
 *
 * | role        | see            | manage (edit, add items, log upkeep) |
 * |-------------|----------------|--------------------------------------|
 * | owner, lead | every rig      | every rig                            |
 * | technician  | rigs they keep | rigs they keep (and create their own) |
 * | trainer, apprentice | rigs they keep | no                          |
 *
 * A rig the viewer may not see answers 404 (never 403), like any other record of the shop.
 */
import type { Role } from "@/lib/permissions";

export function canManageAllRigs(role: Role): boolean {
  return role === "owner" || role === "lead";
}

/** May manage rigs they keep (and create one for themselves). */
export function canManageOwnRigs(role: Role): boolean {
  return canManageAllRigs(role) || role === "technician";
}
