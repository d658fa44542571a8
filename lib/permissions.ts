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
  /** Re-run the analysis with overrides (on a test the member can see and made; owners and leads on any they see). */
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
 * Resource-level policies: what every API route names in route({ policy }). Each says which row
 * of PERMISSIONS it needs ("member": any member of the shop) and, for a policy on one vacuum test,
 * which roles may act on any test they can see (`anyTest`); every other allowed role acts on its
 * own tests only (`allows`). `rows` names the data-layer rule that narrows the records further.
 * The permission matrix in DEVELOPERS.md is generated from this table (npm run docs:permissions).
 */
interface PolicyRule {
  permission: Permission | "member";
  anyTest?: readonly Role[];
  rows?: string;
}

const VISIBLE = "tests one can see (db/queries/visibility.ts)";
const RIGS = "own rigs vs all (db/roles.ts)";

export const POLICIES = {
  "vacuumTest.list": { permission: "member", rows: VISIBLE },
  "vacuumTest.read": { permission: "member", rows: VISIBLE },
  "vacuumTest.upload": { permission: "tests.upload" },
  "vacuumTest.reanalyse": { permission: "tests.reanalyse", anyTest: ["owner", "lead"], rows: VISIBLE },
  "vacuumTest.retest": { permission: "tests.upload", anyTest: PERMISSIONS["tests.review"], rows: VISIBLE },
  "vacuumTest.writeCustomerNote": { permission: "member", anyTest: PERMISSIONS["reports.share"], rows: VISIBLE },
  "vacuumTest.review": { permission: "member", rows: "review moves (lib/review/state.ts) on tests one can see" },
  "vacuumTest.comment": { permission: "tests.comment", rows: VISIBLE },
  "vacuumTest.share": { permission: "reports.share", rows: VISIBLE },
  "reviewQueue.read": { permission: "tests.review" },
  "outbox.read": { permission: "tests.review" },
  "outbox.resend": { permission: "tests.review" },
  "pressureTest.list": { permission: "member", rows: "like vacuum tests (db/queries/pressure-tests.ts)" },
  "pressureTest.read": { permission: "member", rows: "like vacuum tests (db/queries/pressure-tests.ts)" },
  "pressureTest.record": { permission: "tests.upload" },
  "record.read": { permission: "member", rows: "contact details for records.manage only" },
  "record.create": { permission: "records.manage" },
  "record.similar": { permission: "records.manage" },
  "record.merge": { permission: "records.manage" },
  "profile.list": { permission: "member" },
  "profile.manage": { permission: "profiles.manage" },
  "rig.read": { permission: "member", rows: RIGS },
  "rig.manage": { permission: "member", rows: RIGS },
  "casebook.read": { permission: "casebook.read", rows: "customer and site details for owners and leads" },
  "casebook.curate": { permission: "casebook.curate" },
  "practice.read": { permission: "member", rows: "practice gate (lib/practice/gate.ts)" },
  "practice.call": { permission: "member", rows: "apprentices make calls (lib/practice/gate.ts)" },
  "practice.comment": { permission: "member", rows: "practice gate (lib/practice/gate.ts)" },
  "member.list": { permission: "members.read" },
  "member.manage": { permission: "members.manage" },
  "shop.read": { permission: "member" },
  "shop.manage": { permission: "members.manage" },
  "preference.write": { permission: "member", rows: "the person's own preferences only" },
  "overlay.read": { permission: "member", rows: VISIBLE },
  "planner.read": { permission: "member", rows: VISIBLE },
  "mailSettings.read": { permission: "members.manage" },
  "mailSettings.manage": { permission: "members.manage" },
  "mailPreferences.own": { permission: "member", rows: "the person's own preferences" },
  "task.read": { permission: "member", rows: "the person's own background tasks; every task for who reads all tests" },
} as const satisfies Record<string, PolicyRule>;

export type PolicyName = keyof typeof POLICIES;

/** The role check of a policy: the wrapper's (route({ policy })). */
export function mayUse(role: Role, policy: PolicyName): boolean {
  const p: PolicyRule = POLICIES[policy];
  return p.permission === "member" || can(role, p.permission);
}

/**
 * The whole policy on one vacuum test: the role check, then — for a policy with `anyTest` — the
 * test's own technician or a role that acts on any test (the row's visibility is checked before).
 */
export function allows(actor: { userId: string; role: Role }, policy: PolicyName, test: { createdById: string }): boolean {
  if (!mayUse(actor.role, policy)) return false;
  const p: PolicyRule = POLICIES[policy];
  return !p.anyTest || p.anyTest.includes(actor.role) || actor.userId === test.createdById;
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
