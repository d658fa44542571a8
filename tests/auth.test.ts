import { describe, expect, it } from "vitest";
import { POST as authPost, GET as authGet } from "@/app/api/auth/[...all]/route";
import { appRequest, createShop, uniqueEmail, PASSWORD } from "./helpers/members";
import { waitForMail, firstAppLink } from "./helpers/mailbox";

const json = (body: unknown) => ({ method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } });

describe("sign-in with e-mail and password", () => {
  it("signs up, signs in, reads the session and signs out", async () => {
    const email = uniqueEmail("tech");
    const up = await authPost(appRequest("/api/auth/sign-up/email", json({ email, password: PASSWORD, name: "Tess Tech" })));
    expect(up.status).toBe(200);
    const inRes = await authPost(appRequest("/api/auth/sign-in/email", json({ email, password: PASSWORD })));
    expect(inRes.status).toBe(200);
    const setCookie = inRes.headers.getSetCookie().join(";");
    expect(setCookie).toMatch(/HttpOnly/i);
    const cookie = inRes.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
    const sess = await authGet(appRequest("/api/auth/get-session", { headers: { cookie } }));
    expect((await sess.json())?.user?.email).toBe(email);
    const out = await authPost(appRequest("/api/auth/sign-out", { method: "POST", headers: { cookie } }));
    expect(out.status).toBe(200);
    const after = await authGet(appRequest("/api/auth/get-session", { headers: { cookie } }));
    expect(await after.json()).toBeNull();
  });

  it("refuses a wrong password with 401", async () => {
    const owner = await createShop();
    const res = await authPost(appRequest("/api/auth/sign-in/email", json({ email: owner.email, password: "not-the-password" })));
    expect(res.status).toBe(401);
  });

  it("resets a password through the link in the caught e-mail", async () => {
    const owner = await createShop();
    const ask = await authPost(appRequest("/api/auth/request-password-reset", json({ email: owner.email, redirectTo: "/reset-password" })));
    expect(ask.status).toBe(200);
    const mail = await waitForMail(owner.email, /reset/i);
    const link = new URL(firstAppLink(mail));
    const token = link.pathname.split("/").pop()!;
    expect(token.length).toBeGreaterThan(10);
    const reset = await authPost(appRequest("/api/auth/reset-password", json({ token, newPassword: "a-brand-new-password" })));
    expect(reset.status).toBe(200);
    const oldPw = await authPost(appRequest("/api/auth/sign-in/email", json({ email: owner.email, password: PASSWORD })));
    expect(oldPw.status).toBe(401);
    const newPw = await authPost(appRequest("/api/auth/sign-in/email", json({ email: owner.email, password: "a-brand-new-password" })));
    expect(newPw.status).toBe(200);
  });
});
