/**
 * Riseline's permission matrix: the one place that says which role may do what.
 * DEVELOPERS.md shows the same table; tests/permissions.test.ts walks every row.
 *
 * The role list and the row-level rules (whose tests a technician sees, for instance) live in
 * the data layer (db/roles.ts, db/queries/visibility.ts); "tests.read_all" below is that rule's list.
 */
import { READERS_OF_ALL_TESTS, ROLES, type Role } from "@/db/roles";

export { ROLES, isRole, canReadAllTests, type Role } from "@/db/roles";

export const ROLE_LABELS: Record<Role, string> = {
  owner: "Owner",
  lead: "Lead technician",
  technician: "Technician",
  trainer: "Trainer",
  apprentice: "Apprentice",
};

const everyone: readonly Role[] = ROLES;

export const PERMISSIONS = {
  /** Upload a gauge log or typed readings. */
  "tests.upload": everyone,
  /** See every test of the organization (others see their own and those shared with them). */
  "tests.read_all": READERS_OF_ALL_TESTS,
  /** Re-run the analysis with overrides (on a test the member can see and uploaded, or any for leads). */
  "tests.reanalyse": everyone,
  /** Move a test through review: sign off or send back with a request. */
  "tests.review": ["owner", "lead"],
  /** Comment on a test the member can see. */
  "tests.comment": everyone,
  /** Create and revoke read-only share links and e-mail reports to customers. */
  "reports.share": ["owner", "lead"],
  /** Read the training casebook (customer and site details stripped except for leads and owners). */
  "casebook.read": everyone,
  /** Build collections, add entries, pin notes. */
  "casebook.curate": ["trainer"],
  /** Customers, sites, systems and jobs. */
  "records.manage": ["owner", "lead", "technician"],
  /** See the member list of the organization. */
  "members.read": everyone,
  /** Invite, change roles, remove members. */
  "members.manage": ["owner"],
  /** Acceptance profiles (target, hold time, limit, leak threshold). */
  "profiles.manage": ["owner", "lead"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function can(role: Role, permission: Permission): boolean {
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

/**
 * Customers' e-mail addresses and phone numbers: for the roles that manage records (owner, lead,
 * technician — they call and visit customers). Trainers and apprentices see customers' names only.
 */
export function canSeeCustomerContact(role: Role): boolean {
  return can(role, "records.manage");
}

/** Roles the owner may hand out in an invitation (ownership is transferred, not invited). */
export const INVITABLE_ROLES: readonly Role[] = ["lead", "technician", "trainer", "apprentice"];
