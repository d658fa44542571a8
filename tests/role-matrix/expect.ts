/**
 * What each role should get from a route, derived from lib/permissions.ts (the one source) and the
 * row rules written beside it (who sees which test, rig or call). No role list is typed out by
 * hand here: every set below is computed from `can()` and those rules.
 */
import { canManageAllRigs, canManageOwnRigs } from "@/lib/rigs/access";
import { practisesCalls } from "@/lib/practice/gate";
import { ROLES, can, canReadAllTests, type Permission, type Role } from "@/lib/permissions";
import type { TestMember } from "../helpers/members";
import type { World } from "./world";

/** "ok": 2xx. "passes": the role and row checks let it through (a 400/409/422 on the body is fine). */
export type Expect = "ok" | "passes" | 400 | 403 | 404;
/** The outsider: "no-leak" = answered from their own shop with nothing of ours in it. */
export type OutsiderExpect = Expect | "no-leak";

export interface Probe {
  /** "METHOD /api/path" as the route file serves it. */
  route: string;
  call: (as: TestMember | null, w: World) => Promise<Response>;
  expect: (role: Role) => Expect;
  outsider: OutsiderExpect;
}

export const only = (roles: readonly Role[]) => ROLES.filter((r) => roles.includes(r));

/** The technician's test: every role that reads all tests, and its technician. */
export const techTestReaders = ROLES.filter((r) => canReadAllTests(r) || r === "technician");
/** A trainer's practice test shared with the apprentice. */
export const practiceReaders = ROLES.filter((r) => canReadAllTests(r) || r === "apprentice");
/** The technician's rig: those who see every rig, and its keeper. */
export const rigSeers = ROLES.filter((r) => canManageAllRigs(r) || r === "technician");
export const rigManagers = rigSeers.filter((r) => canManageAllRigs(r) || canManageOwnRigs(r));
/** Who may add a rig (kept by themselves). */
export const rigCreators = ROLES.filter(canManageOwnRigs);
/** A practice call: those who see every call, and the apprentice who made it. */
export const callReaders = ROLES.filter((r) => canReadAllTests(r) || practisesCalls(r));

/**
 * The usual order in a handler: the route's permission (403), then whether the row is visible to
 * the caller (404), then a row rule on what they may do with it (403).
 */
export function rule(permission: Permission | "member", opts: { visible?: readonly Role[]; may?: readonly Role[]; ok?: Expect } = {}) {
  return (role: Role): Expect => {
    if (permission !== "member" && !can(role, permission)) return 403;
    if (opts.visible && !opts.visible.includes(role)) return 404;
    if (opts.may && !opts.may.includes(role)) return 403;
    return opts.ok ?? "ok";
  };
}

export function matches(status: number, want: Expect): boolean {
  if (want === "ok") return status >= 200 && status < 300;
  if (want === "passes") return status < 500 && ![401, 403, 404].includes(status);
  return status === want;
}
