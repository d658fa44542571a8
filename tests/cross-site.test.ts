/**
 * Cross-site request forgery, refused in the one route wrapper and on better-auth's routes alike:
 * OWASP Cross-Site Request Forgery Prevention Cheat Sheet — "Verifying Origin with Standard
 * Headers" (a foreign or `null` Origin is refused), "Fetch Metadata headers" (Sec-Fetch-Site
 * cross-site or same-site refused when Origin is missing), and the content-type note (a JSON API
 * takes application/json only, so a form or text/plain "simple request" cannot reach it). OWASP
 * ASVS 4.0.3 V13.2.3 and V4.2.2.
 */
import { describe, expect, it } from "vitest";
import { POST as authPost } from "@/app/api/auth/[...all]/route";
import { POST as invitePost } from "@/app/api/members/invitations/route";
import { POST as sitesPost } from "@/app/api/sites/route";
import { POST as testsPost } from "@/app/api/vacuum-tests/route";
import { env } from "@/lib/env";
import { crewForFile } from "./helpers/crew";
import { uniqueEmail, type TestMember } from "./helpers/members";
import { countRows, sampleText } from "./helpers/uploads";

const crew = crewForFile();

/** A request as a browser would send it from some page, with the member's cookie attached. */
function browserRequest(path: string, as: TestMember | null, headers: Record<string, string>, body: BodyInit) {
  const h = new Headers(headers);
  if (as) h.set("cookie", as.cookie);
  return new Request(new URL(path, env().BETTER_AUTH_URL), { method: "POST", headers: h, body });
}

const site = (name: string) => JSON.stringify({ name });
const OURS = () => new URL(env().BETTER_AUTH_URL).origin;
/** The S3 store on the same host: the same site, another origin. */
const SAME_SITE = () => env().S3_ENDPOINT.replace(/\/$/, "");

describe("the same-origin check on state-changing requests (OWASP CSRF Prevention Cheat Sheet)", () => {
  it.each([
    ["a foreign Origin", { origin: "https://attacker.example" }],
    ["Origin: null (a sandboxed frame or a file: page)", { origin: "null" }],
    ["the S3 store's origin on the same host (same site, not same origin)", { origin: "__SAME_SITE__" }],
    ["no Origin but Sec-Fetch-Site: cross-site", { "sec-fetch-site": "cross-site" }],
    ["no Origin but Sec-Fetch-Site: same-site", { "sec-fetch-site": "same-site" }],
    ["no Origin, no Fetch Metadata, a foreign Referer", { referer: "https://attacker.example/page" }],
  ])("refuses %s with 403 cross_site and writes nothing", async (_what, headers) => {
    const h = Object.fromEntries(Object.entries(headers).map(([k, v]) => [k, v === "__SAME_SITE__" ? SAME_SITE() : v]));
    const before = await countRows(crew.owner.organizationId);
    const res = await sitesPost(browserRequest("/api/sites", crew.owner, { ...h, "content-type": "application/json" }, site("Forged site")));
    expect(res.status).toBe(403);
    expect((await res.json()).error.code).toBe("cross_site");
    expect(await countRows(crew.owner.organizationId)).toEqual(before);
  });

  it.each([
    ["our Origin", { origin: "__OURS__" }],
    ["no Origin but Sec-Fetch-Site: same-origin", { "sec-fetch-site": "same-origin" }],
    ["no browser headers at all (a script with a session, not a browser)", {}],
  ])("lets %s through", async (_what, headers) => {
    const h = Object.fromEntries(Object.entries(headers).map(([k, v]) => [k, v === "__OURS__" ? OURS() : v]));
    const res = await sitesPost(browserRequest("/api/sites", crew.owner, { ...h, "content-type": "application/json" }, site("Real site")));
    expect(res.status).toBe(201);
  });

  it("refuses the forged owner's invitation of the attack (foreign Origin): no invitation, no mail", async () => {
    const res = await invitePost(
      browserRequest("/api/members/invitations", crew.owner, { origin: SAME_SITE(), "content-type": "application/json" }, JSON.stringify({ email: uniqueEmail("attacker"), role: "lead" })),
    );
    expect(res.status).toBe(403);
  });

  it("refuses a multipart upload posted from another origin (a form on a foreign page)", async () => {
    const form = new FormData();
    form.set("file", new File([sampleText("sample-1-iso-microns.csv")], "log.csv", { type: "text/csv" }));
    const res = await testsPost(browserRequest("/api/vacuum-tests", crew.technician, { origin: "https://attacker.example" }, form));
    expect(res.status).toBe(403);
  });

  it("applies to better-auth's routes too (sign-out from another origin is refused)", async () => {
    const res = await authPost(browserRequest("/api/auth/sign-out", crew.owner, { origin: "https://attacker.example", "content-type": "application/json" }, "{}"));
    expect(res.status).toBe(403);
    expect((await res.json()).code).toBe("CROSS_SITE");
  });
});

describe("JSON only as application/json, multipart only where a route takes files (OWASP ASVS 4.0.3 V13.1.5)", () => {
  it.each(["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x", "application/json-patch+json"])(
    "refuses a JSON route's body sent as %s with 415, from our own origin too",
    async (type) => {
      const res = await sitesPost(browserRequest("/api/sites", crew.owner, { origin: OURS(), "content-type": type }, site("Wrong type")));
      expect(res.status).toBe(415);
      expect((await res.json()).error.code).toBe("unsupported_media_type");
    },
  );

  it("refuses a body with no Content-Type at all (415)", async () => {
    const res = await sitesPost(browserRequest("/api/sites", crew.owner, { origin: OURS(), "content-length": "20" }, site("No type")));
    expect(res.status).toBe(415);
  });

  it("accepts application/json with a charset parameter", async () => {
    const res = await sitesPost(browserRequest("/api/sites", crew.owner, { origin: OURS(), "content-type": "application/json; charset=utf-8" }, site("With charset")));
    expect(res.status).toBe(201);
  });

  it("refuses text/plain on better-auth's sign-in (the simple-request door) with 415", async () => {
    const res = await authPost(browserRequest("/api/auth/sign-in/email", null, { origin: OURS(), "content-type": "text/plain" }, JSON.stringify({ email: crew.owner.email, password: crew.owner.password })));
    expect(res.status).toBe(415);
  });
});
