/**
 * The fields that create or reveal something, role by role, against lib/permissions.ts: a route's
 * own permission is not enough when one of its fields makes another kind of record or shows
 * another kind of data (OWASP ASVS 4.0.3 V4.1.3 least privilege, V4.2.1 and V13.1.4: a side door
 * through another route's fields is still access control).
 */
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as customersGet } from "@/app/api/customers/route";
import { GET as customerGet } from "@/app/api/customers/[id]/route";
import { GET as systemGet } from "@/app/api/systems/[id]/route";
import { POST as rigsPost } from "@/app/api/rigs/route";
import { PATCH as rigPatch } from "@/app/api/rigs/[id]/route";
import { POST as testsPost } from "@/app/api/vacuum-tests/route";
import { ROLES, can, canSeeCustomerContact, type Role } from "@/lib/permissions";
import { canManageAllRigs } from "@/lib/rigs/access";
import { appRequest, routeParams } from "./helpers/members";
import { countRows, listKeys, sampleText, uploadRequest } from "./helpers/uploads";
import { buildWorld, SAMPLE, type World } from "./role-matrix/world";

let w: World;
beforeAll(async () => {
  w = await buildWorld();
}, 120_000);

function upload(role: Role, fields: Record<string, string>, key?: string) {
  const as = w.crew[role];
  return testsPost(uploadRequest("/api/vacuum-tests", { as, file: { body: sampleText(SAMPLE), name: SAMPLE }, fields, headers: key ? { "idempotency-key": key } : {} }));
}

describe("fields of an upload that create records need records.manage, like the records routes", () => {
  const cases: [string, (w: World) => Record<string, string>][] = [
    ["newSiteName", () => ({ newSiteName: `Side door site ${randomUUID().slice(0, 4)}` })],
    ["newSystemName", (x) => ({ siteId: x.siteId, newSystemName: "Side door system" })],
    ["newJob", () => ({ newJob: "true", newJobReason: "Side door visit" })],
  ];
  it.each(ROLES.flatMap((role) => cases.map(([field, fields]) => [field, role, fields] as const)))("%s as %s", async (field, role, fields) => {
    const before = await countRows(w.crew.owner.organizationId);
    const keysBefore = (await listKeys(`orgs/${w.crew.owner.organizationId}/`)).length;
    const res = await upload(role, fields(w));
    const body = await res.json();
    if (can(role, "records.manage")) {
      expect(res.status, JSON.stringify(body)).toBe(201);
      return;
    }
    expect(res.status).toBe(403);
    expect(body.error.details.field).toBe(field);
    expect(body.error.message).toMatch(new RegExp(`^${field}: your role \\(${role}\\)`));
    // Refused before anything was analysed or stored: no test, site, upload or file.
    expect(await countRows(w.crew.owner.organizationId)).toEqual(before);
    expect((await listKeys(`orgs/${w.crew.owner.organizationId}/`)).length).toBe(keysBefore);
  });
});

describe("fields that reveal: customers' e-mail and phone only for roles that manage records", () => {
  it.each(ROLES)("GET /api/customers and /api/customers/:id as %s", async (role) => {
    const as = w.crew[role];
    const list = (await (await customersGet(appRequest("/api/customers", { as }))).json()).items;
    const one = (await (await customerGet(appRequest("/x", { as }), routeParams({ id: w.customerId }))).json()).customer;
    const mine = list.find((c: { id: string }) => c.id === w.customerId);
    expect(mine.name).toMatch(/^Casey Customer/);
    if (canSeeCustomerContact(role)) {
      expect([mine.email, one.email]).toEqual([w.customerEmail, w.customerEmail]);
      expect(one.phone).toBe("+1 555 0100");
    } else {
      expect([mine.email, mine.phone, one.email, one.phone]).toEqual([null, null, null, null]);
    }
  });
});

describe("fields that reveal: an uncalled practice test's verdict in a system's history", () => {
  it.each(ROLES)("GET /api/systems/:id as %s", async (role) => {
    const res = await systemGet(appRequest("/x", { as: w.crew[role] }), routeParams({ id: w.systemId }));
    expect(res.status).toBe(200);
    const text = await res.text();
    const row = JSON.parse(text).tests.find((t: { id: string }) => t.id === w.practiceTestId);
    if (role === "technician") return expect(row).toBeUndefined(); // not a test they can see at all
    expect(row).toBeTruthy();
    if (role === "apprentice") {
      expect(row).toMatchObject({ verdict: null, endMicrons: null, leakRateMicronsPerMinute: null, meetsProfile: null, isolationAt: null, practiceCallUrl: `/practice/${w.practiceTestId}` });
      expect(row.curve).toBeTruthy(); // the curve stays: reading it is the exercise
    } else {
      expect(row.verdict).toBeTruthy();
      expect(row.practiceCallUrl).toBeNull();
    }
  });
});

describe("a practice upload answers 201 with where to make the call (the test is saved; a retry makes no duplicate)", () => {
  it("as the apprentice: 201, no analysis or verdict, the call's address; the same key again: 200, the same test", async () => {
    const key = randomUUID();
    const before = await countRows(w.crew.owner.organizationId);
    const first = await upload("apprentice", { isPractice: "true" }, key);
    expect(first.status).toBe(201);
    const a = await first.json();
    expect(a.analysis).toBeNull();
    expect(a.test.verdict).toBeNull();
    expect(a.practiceCallUrl).toBe(`/practice/${a.test.id}`);
    const again = await upload("apprentice", { isPractice: "true" }, key);
    expect(again.status).toBe(200);
    const b = await again.json();
    expect(b.test.id).toBe(a.test.id);
    expect(b.analysis).toBeNull();
    expect((await countRows(w.crew.owner.organizationId)).tests - before.tests).toBe(1);
  });

  it("as a trainer: 201 with the verdict (trainers see analyses all along)", async () => {
    const res = await upload("trainer", { isPractice: "true" });
    expect(res.status).toBe(201);
    expect((await res.json()).analysis.verdict).toBeTruthy();
  });
});

describe("a rig's keeper: only owners and leads hand a rig to someone else", () => {
  it.each(ROLES.filter((r) => r !== "trainer" && r !== "apprentice"))("POST /api/rigs with keeperId as %s", async (role) => {
    const as = w.crew[role];
    const res = await rigsPost(appRequest("/api/rigs", { method: "POST", as, body: JSON.stringify({ name: "Keeper rig", keeperId: w.crew.lead.userId }), headers: { "content-type": "application/json" } }));
    expect(res.status).toBe(201);
    const { rig } = await res.json();
    expect(rig.keeperId).toBe(canManageAllRigs(role) ? w.crew.lead.userId : as.userId);
  });

  it("PATCH /api/rigs/:id keeperId by the technician who keeps it: 403, the keeper stays", async () => {
    const res = await rigPatch(
      appRequest("/x", { method: "PATCH", as: w.crew.technician, body: JSON.stringify({ keeperId: w.crew.apprentice.userId }), headers: { "content-type": "application/json" } }),
      routeParams({ id: w.rigId }),
    );
    expect(res.status).toBe(403);
  });
});
