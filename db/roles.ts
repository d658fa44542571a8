/**
 * The roles a membership row stores (member.role), and the row-level rules the data layer applies
 * with them. What each role may *do* is lib/permissions.ts, which builds on this list; these rules
 * only say which rows a query returns, so they live with the queries (no import from lib/).
 */
export const ROLES = ["owner", "lead", "technician", "trainer", "apprentice"] as const;
export type Role = (typeof ROLES)[number];

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}

/** Roles that see every test of the organization (lib/permissions.ts "tests.read_all"); others see their own and those shared with them. */
export const READERS_OF_ALL_TESTS = ["owner", "lead", "trainer"] as const satisfies readonly Role[];

export function canReadAllTests(role: Role): boolean {
  return (READERS_OF_ALL_TESTS as readonly Role[]).includes(role);
}

/**
 * Who may see and manage which rig. Not a row of lib/permissions.ts: the rule is row-level
 * ("own rig vs all"), like test visibility.
 *
 * | role        | see            | manage (edit, add items, log upkeep) |
 * |-------------|----------------|--------------------------------------|
 * | owner, lead | every rig      | every rig                            |
 * | technician  | rigs they keep | rigs they keep (and create their own) |
 * | trainer, apprentice | rigs they keep | no                          |
 *
 * A rig the viewer may not see answers 404 (never 403), like any other record of the shop.
 */
export function canManageAllRigs(role: Role): boolean {
  return role === "owner" || role === "lead";
}

/** May manage rigs they keep (and create one for themselves). */
export function canManageOwnRigs(role: Role): boolean {
  return canManageAllRigs(role) || role === "technician";
}
