import { describe, expect, it } from "vitest";
import { POST as authPost } from "@/app/api/auth/[...all]/route";
import { POST as acceptInvite } from "@/app/api/invitations/[id]/accept/route";
import { GET as listMembers } from "@/app/api/members/route";
import { GET as listInvites, POST as invite } from "@/app/api/members/invitations/route";
import { DELETE as cancelInvite } from "@/app/api/members/invitations/[id]/route";
import { PATCH as changeRole, DELETE as removeMember } from "@/app/api/members/[userId]/route";
import { addMember, appRequest, createCrew, createShop, routeParams, uniqueEmail, PASSWORD, type TestMember } from "./helpers/members";
import { firstAppLink, waitForMail } from "./helpers/mailbox";
import { jobRunnerForFile } from "./helpers/jobs";

// Invitations go through the mail outbox: its delivery jobs run in this file.
jobRunnerForFile();

const json = (body: unknown, method = "POST") => ({ method, body: JSON.stringify(body), headers: { "content-type": "application/json" } });
const cookieOf = (res: Response) => res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");

async function inviteAs(as: TestMember | null, email: string, role: string) {
  return invite(appRequest("/api/members/invitations", { ...json({ email, role }), as }));
}

async function membersOf(as: TestMember) {
  const res = await listMembers(appRequest("/api/members", { as }));
  expect(res.status).toBe(200);
  return (await res.json()).members as { userId: string; email: string; role: string; name: string }[];
}

describe("members and invitations (common practice, no published source: owner-only crew management)", () => {
  it("invites by e-mail, the invited person signs up from the mailed link, accepts, and holds the invited role", async () => {
    const owner = await createShop("Frostline Mechanical");
    const email = uniqueEmail("invitee");
    const res = await inviteAs(owner, email, "technician");
    expect(res.status).toBe(201);
    const { invitation } = await res.json();
    expect(invitation.role).toBe("technician");

    const mail = await waitForMail(email, /invited you to Frostline Mechanical/);
    const link = new URL(firstAppLink(mail));
    expect(link.pathname).toBe(`/invite/${invitation.id}`);
    const invitationId = link.pathname.split("/").pop()!;
    const key = link.searchParams.get("key")!;

    const up = await authPost(appRequest("/api/auth/sign-up/email", json({ email, password: PASSWORD, name: "Ivy Invitee" })));
    expect(up.status).toBe(200);
    const cookie = cookieOf(up);
    const accept = await acceptInvite(
      appRequest(`/api/invitations/${invitationId}/accept`, { ...json({ key }), headers: { "content-type": "application/json", cookie } }),
      routeParams({ id: invitationId }),
    );
    expect(accept.status).toBe(200);

    const members = await membersOf(owner);
    const joined = members.find((m) => m.email === email);
    expect(joined?.role).toBe("technician");
    // The invitation is no longer open.
    const open = await (await listInvites(appRequest("/api/members/invitations", { as: owner }))).json();
    expect(open.invitations.map((i: { id: string }) => i.id)).not.toContain(invitationId);
  });

  it("refuses acceptance by someone signed in with another e-mail (403)", async () => {
    const owner = await createShop();
    const email = uniqueEmail("invitee");
    const { invitation } = await (await inviteAs(owner, email, "apprentice")).json();
    const stranger = await authPost(appRequest("/api/auth/sign-up/email", json({ email: uniqueEmail("stranger"), password: PASSWORD, name: "Sam Stranger" })));
    const res = await authPost(
      appRequest("/api/auth/organization/accept-invitation", { ...json({ invitationId: invitation.id }), headers: { "content-type": "application/json", cookie: cookieOf(stranger) } }),
    );
    expect(res.status).toBe(403);
  });

  it("lets only the owner invite: lead, technician, trainer and apprentice get 403, anonymous 401", async () => {
    const crew = await createCrew();
    for (const role of ["lead", "technician", "trainer", "apprentice"] as const) {
      const res = await inviteAs(crew[role], uniqueEmail("nope"), "technician");
      expect(res.status, role).toBe(403);
    }
    expect((await inviteAs(null, uniqueEmail("nope"), "technician")).status).toBe(401);
  });

  it("rejects inviting as owner or with a bad e-mail (400) and a duplicate open invitation (409)", async () => {
    const owner = await createShop();
    expect((await inviteAs(owner, uniqueEmail("x"), "owner")).status).toBe(400);
    expect((await inviteAs(owner, "not-an-email", "lead")).status).toBe(400);
    const email = uniqueEmail("twice");
    expect((await inviteAs(owner, email, "lead")).status).toBe(201);
    const again = await inviteAs(owner, email, "lead");
    expect(again.status).toBe(409);
    expect((await again.json()).error.code).toBe("conflict");
  });

  it("cancels an open invitation; the invited person can no longer accept it", async () => {
    const owner = await createShop();
    const email = uniqueEmail("cancelled");
    const { invitation } = await (await inviteAs(owner, email, "trainer")).json();
    const res = await cancelInvite(appRequest(`/api/members/invitations/${invitation.id}`, { method: "DELETE", as: owner }), routeParams({ id: invitation.id }));
    expect(res.status).toBe(200);
    const open = await (await listInvites(appRequest("/api/members/invitations", { as: owner }))).json();
    expect(open.invitations).toHaveLength(0);
    const up = await authPost(appRequest("/api/auth/sign-up/email", json({ email, password: PASSWORD, name: "Cara Cancelled" })));
    const accept = await authPost(
      appRequest("/api/auth/organization/accept-invitation", { ...json({ invitationId: invitation.id }), headers: { "content-type": "application/json", cookie: cookieOf(up) } }),
    );
    expect(accept.status).toBe(400);
  });

  it("changes a member's role and removes a member; the owner cannot demote or remove themself", async () => {
    const owner = await createShop();
    const tech = await addMember(owner.organizationId, "technician", "Theo Tech");
    const patch = await changeRole(appRequest(`/api/members/${tech.userId}`, { ...json({ role: "lead" }, "PATCH"), as: owner }), routeParams({ userId: tech.userId }));
    expect(patch.status).toBe(200);
    expect((await membersOf(owner)).find((m) => m.userId === tech.userId)?.role).toBe("lead");

    const self = await changeRole(appRequest(`/api/members/${owner.userId}`, { ...json({ role: "lead" }, "PATCH"), as: owner }), routeParams({ userId: owner.userId }));
    expect(self.status).toBe(400);
    const selfRemove = await removeMember(appRequest(`/api/members/${owner.userId}`, { method: "DELETE", as: owner }), routeParams({ userId: owner.userId }));
    expect(selfRemove.status).toBe(400);

    const del = await removeMember(appRequest(`/api/members/${tech.userId}`, { method: "DELETE", as: owner }), routeParams({ userId: tech.userId }));
    expect(del.status).toBe(200);
    expect((await membersOf(owner)).map((m) => m.userId)).not.toContain(tech.userId);
    // The removed member's session no longer opens the shop.
    expect((await listMembers(appRequest("/api/members", { as: tech }))).status).toBe(403);
  });

  it("lets a technician read the member list but not change a role (403)", async () => {
    const crew = await createCrew();
    expect((await membersOf(crew.technician)).length).toBe(5);
    const res = await changeRole(
      appRequest(`/api/members/${crew.apprentice.userId}`, { ...json({ role: "lead" }, "PATCH"), as: crew.technician }),
      routeParams({ userId: crew.apprentice.userId }),
    );
    expect(res.status).toBe(403);
  });
});
