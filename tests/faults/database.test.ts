/**
 * PostgreSQL stopped — while the pool holds idle connections, and in the middle of an upload's
 * transaction. Every answer is a 503 within a few seconds (health, the session lookup, uploads,
 * sign-in, pages), never a 500 or an uncaught exception; no session token reaches the log; nothing
 * half-written remains; once PostgreSQL is back the same pool answers again.
 * OWASP ASVS 4.0.3 V7.1.1/V7.1.2 (no session tokens or credentials in logs), V11.1.7 (resilience).
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { NextRequest } from "next/server";
import { proxy } from "@/proxy";
import { POST as authPost } from "@/app/api/auth/[...all]/route";
import { GET as health } from "@/app/api/health/route";
import { GET as testsGet, POST as testsPost } from "@/app/api/vacuum-tests/route";
import { db } from "@/db/client";
import { setUploadFaultForTests } from "@/lib/vacuum-tests/upload";
import { appRequest, createShop, PASSWORD, type TestMember } from "../helpers/members";
import { countRows, listKeys, sampleText, uploadRequest } from "../helpers/uploads";
import { consistencyOf, postgres, timed } from "./parts";

const SAMPLE = "sample-1-iso-microns.csv";
let owner: TestMember;
const uncaught: unknown[] = [];
const onUncaught = (e: unknown) => uncaught.push(e);
let stderrText = "";
const realWrite = process.stderr.write.bind(process.stderr);

beforeAll(async () => {
  owner = await createShop("Database Fault Mechanical");
  process.on("uncaughtException", onUncaught);
  process.on("unhandledRejection", onUncaught);
  process.stderr.write = ((chunk: unknown, ...rest: unknown[]) => {
    stderrText += String(chunk);
    return (realWrite as (...a: unknown[]) => boolean)(chunk, ...rest);
  }) as typeof process.stderr.write;
});
afterAll(async () => {
  process.stderr.write = realWrite;
  process.off("uncaughtException", onUncaught);
  process.off("unhandledRejection", onUncaught);
  postgres.start();
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

const upload = (key = randomUUID()) =>
  testsPost(uploadRequest("/api/vacuum-tests", { as: owner, file: { body: sampleText(SAMPLE), name: SAMPLE }, headers: { "idempotency-key": key } }));
/** The session token in the member's cookie (before its signature). */
const sessionToken = () => decodeURIComponent(/better-auth\.session_token=([^;]+)/.exec(owner.cookie)![1]).split(".")[0];

describe("PostgreSQL stopped", () => {
  it("while the pool holds idle connections: the broken connections are logged, never an uncaught exception", async () => {
    await Promise.all(Array.from({ length: 5 }, () => db().execute(sql`select pg_sleep(0.05)`))); // five pooled connections
    postgres.stop(); // fast shutdown: "terminating connection due to administrator command"
    await new Promise((r) => setTimeout(r, 500));
    expect(uncaught).toEqual([]);
    expect(stderrText).toMatch(/database connection lost/);
  });

  it("answers health, the session lookup, uploads and sign-in with 503 within a few seconds; no token in the log", async () => {
    const before = await listKeys(`orgs/${owner.organizationId}/`);
    const h = await timed(() => health(new Request("http://127.0.0.1/api/health")));
    expect(h.value?.status).toBe(503);
    expect(await h.value!.json()).toMatchObject({ database: "unreachable", bucket: "ok" });
    expect(h.ms).toBeLessThan(5000); // its own checks stop at 2 s; the rest is a busy machine

    const list = await timed(() => testsGet(appRequest("/api/vacuum-tests", { as: owner })));
    expect(list.value?.status).toBe(503);
    expect((await list.value!.json()).error.code).toBe("database_unavailable");
    expect(list.value!.headers.get("retry-after")).toBeTruthy();
    expect(list.ms).toBeLessThan(6000);

    const up = await timed(() => upload());
    expect(up.value?.status).toBe(503);
    expect(up.ms).toBeLessThan(8000);
    expect(await listKeys(`orgs/${owner.organizationId}/`)).toEqual(before);

    const signIn = await timed(() =>
      authPost(appRequest("/api/auth/sign-in/email", { method: "POST", body: JSON.stringify({ email: owner.email, password: PASSWORD }), headers: { "content-type": "application/json" } })),
    );
    expect(signIn.value?.status).toBe(503);
    expect(signIn.ms).toBeLessThan(8000);

    // A page (through the proxy that runs before every request): a 503 that says why, not a 500.
    const page = await timed(() => proxy(new NextRequest("http://127.0.0.1/tests", { headers: { cookie: owner.cookie } })));
    expect(page.value?.status).toBe(503);
    expect(page.value!.headers.get("retry-after")).toBe("30");
    expect(page.value!.headers.get("content-security-policy")).toContain("nonce-");
    expect(await page.value!.text()).toContain("Nothing you saved is lost");
    expect(page.ms).toBeLessThan(6000);

    expect(stderrText).not.toContain(sessionToken());
    expect(stderrText).not.toContain(PASSWORD);
    expect(uncaught).toEqual([]);
  });

  it("answers again once PostgreSQL is back, through the same pool", async () => {
    postgres.start();
    expect((await testsGet(appRequest("/api/vacuum-tests", { as: owner }))).status).toBe(200);
    expect((await upload()).status).toBe(201);
    expect((await health(new Request("http://127.0.0.1/api/health"))).status).toBe(200);
    const page = await proxy(new NextRequest("http://127.0.0.1/tests", { headers: { cookie: owner.cookie } }));
    expect(page.status).toBe(200); // passed on to the page
  });
});

describe("PostgreSQL stopped in the middle of an upload's transaction", () => {
  it("answers 503, deletes the stored file, and leaves no row once the database is back", async () => {
    const before = await countRows(owner.organizationId);
    const key = randomUUID();
    setUploadFaultForTests(async () => {
      postgres.stop();
    });
    let res: Response;
    try {
      res = await upload(key);
    } finally {
      setUploadFaultForTests(null);
      postgres.start();
    }
    expect(res.status).toBe(503);
    expect(await countRows(owner.organizationId)).toEqual(before);
    expect(await consistencyOf(owner.organizationId)).toMatchObject({ halfWritten: [], brokenFiles: [], orphanObjects: [] });
    // The retry with the same key makes the test exactly once.
    expect((await upload(key)).status).toBe(201);
    expect((await upload(key)).status).toBe(200);
    expect((await countRows(owner.organizationId)).tests - before.tests).toBe(1);
    expect(uncaught).toEqual([]);
  });
});
