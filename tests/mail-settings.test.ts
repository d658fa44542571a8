/**
 * Mail settings: the shop's sender name and review recipients (owner), each person's own
 * preferences, and the unsubscribe link of every non-essential mail — RFC 2369 §3.2
 * (List-Unsubscribe) and RFC 8058 §3.1 (one-click: List-Unsubscribe-Post, a POST that needs no
 * session). Real PostgreSQL, real SMTP catcher, the real delivery job.
 */
import { createHmac } from "node:crypto";
import { and, eq, like } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { GET as shopMailGet, PUT as shopMailPut } from "@/app/api/settings/mail/route";
import { GET as myMailGet, PUT as myMailPut } from "@/app/api/settings/my-mail/route";
import { GET as unsubscribeGet, POST as unsubscribePost } from "@/app/api/mail/unsubscribe/route";
import { POST as commentPost } from "@/app/api/vacuum-tests/[id]/comments/route";
import { POST as reviewPost } from "@/app/api/vacuum-tests/[id]/review/route";
import { db } from "@/db/client";
import { listMailOptOuts } from "@/db/queries/mail-settings";
import { mailOutbox } from "@/db/schema";
import { env } from "@/lib/env";
import { unsubscribeUrl } from "@/lib/notify/unsubscribe";
import { ROLES } from "@/lib/permissions";
import { crewForFile, jsonInit } from "./helpers/crew";
import { jobRunnerForFile } from "./helpers/jobs";
import { readMailbox, waitForMail } from "./helpers/mailbox";
import { appRequest, createShop, routeParams, type TestMember } from "./helpers/members";
import { seedTest } from "./helpers/seed-test";

const crew = crewForFile();
jobRunnerForFile();

async function comment(id: string, as: TestMember, body: string) {
  const res = await commentPost(appRequest(`/api/vacuum-tests/${id}/comments`, jsonInit(as, { body, atSeconds: null })), routeParams({ id }));
  expect(res.status).toBe(201);
}

/** A mail client's one-click POST: no session, no Origin, the body RFC 8058 §3.1 prescribes. */
function oneClick(url: string) {
  return unsubscribePost(new Request(url, { method: "POST", headers: { "content-type": "application/x-www-form-urlencoded" }, body: "List-Unsubscribe=One-Click" }));
}

/** The statuses of a test's outbox rows whose subject starts so, once they are exactly `want` (sorted). */
async function waitForStatuses(testId: string, subjectStart: string, want: string[], timeoutMs = 10_000): Promise<string[]> {
  const deadline = Date.now() + timeoutMs;
  let got: string[] = [];
  while (Date.now() < deadline) {
    const rows = await db().select({ status: mailOutbox.status }).from(mailOutbox).where(and(eq(mailOutbox.testId, testId), like(mailOutbox.subject, `${subjectStart}%`)));
    got = rows.map((r) => r.status).sort();
    if (got.join() === [...want].sort().join()) return got;
    await new Promise((r) => setTimeout(r, 100));
  }
  return got;
}

const putShopMail = (as: TestMember, body: unknown) => shopMailPut(appRequest("/api/settings/mail", jsonInit(as, body, "PUT")));

