import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { shareLinks } from "@/db/schema";
import { GET as linksGet, POST as linksPost } from "@/app/api/vacuum-tests/[id]/share-links/route";
import { DELETE as linkDelete } from "@/app/api/vacuum-tests/[id]/share-links/[linkId]/route";
import { GET as sharedPdf } from "@/app/share/[token]/pdf/route";
import { createShareLink, hashShareToken, resolveShareToken } from "@/lib/reports/share";
import { appRequest, createCrew, createShop, routeParams, type TestMember } from "./helpers/members";
import { seedTest } from "./helpers/seed-test";
import type { Role } from "@/lib/permissions";

let crew: Record<Role, TestMember>;
let testId: string;
beforeAll(async () => {
  crew = await createCrew();
  testId = await seedTest(crew.technician, { title: "Shared rooftop test" });
});
afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

const create = (as: TestMember, body: unknown = {}) =>
  linksPost(appRequest(`/api/vacuum-tests/${testId}/share-links`, { method: "POST", as, body: JSON.stringify(body), headers: { "content-type": "application/json" } }), routeParams({ id: testId }));
const tokenOf = (url: string) => new URL(url).pathname.split("/").pop()!;

describe("share links (reports.share is owner + lead, DEVELOPERS.md)", () => {
  it("a token carries 256 random bits and only its SHA-256 is stored (product rule ≥ 128 bits; from memory, OWASP asks for at least 64 bits of entropy)", async () => {
    const res = await create(crew.lead, { expiresInDays: 7 });
    expect(res.status).toBe(201);
    const { url, id } = await res.json();
    const token = tokenOf(url);
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/); // 32 bytes in base64url = 43 characters
    const [row] = await db().select().from(shareLinks).where(eq(shareLinks.id, id));
    expect(row.tokenHash).toBe(hashShareToken(token));
    expect(JSON.stringify(row)).not.toContain(token);
    const pdf = await sharedPdf(new Request(url + "/pdf"), routeParams({ token }));
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
  });

  it("expires at its time: valid a second before, expired at and after (fixed clocks)", async () => {
    // Made 1 day + 1 s ago with a 1-day life: the real clock (public PDF route) already sees it expired.
    const t0 = new Date(Date.now() - 86_400_000 - 1000);
    const expiresAt = new Date(t0.getTime() + 86_400_000);
    const link = await createShareLink(db(), { organizationId: crew.owner.organizationId, testId, actorId: crew.lead.userId, expiresInDays: 1, now: t0 });
    const before = await resolveShareToken(db(), { token: link.token, now: new Date(expiresAt.getTime() - 1000) });
    expect(before).toMatchObject({ status: "ok", testId, organizationId: crew.owner.organizationId });
    expect((await resolveShareToken(db(), { token: link.token, now: expiresAt })).status).toBe("expired");
    expect((await sharedPdf(new Request(link.url + "/pdf"), routeParams({ token: link.token }))).status).toBe(404);
  });

  it("revocation stops the link at once; listing shows it revoked and never the token", async () => {
    const { url, id } = await (await create(crew.owner)).json();
    const token = tokenOf(url);
    expect((await resolveShareToken(db(), { token })).status).toBe("ok");
    const del = await linkDelete(appRequest(`/api/vacuum-tests/${testId}/share-links/${id}`, { method: "DELETE", as: crew.lead }), routeParams({ id: testId, linkId: id }));
    expect(del.status).toBe(200);
    expect((await resolveShareToken(db(), { token })).status).toBe("revoked");
    expect((await sharedPdf(new Request(url + "/pdf"), routeParams({ token }))).status).toBe(404);
    const list = await (await linksGet(appRequest(`/api/vacuum-tests/${testId}/share-links`, { as: crew.lead }), routeParams({ id: testId }))).json();
    expect(list.links.find((l: { id: string }) => l.id === id).state).toBe("revoked");
    expect(JSON.stringify(list)).not.toContain(token);
  });

  it("technicians cannot share (403); another shop cannot share or revoke (404); a made-up token is unknown", async () => {
    expect((await create(crew.technician)).status).toBe(403);
    const stranger = await createShop();
    expect((await create(stranger)).status).toBe(404);
    const { id } = await (await create(crew.lead)).json();
    expect((await linkDelete(appRequest(`/api/vacuum-tests/${testId}/share-links/${id}`, { method: "DELETE", as: stranger }), routeParams({ id: testId, linkId: id }))).status).toBe(404);
    expect((await resolveShareToken(db(), { token: "A".repeat(43) })).status).toBe("unknown");
    expect((await resolveShareToken(db(), { token: "../../etc" })).status).toBe("unknown");
  });
});
