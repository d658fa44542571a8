/**
 * PostgreSQL frozen (SIGSTOP to the postmaster and every backend): the port still accepts
 * connections and nothing answers, the worst case for a client without time limits. Every answer
 * is a 503 within the pool's bounds (connect 1.5 s, statement 5 s + 2 s in this profile), health
 * within its own 2 s, pages too; an upload cut off this way leaves no file and no row; once the
 * database thaws the same pool answers again.
 * OWASP ASVS 4.0.3 V11.1.7 (resilience); RFC 9110 §15.6.4 (503 Service Unavailable).
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { NextRequest } from "next/server";
import { proxy } from "@/proxy";
import { GET as health } from "@/app/api/health/route";
import { GET as testsGet, POST as testsPost } from "@/app/api/vacuum-tests/route";
import { appRequest, createShop, type TestMember } from "../helpers/members";
import { countRows, listKeys, sampleText, uploadRequest } from "../helpers/uploads";
import { postgres, timed, until } from "./parts";

const SAMPLE = "sample-1-iso-microns.csv";
let owner: TestMember;
const uncaught: unknown[] = [];
const onUncaught = (e: unknown) => uncaught.push(e);

beforeAll(async () => {
  owner = await createShop("Frozen Database Refrigeration");
  process.on("uncaughtException", onUncaught);
  process.on("unhandledRejection", onUncaught);
  // Warm the pool: idle connections that will hang once the server is frozen.
  expect((await testsGet(appRequest("/api/tests", { as: owner }))).status).toBe(200);
});
afterAll(async () => {
  postgres.thaw();
  process.off("uncaughtException", onUncaught);
  process.off("unhandledRejection", onUncaught);
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

describe("PostgreSQL frozen", () => {
  it("answers health, the list, an upload and a page with 503 within the pool's bounds, and keeps no file of the upload", async () => {
    const rowsBefore = await countRows(owner.organizationId);
    const keysBefore = await listKeys(`orgs/${owner.organizationId}/`);
    postgres.freeze();
    try {
      const h = await timed(() => health(new Request("http://127.0.0.1/api/health")));
      expect(h.value?.status).toBe(503);
      expect(h.ms).toBeLessThan(5000);

      const list = await timed(() => testsGet(appRequest("/api/tests", { as: owner })));
      expect(list.value?.status).toBe(503);
      expect((await list.value!.json()).error.code).toBe("database_unavailable");
      expect(list.ms).toBeLessThan(12_000);

      const up = await timed(() =>
        testsPost(uploadRequest("/api/tests", { as: owner, file: { body: sampleText(SAMPLE), name: SAMPLE }, headers: { "idempotency-key": randomUUID() } })),
      );
      expect(up.value?.status).toBe(503);
      expect(up.ms).toBeLessThan(20_000);

      const page = await timed(() => proxy(new NextRequest("http://127.0.0.1/tests", { headers: { cookie: owner.cookie } })));
      expect(page.value?.status).toBe(503);
      expect(page.ms).toBeLessThan(5000);
    } finally {
      postgres.thaw();
    }
    // The stored file of the cut-off upload is removed (at once, or by its queued delete job).
    await until(async () => (await listKeys(`orgs/${owner.organizationId}/`)).length === keysBefore.length, 90_000, "the cut-off upload's file to be removed");
    expect(await countRows(owner.organizationId)).toEqual(rowsBefore);
    expect(uncaught).toEqual([]);
  });

  it("answers again once it thaws, through the same pool", async () => {
    await until(async () => (await testsGet(appRequest("/api/tests", { as: owner }))).status === 200, 20_000, "the list to answer again");
    expect((await health(new Request("http://127.0.0.1/api/health"))).status).toBe(200);
  });
});