describe("mail settings and unsubscribe (RFC 2369, RFC 8058)", () => {
  it("RFC 2369 §3.2 and RFC 8058 §3.1: a comment mail carries List-Unsubscribe <…?token=…>, List-Unsubscribe-Post: List-Unsubscribe=One-Click, the settings page in its body (no token), and the shop's sender name before MAIL_FROM's address", async () => {
    expect((await putShopMail(crew.owner, { senderName: "Bramblecote Heating & Air", reviewMailTo: "leads" })).status).toBe(200);
    const id = await seedTest(crew.technician, { title: "Bakery walk-in cooler" });
    await comment(id, crew.lead, "Was the core removed?");
    const mail = await waitForMail(crew.technician.email, /Comment on: Bakery walk-in cooler/);
    expect(mail.headers["list-unsubscribe"]).toMatch(new RegExp(`^<${env().BETTER_AUTH_URL}/api/mail/unsubscribe\\?token=[A-Za-z0-9_-]+\\.[A-Za-z0-9_-]+>$`));
    expect(mail.headers["list-unsubscribe-post"]).toBe("List-Unsubscribe=One-Click");
    expect(mail.text).toContain(`${env().BETTER_AUTH_URL}/settings/my-mail`);
    expect(mail.text + mail.html).not.toContain("token="); // the signed link is in the headers only
    const address = /<([^>]+)>/.exec(env().MAIL_FROM)![1];
    expect(mail.from).toBe(`"Bramblecote Heating & Air" <${address}>`);
  });

  it("RFC 8058 §3.1: the one-click POST answers 200 without a session and records the preference; the next comment mail is not sent (counted in the SMTP catcher), other kinds still are", async () => {
    const id = await seedTest(crew.technician, { title: "Pharmacy rooftop unit" });
    await comment(id, crew.lead, "First note.");
    const first = await waitForMail(crew.technician.email, /Comment on: Pharmacy rooftop unit/);
    const res = await oneClick(first.headers["list-unsubscribe"].slice(1, -1));
    expect(res.status).toBe(200);
    expect(await listMailOptOuts(db(), { organizationId: crew.technician.organizationId, userId: crew.technician.userId })).toEqual(["comment"]);

    await comment(id, crew.lead, "Second note.");
    const rows = await waitForStatuses(id, "Comment on:", ["sent", "off"]);
    expect(rows).toEqual(["off", "sent"]);
    const caught = readMailbox().filter((m) => m.to.includes(crew.technician.email) && /Comment on: Pharmacy rooftop unit/.test(m.subject));
    expect(caught.length).toBe(1);

    // A sign-off notice is another kind: it still goes.
    expect((await reviewPost(appRequest(`/api/vacuum-tests/${id}/review`, jsonInit(crew.technician, { action: "request_review" })), routeParams({ id }))).status).toBe(200);
    expect((await reviewPost(appRequest(`/api/vacuum-tests/${id}/review`, jsonInit(crew.lead, { action: "sign_off" })), routeParams({ id }))).status).toBe(200);
    const signed = await waitForMail(crew.technician.email, /Signed off: Pharmacy rooftop unit/);
    expect(signed.headers["list-unsubscribe"]).toContain("/api/mail/unsubscribe?token=");
  });

  it("RFC 8058 §3.1 (a GET must not unsubscribe): GET of the link leads to the confirmation page and changes nothing", async () => {
    const url = unsubscribeUrl({ userId: crew.trainer.userId, organizationId: crew.trainer.organizationId, kind: "review_outcome" });
    const res = await unsubscribeGet(new Request(url));
    expect(res.status).toBe(303);
    expect(res.headers.get("location")).toBe(`/mail/unsubscribe?token=${new URL(url).searchParams.get("token")}`);
    expect(await listMailOptOuts(db(), { organizationId: crew.trainer.organizationId, userId: crew.trainer.userId })).toEqual([]);
  });

  it("RFC 8058 §3.1 (the URI identifies the recipient; a signed token, our choice of HMAC-SHA256): a forged, altered or missing token is refused with 403 and changes nothing", async () => {
    const who = crew.apprentice;
    const good = new URL(unsubscribeUrl({ userId: who.userId, organizationId: who.organizationId, kind: "comment" }));
    const [payload, mac] = good.searchParams.get("token")!.split(".");
    const otherPayload = Buffer.from(JSON.stringify([who.userId, who.organizationId, "review_request"])).toString("base64url");
    const forgedMac = createHmac("sha256", "riseline-unsubscribe:not-the-secret-of-this-server-at-all").update(otherPayload).digest("base64url");
    const flipped = mac.slice(0, -1) + (mac.endsWith("A") ? "B" : "A");
    for (const token of [`${otherPayload}.${mac}`, `${otherPayload}.${forgedMac}`, `${payload}.${flipped}`, payload, "", "a.b.c"]) {
      const url = new URL(good);
      url.searchParams.set("token", token);
      const res = await oneClick(url.toString());
      expect(res.status, `token ${token}`).toBe(403);
      expect((await unsubscribeGet(new Request(url))).status).toBe(403);
    }
    expect((await oneClick(new URL("/api/mail/unsubscribe", good).toString())).status).toBe(403);
    expect(await listMailOptOuts(db(), { organizationId: who.organizationId, userId: who.userId })).toEqual([]);
  });

  it("each person turns kinds of mail off and on for themselves; invitations and password resets are not among them (product rule, no published source)", async () => {
    const put = (off: unknown) => myMailPut(appRequest("/api/settings/my-mail", jsonInit(crew.lead, { off }, "PUT")));
    expect((await put(["review_request", "rig_reminder"])).status).toBe(200);
    const got = await (await myMailGet(appRequest("/api/settings/my-mail", { as: crew.lead }))).json();
    expect(got.off.sort()).toEqual(["review_request", "rig_reminder"]);
    expect(got.kinds).not.toContain("invitation");
    const bad = await put(["invitation"]);
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.message).toMatch(/off\.0/);
    expect((await put([])).status).toBe(200);
    expect(await listMailOptOuts(db(), { organizationId: crew.lead.organizationId, userId: crew.lead.userId })).toEqual([]);
  });

  it("review requests go to the people the owner chose, not every lead; a person outside the shop cannot be chosen (400)", async () => {
    expect((await putShopMail(crew.owner, { senderName: null, reviewMailTo: [crew.trainer.userId] })).status).toBe(200);
    const id = await seedTest(crew.technician, { title: "School boiler room split" });
    expect((await reviewPost(appRequest(`/api/vacuum-tests/${id}/review`, jsonInit(crew.technician, { action: "request_review" })), routeParams({ id }))).status).toBe(200);
    await waitForMail(crew.trainer.email, /Review requested: School boiler room split/);
    const to = await db().select({ to: mailOutbox.to }).from(mailOutbox).where(and(eq(mailOutbox.testId, id), like(mailOutbox.subject, "Review requested:%")));
    expect(to.map((r) => r.to)).toEqual([crew.trainer.email]);

    const stranger = await createShop();
    const refused = await putShopMail(crew.owner, { senderName: null, reviewMailTo: [stranger.userId] });
    expect(refused.status).toBe(400);
    expect((await refused.json()).error.message).toContain("reviewMailTo");
    const now = await (await shopMailGet(appRequest("/api/settings/mail", { as: crew.owner }))).json();
    expect(now).toEqual({ senderName: null, reviewMailTo: [crew.trainer.userId] });
    expect((await putShopMail(crew.owner, { senderName: "Bad <name>", reviewMailTo: "leads" })).status).toBe(400);
    expect((await putShopMail(crew.owner, { senderName: null, reviewMailTo: "leads" })).status).toBe(200);
  });

  it("the shop's mail settings are the owner's only (OWASP ASVS 4.0.3 V4.1.3, least privilege): every other role gets 403 and nothing changes", async () => {
    for (const role of ROLES.filter((r) => r !== "owner")) {
      expect((await shopMailGet(appRequest("/api/settings/mail", { as: crew[role] }))).status, role).toBe(403);
      expect((await putShopMail(crew[role], { senderName: "Taken over", reviewMailTo: "leads" })).status, role).toBe(403);
    }
    expect((await (await shopMailGet(appRequest("/api/settings/mail", { as: crew.owner }))).json()).senderName).toBeNull();
  });
});
