import { beforeAll, describe, expect, it } from "vitest";
import { POST as authPost } from "@/app/api/auth/[...all]/route";
import { GET as listMembers } from "@/app/api/members/route";
import { GET as listInvites, POST as invite } from "@/app/api/members/invitations/route";
import { DELETE as cancelInvite } from "@/app/api/members/invitations/[id]/route";
import { PATCH as changeRole, DELETE as removeMember } from "@/app/api/members/[userId]/route";
import { addMember, appRequest, createShop, routeParams, uniqueEmail, type TestMember } from "./helpers/members";

const json = (body: unknown, method = "POST") => ({ method, body: JSON.stringify(body), headers: { "content-type": "application/json" } });

interface Shop {
  owner: TestMember;
  tech: TestMember;
  invitationId: string;
  invitedEmail: string;
}

async function shopWithCrew(name: string): Promise<Shop> {
  const owner = await createShop(name);
  const tech = await addMember(owner.organizationId, "technician", `${name} Tech`);
  const invitedEmail = uniqueEmail("pending");
  const res = await invite(appRequest("/api/members/invitations", { ...json({ email: invitedEmail, role: "apprentice" }), as: owner }));
  expect(res.status).toBe(201);
  return { owner, tech, invitedEmail, invitationId: (await res.json()).invitation.id };
}

let a: Shop;
let b: Shop;
beforeAll(async () => {
  [a, b] = await Promise.all([shopWithCrew("Alder Refrigeration"), shopWithCrew("Birch Climate")]);
});

async function members(as: TestMember) {
  return (await (await listMembers(appRequest("/api/members", { as }))).json()).members as { userId: string; email: string; role: string }[];
}
async function invitations(as: TestMember) {
  return (await (await listInvites(appRequest("/api/members/invitations", { as }))).json()).invitations as { id: string; email: string }[];
}

describe("tenancy: shop A never sees or touches shop B (common practice, no published source: 404 hides existence)", () => {
  it("lists only A's members to A's owner and technician", async () => {
    for (const as of [a.owner, a.tech]) {
      const ids = (await members(as)).map((m) => m.userId);
      expect(ids.sort()).toEqual([a.owner.userId, a.tech.userId].sort());
      expect(ids).not.toContain(b.owner.userId);
      expect(ids).not.toContain(b.tech.userId);
    }
  });

  it("lists only A's invitations to A's owner", async () => {
    const list = await invitations(a.owner);
    expect(list.map((i) => i.id)).toEqual([a.invitationId]);
    expect(list.map((i) => i.email)).not.toContain(b.invitedEmail);
  });

  it("answers 404, not 403, when A's owner names B's invitation, and B's invitation stays open", async () => {
    const res = await cancelInvite(appRequest(`/api/members/invitations/${b.invitationId}`, { method: "DELETE", as: a.owner }), routeParams({ id: b.invitationId }));
    expect(res.status).toBe(404);
    expect((await res.json()).error.code).toBe("not_found");
    expect((await invitations(b.owner)).map((i) => i.id)).toContain(b.invitationId);
  });

  it("answers 404 when A's owner changes the role of or removes B's member, and B's member is unchanged", async () => {
    const patch = await changeRole(appRequest(`/api/members/${b.tech.userId}`, { ...json({ role: "lead" }, "PATCH"), as: a.owner }), routeParams({ userId: b.tech.userId }));
    expect(patch.status).toBe(404);
    const del = await removeMember(appRequest(`/api/members/${b.tech.userId}`, { method: "DELETE", as: a.owner }), routeParams({ userId: b.tech.userId }));
    expect(del.status).toBe(404);
    const bTech = (await members(b.owner)).find((m) => m.userId === b.tech.userId);
    expect(bTech?.role).toBe("technician");
  });

  it("refuses to switch A's owner into B as the active shop; the session then fails closed, never showing B", async () => {
    const setActive = (organizationId: string) =>
      authPost(appRequest("/api/auth/organization/set-active", { ...json({ organizationId }), headers: { "content-type": "application/json", cookie: a.owner.cookie } }));
    const res = await setActive(b.owner.organizationId);
    expect(res.status).toBe(403);
    // better-auth clears the active shop after a refused switch: our API answers "no shop", not B's data.
    const after = await listMembers(appRequest("/api/members", { as: a.owner }));
    expect(after.status).toBe(403);
    const text = await after.text();
    expect(JSON.parse(text).error.code).toBe("no_organization");
    expect(text).not.toContain(b.owner.userId);
    // Switching back to their own shop works again.
    expect((await setActive(a.owner.organizationId)).status).toBe(200);
    expect((await members(a.owner)).map((m) => m.userId)).toContain(a.owner.userId);
  });
});
