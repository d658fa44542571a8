import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { route } from "@/lib/api/handler";
import { PERMISSIONS, POLICIES, ROLES, can, type Permission, type PolicyName, type Role } from "@/lib/permissions";
import { appRequest, createCrew, routeParams, type TestMember } from "./helpers/members";

/**
 * The matrix as the product promises it, written out by hand (common practice, no published
 * source). It is compared with lib/permissions.ts, so a change there must be made here too, on purpose.
 */
const PROMISED: Record<Permission, readonly Role[]> = {
  "tests.upload": ["owner", "lead", "technician", "trainer", "apprentice"],
  "tests.read_all": ["owner", "lead", "trainer"],
  "tests.reanalyse": ["owner", "lead", "technician", "trainer", "apprentice"],
  "tests.review": ["owner", "lead"],
  "tests.comment": ["owner", "lead", "technician", "trainer", "apprentice"],
  "reports.share": ["owner", "lead"],
  "casebook.read": ["owner", "lead", "technician", "trainer", "apprentice"],
  "casebook.curate": ["trainer"],
  "records.manage": ["owner", "lead", "technician"],
  "members.read": ["owner", "lead", "technician", "trainer", "apprentice"],
  "members.manage": ["owner"],
  "profiles.manage": ["owner", "lead"],
};

/** One probe per policy, built with the real wrapper: the only thing it checks is the role. */
const PROBES: Record<PolicyName, ReturnType<typeof route>> = Object.fromEntries(
  (Object.keys(POLICIES) as PolicyName[]).map((p) => [p, route({ policy: p }, async ({ actor }) => ({ ok: true, role: actor.role }))]),
) as Record<PolicyName, ReturnType<typeof route>>;

/** The roles a policy's permission row promises ("member": every role). */
const promisedFor = (policy: PolicyName): readonly Role[] => {
  const p = POLICIES[policy].permission;
  return p === "member" ? ROLES : PROMISED[p];
};

type Handler = (req: Request, ctx?: { params: Promise<Record<string, string>> }) => Promise<Response>;
interface RealCall {
  name: string;
  call: (as: TestMember | null) => Promise<Response>;
}

const missingId = randomUUID();
const post = (body: unknown) => ({ method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } });
async function handler(load: () => Promise<Record<string, unknown>>, method: string): Promise<Handler> {
  return (await load())[method] as Handler;
}

/**
 * Real routes guarded by a permission. Calls are made harmless (an empty body, an id that does
 * not exist), so an allowed role gets 2xx/400/404 and a refused role 403: the role check comes first.
 */
const REAL: Partial<Record<Permission, RealCall[]>> = {
  "members.read": [{ name: "GET /api/members", call: async (as) => (await handler(() => import("@/app/api/members/route"), "GET"))(appRequest("/api/members", { as })) }],
  "members.manage": [
    { name: "GET /api/members/invitations", call: async (as) => (await handler(() => import("@/app/api/members/invitations/route"), "GET"))(appRequest("/api/members/invitations", { as })) },
    { name: "POST /api/members/invitations {}", call: async (as) => (await handler(() => import("@/app/api/members/invitations/route"), "POST"))(appRequest("/api/members/invitations", { ...post({}), as })) },
    {
      name: "DELETE /api/members/invitations/:missing",
      call: async (as) => (await handler(() => import("@/app/api/members/invitations/[id]/route"), "DELETE"))(appRequest(`/api/members/invitations/${missingId}`, { method: "DELETE", as }), routeParams({ id: missingId })),
    },
    {
      name: "PATCH /api/members/:missing",
      call: async (as) => (await handler(() => import("@/app/api/members/[userId]/route"), "PATCH"))(appRequest(`/api/members/${missingId}`, { method: "PATCH", body: JSON.stringify({ role: "lead" }), headers: { "content-type": "application/json" }, as }), routeParams({ userId: missingId })),
    },
    {
      name: "PUT /api/settings/shop {}",
      call: async (as) => (await handler(() => import("@/app/api/settings/shop/route"), "PUT"))(appRequest("/api/settings/shop", { method: "PUT", body: "{}", headers: { "content-type": "application/json" }, as })),
    },
  ],
  "tests.review": [{ name: "GET /api/review", call: async (as) => (await handler(() => import("@/app/api/review/route"), "GET"))(appRequest("/api/review", { as })) }],
  "records.manage": [{ name: "POST /api/sites {}", call: async (as) => (await handler(() => import("@/app/api/sites/route"), "POST"))(appRequest("/api/sites", { ...post({}), as })) }],
  "reports.share": [
    {
      name: "GET /api/vacuum-tests/:missing/share-links",
      call: async (as) => (await handler(() => import("@/app/api/vacuum-tests/[id]/share-links/route"), "GET"))(appRequest(`/api/vacuum-tests/${missingId}/share-links`, { as }), routeParams({ id: missingId })),
    },
  ],
};

let crew: Record<Role, TestMember>;
beforeAll(async () => {
  crew = await createCrew();
});

describe("permission matrix (common practice, no published source: least privilege per role)", () => {
  it("has a probe for every policy and a promised row for every permission in lib/permissions.ts, and no extra ones", () => {
    expect(Object.keys(PROBES).sort()).toEqual(Object.keys(POLICIES).sort());
    expect(Object.keys(PROMISED).sort()).toEqual(Object.keys(PERMISSIONS).sort());
    // Every policy stands on a row of the matrix (or any member), never on a role list of its own.
    for (const p of Object.values(POLICIES)) expect([...Object.keys(PERMISSIONS), "member"]).toContain(p.permission);
  });

  it.each(Object.keys(PERMISSIONS) as Permission[])("lib/permissions.ts grants %s to exactly the promised roles", (p) => {
    expect(ROLES.filter((r) => can(r, p))).toEqual(PROMISED[p]);
  });

  it.each(Object.keys(POLICIES) as PolicyName[])("route({ policy: %s }) lets the roles of its permission row through, refuses the rest with 403 and anonymous with 401", async (p) => {
    const probe = PROBES[p];
    for (const role of ROLES) {
      const res = await probe(appRequest("/probe", { as: crew[role] }));
      const allowed = promisedFor(p).includes(role);
      expect(res.status, `${p} as ${role}`).toBe(allowed ? 200 : 403);
      const body = await res.json();
      if (allowed) expect(body.role).toBe(role);
      else expect(body.error.code).toBe("forbidden");
    }
    const anon = await probe(appRequest("/probe", { as: null }));
    expect(anon.status).toBe(401);
    expect((await anon.json()).error.code).toBe("unauthenticated");
  });

  const realRows = Object.entries(REAL).flatMap(([p, calls]) => calls!.map((c) => [p as Permission, c] as const));
  it.each(realRows.map(([p, c]) => [p, c.name, c] as const))("real route for %s (%s): refused roles 403, allowed roles pass the role check, anonymous 401", async (p, _name, c) => {
    for (const role of ROLES) {
      const res = await c.call(crew[role]);
      if (PROMISED[p].includes(role)) {
        expect([401, 403], `${c.name} as ${role} (got ${res.status})`).not.toContain(res.status);
        expect(res.status, `${c.name} as ${role}`).toBeLessThan(500);
      } else {
        expect(res.status, `${c.name} as ${role}`).toBe(403);
      }
    }
    expect((await c.call(null)).status).toBe(401);
  });
});
