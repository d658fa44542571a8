/**
 * Input the database cannot hold is a 422 that names the field, never a 503 that says "try again"
 * (retrying never helps) nor a 500; oversized JSON is a 413 before it is read in full.
 * OWASP ASVS 4.0.3 V5.1.3 and V13.2.2 (input validated, with a clear error), V13.1.3 and V12.1.1
 * (request size limits); RFC 9110 §15.5.14 (413) and §15.5.21 (422).
 */
import { randomUUID } from "node:crypto";
import { readdirSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { POST as customersPost } from "@/app/api/customers/route";
import { POST as sitesPost } from "@/app/api/sites/route";
import { POST as systemsPost } from "@/app/api/systems/route";
import { GET as testsGet, POST as testsPost } from "@/app/api/vacuum-tests/route";
import { env } from "@/lib/env";
import { crewForFile } from "./helpers/crew";
import { appRequest, routeParams } from "./helpers/members";
import { countRows, jsonRequest, sampleText, uploadRequest } from "./helpers/uploads";

const crew = crewForFile();

async function errorOf(res: Response) {
  return { status: res.status, ...(await res.json()).error };
}

describe("NUL characters (PostgreSQL text and jsonb refuse U+0000)", () => {
  it("in the uploaded file's name: 422 naming the file name, nothing stored", async () => {
    const before = await countRows(crew.owner.organizationId);
    const res = await testsPost(uploadRequest("/api/vacuum-tests", { as: crew.technician, file: { body: sampleText("sample-1-iso-microns.csv"), name: "log\u0000.csv" } }));
    const e = await errorOf(res);
    expect(e.status).toBe(422);
    expect(e.code).toBe("unstorable_input");
    expect(e.message).toMatch(/^file name: contains a NUL character/);
    expect(await countRows(crew.owner.organizationId)).toEqual(before);
  });

  it("in a form field of an upload: 422 naming form.title", async () => {
    const res = await testsPost(uploadRequest("/api/vacuum-tests", { as: crew.technician, file: { body: sampleText("sample-1-iso-microns.csv"), name: "a.csv" }, fields: { title: "Roof\u0000top" } }));
    expect(await errorOf(res)).toMatchObject({ status: 422, message: expect.stringMatching(/^form\.title: contains a NUL/) });
  });

  it("in a JSON field: 422 naming body.name", async () => {
    const res = await sitesPost(jsonRequest("/api/sites", { name: "Mill\u0000 Road" }, crew.owner));
    expect(await errorOf(res)).toMatchObject({ status: 422, code: "unstorable_input", details: { field: "body.name" } });
  });

  it("in typed readings: 422 naming the reading", async () => {
    const readings = Array.from({ length: 6 }, (_, i) => ({ time: i === 3 ? "00:0\u00003" : `00:0${i}`, microns: 400 }));
    const res = await testsPost(jsonRequest("/api/vacuum-tests", { timeMode: "clock", readings }, crew.technician));
    expect(await errorOf(res)).toMatchObject({ status: 422, message: expect.stringMatching(/^body\.readings\[3\]\.time: contains a NUL/) });
  });

  it("in a query parameter: 422 naming it", async () => {
    const res = await testsGet(appRequest("/api/vacuum-tests?technicianId=a%00b", { as: crew.owner }));
    expect(await errorOf(res)).toMatchObject({ status: 422, message: expect.stringMatching(/^query\.technicianId: contains a NUL/) });
  });
});

describe("numbers no column can hold", () => {
  it("a JSON number beyond double precision (1e400 reads as Infinity): 422 naming the field", async () => {
    const raw = `{"siteId":"${randomUUID()}","name":"Big","factoryChargeKg":1e400}`;
    const res = await systemsPost(appRequest("/api/systems", { method: "POST", as: crew.owner, body: raw, headers: { "content-type": "application/json" } }));
    expect(await errorOf(res)).toMatchObject({ status: 422, code: "unstorable_input", details: { field: "body.factoryChargeKg" } });
  });

  it("a log whose time column steps by 1e305 s: 422 saying the time column is out of range, nothing stored (not 503)", async () => {
    const rows = ["Time (s),Vacuum (microns)", ...Array.from({ length: 40 }, (_, i) => `${i * 1e305},${i < 10 ? 5000 - i * 450 : 450 + i}`)];
    const before = await countRows(crew.owner.organizationId);
    const res = await testsPost(uploadRequest("/api/vacuum-tests", { as: crew.technician, file: { body: rows.join("\n"), name: "huge-steps.csv" } }));
    const e = await errorOf(res);
    expect(e.status).toBe(422);
    expect(e.code).toBe("invalid_file");
    expect(e.message).toMatch(/^time column: the readings span .*more than 30 years/);
    expect(await countRows(crew.owner.organizationId)).toEqual(before);
  });

  it("typed readings minutes of 1e305: 422, not 503", async () => {
    const readings = Array.from({ length: 8 }, (_, i) => ({ time: i * 1e305, microns: 400 + i }));
    const res = await testsPost(jsonRequest("/api/vacuum-tests", { timeMode: "minutes", readings }, crew.technician));
    expect((await errorOf(res)).status).toBe(422);
  });
});

describe("JSON body caps (413 before the body is read in full)", () => {
  it("a declared Content-Length over the cap: 413 body_too_large with the limit", async () => {
    const big = JSON.stringify({ name: "x".repeat(env().MAX_JSON_BYTES + 10) });
    const res = await customersPost(appRequest("/api/customers", { method: "POST", as: crew.owner, body: big, headers: { "content-type": "application/json", "content-length": String(big.length) } }));
    expect(await errorOf(res)).toMatchObject({ status: 413, code: "body_too_large", details: { limitBytes: env().MAX_JSON_BYTES } });
  });

  it("a chunked 40 MB body without Content-Length: 413 after reading no more than the cap", async () => {
    let sent = 0;
    const chunk = new TextEncoder().encode("x".repeat(64 * 1024));
    const body = new ReadableStream<Uint8Array>({
      start(c) {
        c.enqueue(new TextEncoder().encode('{"name":"'));
      },
      pull(c) {
        if (sent >= 40 * 1024 * 1024) return c.close();
        sent += chunk.byteLength;
        c.enqueue(chunk);
      },
    });
    const req = new Request(new URL("/api/customers", env().BETTER_AUTH_URL), {
      method: "POST", body, headers: { "content-type": "application/json", cookie: crew.owner.cookie, origin: env().BETTER_AUTH_URL }, duplex: "half",
    } as RequestInit & { duplex: "half" });
    const res = await customersPost(req);
    expect(res.status).toBe(413);
    expect(sent).toBeLessThan(env().MAX_JSON_BYTES + 4 * chunk.byteLength);
  });
});

describe("no 5xx on bad input, on any state-changing route", () => {
  const root = path.resolve(import.meta.dirname, "../app/api");
  const files = (dir: string): string[] =>
    readdirSync(dir).flatMap((n) => (statSync(path.join(dir, n)).isDirectory() ? files(path.join(dir, n)) : n === "route.ts" ? [path.join(dir, n)] : []));
  const bodies = ["{", "[]", '"text"', "null", '{"name":"\\u0000"}', '{"title":1e400,"name":[{"a":{}}]}', JSON.stringify({ x: "y".repeat(5000), nested: { a: [1, 2, { b: null }] } })];

  it.each(files(root).filter((f) => !f.includes("[...")).map((f) => [path.relative(root, f), f] as const))("%s", async (_name, file) => {
    const mod = (await import(file)) as Record<string, (req: Request, ctx: unknown) => Promise<Response>>;
    const params = Object.fromEntries([...file.matchAll(/\[([^\]]+)\]/g)].map((m) => [m[1], randomUUID()]));
    for (const method of ["POST", "PUT", "PATCH", "DELETE"].filter((m) => typeof mod[m] === "function")) {
      for (const body of bodies) {
        const res = await mod[method](appRequest("/x", { method, as: crew.owner, body, headers: { "content-type": "application/json" } }), routeParams(params));
        expect(res.status, `${method} ${file} with ${body.slice(0, 40)}: ${await res.clone().text()}`).toBeLessThan(500);
      }
    }
  });
});
