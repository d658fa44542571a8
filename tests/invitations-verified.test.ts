/**
 * Invitations are accepted only from a verified address (OWASP ASVS 4.0.3 V2.5.x: a secret sent
 * to the registered channel proves it; V4.1.3 least privilege). Someone who signs up under an
 * invited address without reading that mailbox cannot take the invitee's place.
 */
import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { POST as authPost } from "@/app/api/auth/[...all]/route";
import { POST as acceptInvite } from "@/app/api/invitations/[id]/accept/route";
import { POST as invite } from "@/app/api/members/invitations/route";
import { GET as listMembers } from "@/app/api/members/route";
import { db } from "@/db/client";
import { user } from "@/db/schema";
import { appRequest, createShop, routeParams, uniqueEmail, PASSWORD, type TestMember } from "./helpers/members";
import { firstAppLink, waitForMail } from "./helpers/mailbox";
import { jobRunnerForFile } from "./helpers/jobs";

// Invitations go through the mail outbox: its delivery jobs run in this file.
jobRunnerForFile();

const json = (body: unknown) => ({ method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } });
const cookieOf = (res: Response) => res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");

async function invited(owner: TestMember, role = "lead") {
  const email = uniqueEmail("invited");
  const res = await invite(appRequest("/api/members/invitations", { ...json({ email, role }), as: owner }));
  expect(res.status).toBe(201);
  const { invitation } = await res.json();
  const link = new URL(firstAppLink(await waitForMail(email, /invited you/)));
  return { email, id: invitation.id as string, key: link.searchParams.get("key") ?? "" };
}

async function signUp(email: string) {
  const res = await authPost(appRequest("/api/auth/sign-up/email", json({ email, password: PASSWORD, name: "Una Unverified" })));
  expect(res.status).toBe(200);
  return cookieOf(res);
}

const accept = (id: string, cookie: string, key: string) =>
  acceptInvite(appRequest(`/api/invitations/${id}/accept`, { ...json({ key }), headers: { "content-type": "application/json", cookie } }), routeParams({ id }));

async function memberEmails(owner: TestMember): Promise<string[]> {
  return (await (await listMembers(appRequest("/api/members", { as: owner }))).json()).members.map((m: { email: string }) => m.email);
}

describe("invitations from a verified address only", () => {
  it("refuses an unverified account holding only the invitation id: better-auth's own accept answers 403, nothing joins", async () => {
    const owner = await createShop();
    const inv = await invited(owner);
    const cookie = await signUp(inv.email);
    const res = await authPost(appRequest("/api/auth/organization/accept-invitation", { ...json({ invitationId: inv.id }), headers: { "content-type": "application/json", cookie } }));
    expect(res.status).toBe(403);
    expect((await res.json()).code).toBe("EMAIL_VERIFICATION_REQUIRED_BEFORE_ACCEPTING_OR_REJECTING_INVITATION");
    expect(await memberEmails(owner)).not.toContain(inv.email);
  });

  it("refuses a made-up or another invitation's key (403 naming the key) and leaves the address unverified", async () => {
    const owner = await createShop();
    const inv = await invited(owner);
    const other = await invited(owner, "technician");
    const cookie = await signUp(inv.email);
    for (const key of ["made-up-key", other.key]) {
      const res = await accept(inv.id, cookie, key);
      expect(res.status, key).toBe(403);
      expect((await res.json()).error.details.field).toBe("key");
    }
    const [row] = await db().select({ v: user.emailVerified }).from(user).where(eq(user.email, inv.email));
    expect(row.v).toBe(false);
    expect(await memberEmails(owner)).not.toContain(inv.email);
  });

  it("accepts with the mailed key: the address is verified and the invitee holds the invited role", async () => {
    const owner = await createShop();
    const inv = await invited(owner, "trainer");
    const cookie = await signUp(inv.email);
    const res = await accept(inv.id, cookie, inv.key);
    expect(res.status).toBe(200);
    const [row] = await db().select({ v: user.emailVerified }).from(user).where(eq(user.email, inv.email));
    expect(row.v).toBe(true);
    expect(await memberEmails(owner)).toContain(inv.email);
  });

  it("refuses the right key from someone signed in under another address (403)", async () => {
    const owner = await createShop();
    const inv = await invited(owner);
    const cookie = await signUp(uniqueEmail("someone-else"));
    expect((await accept(inv.id, cookie, inv.key)).status).toBe(403);
  });
});
