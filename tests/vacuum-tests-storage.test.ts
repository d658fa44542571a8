/**
 * Failure handling of the upload pipeline: limits and file types refused before anything is kept,
 * and each store failing in turn with nothing left behind on either side.
 *
 * Seams: lib/storage.ts setStorageClientForTests swaps the S3 client for one aimed at a closed
 * port; lib/vacuum-tests/upload.ts setUploadFaultForTests runs a statement inside the upload
 * transaction that violates a real constraint (a second uploads row with the same object_key).
 */
import { afterEach, beforeAll, describe, expect, it } from "vitest";
import { S3Client } from "@aws-sdk/client-s3";
import { sql } from "drizzle-orm";
import { createServer } from "node:net";
import { POST as testsPost } from "@/app/api/vacuum-tests/route";
import { setStorageClientForTests } from "@/lib/storage";
import { setUploadFaultForTests } from "@/lib/vacuum-tests/upload";
import { appRequest, createShop, type TestMember } from "./helpers/members";
import { countRows, listKeys, sampleText, uploadRequest } from "./helpers/uploads";

// A small limit for this file only (env() reads it on first use, after this line).
process.env.MAX_UPLOAD_BYTES = String(256 * 1024);

const SAMPLE = "sample-1-iso-microns.csv";
const empty = { tests: 0, uploads: 0, analyses: 0, findings: 0, idempotencyKeys: 0, sites: 0 };

async function post(as: TestMember, file: { body: string | Uint8Array; name: string; type?: string }, fields: Record<string, string> = {}) {
  const res = await testsPost(uploadRequest("/api/vacuum-tests", { as, file, fields }));
  return { status: res.status, body: await res.json() };
}

/** A port on loopback with nothing listening (bound, then closed). */
async function deadPort(): Promise<number> {
  const srv = createServer();
  await new Promise<void>((r) => srv.listen(0, "127.0.0.1", () => r()));
  const port = (srv.address() as { port: number }).port;
  await new Promise<void>((r) => srv.close(() => r()));
  return port;
}

describe("refused before anything is stored", () => {
  let owner: TestMember;
  beforeAll(async () => {
    owner = await createShop();
  });
  afterEach(async () => {
    expect(await countRows(owner.organizationId)).toEqual(empty);
    expect(await listKeys(`orgs/${owner.organizationId}/`)).toEqual([]);
  });

  it("answers 413 for a file over MAX_UPLOAD_BYTES by its actual size (RFC 9110 §15.5.14 413)", async () => {
    const big = "time,microns\n" + "0,500\n".repeat(60_000); // ≈ 360 kB > 256 KiB
    const r = await post(owner, { body: big, name: "big.csv" });
    expect(r.status).toBe(413);
    expect(r.body.error.code).toBe("file_too_large");
  });

  it("answers 413 from Content-Length alone, before reading the body (RFC 9110 §15.5.14 413)", async () => {
    let pulled = 0;
    const endless = new ReadableStream<Uint8Array>({
      pull(c) {
        pulled++;
        c.enqueue(new Uint8Array(64 * 1024));
      },
    });
    const req = appRequest("/api/vacuum-tests", {
      as: owner,
      method: "POST",
      body: endless,
      headers: { "content-type": "multipart/form-data; boundary=x", "content-length": String(10 * 1024 * 1024) },
      duplex: "half",
    } as RequestInit & { as: TestMember });
    const res = await testsPost(req);
    expect(res.status).toBe(413);
    // a stream is pulled a little ahead of the reader; reading it all would take ≫ 10 chunks
    expect(pulled).toBeLessThan(10);
  });

  it("answers 415 for an image by content type, and for NUL bytes sent as text/csv (RFC 9110 §15.5.16 415)", async () => {
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    expect((await post(owner, { body: png, name: "photo.png", type: "image/png" })).status).toBe(415);
    const nul = new TextEncoder().encode("time,microns\n0,500\n1,\u0000\u0000\u0000\n");
    const r = await post(owner, { body: nul, name: "log.csv", type: "text/csv" });
    expect(r.status).toBe(415);
    expect(r.body.error.message).toMatch(/binary/);
    const xlsx = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2, 3, 4]);
    expect((await post(owner, { body: xlsx, name: "log.xlsx", type: "application/octet-stream" })).status).toBe(415);
  });

  it("answers 422 with the importer's line-specific message for an unreadable log, quick-created site included (RFC 9110 §15.5.21 422)", async () => {
    const r = await post(owner, { body: "time,microns\n13:00:00,500\n13:00:10,510\n", name: "short.csv" }, { newSiteName: "Never saved" });
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe("invalid_file");
    expect(r.body.error.details.reason).toBe("too_few_readings");
    expect(r.body.error.message).toMatch(/usable reading/);
  });
});

describe("a store fails mid-upload: 503 and no orphan on either side", () => {
  let owner: TestMember;
  beforeAll(async () => {
    owner = await createShop();
  });
  afterEach(() => {
    setStorageClientForTests(null);
    setUploadFaultForTests(null);
  });

  it("with S3 down, answers 503 storage_unavailable and writes no rows (RFC 9110 §15.6.4 503)", async () => {
    const port = await deadPort();
    setStorageClientForTests(
      new S3Client({ region: "us-east-1", endpoint: `http://127.0.0.1:${port}`, forcePathStyle: true, maxAttempts: 1, credentials: { accessKeyId: "x", secretAccessKey: "x" } }),
    );
    const r = await post(owner, { body: sampleText(SAMPLE), name: SAMPLE }, { newSiteName: "Rolled back site" });
    expect(r.status).toBe(503);
    expect(r.body.error.code).toBe("storage_unavailable");
    expect(await countRows(owner.organizationId)).toEqual(empty);
  });

  it("with the transaction failing on a constraint, answers 409 (a retry cannot help, so not 503), rolls back every row and deletes the stored object (compensation)", async () => {
    let seenKey = "";
    setUploadFaultForTests(async (tx, ctx) => {
      seenKey = ctx.objectKey;
      // the object must be in the bucket at this point, or the compensation below proves nothing
      expect(await listKeys(ctx.objectKey)).toEqual([ctx.objectKey]);
      await tx.execute(sql`insert into uploads (organization_id, test_id, object_key, sha256, size_bytes, filename, content_type)
        values (${owner.organizationId}, ${ctx.testId}, ${ctx.objectKey}, 'x', 1, 'dup.csv', 'text/csv')`); // unique object_key violated
    });
    const r = await post(owner, { body: sampleText(SAMPLE), name: SAMPLE }, { newSiteName: "Rolled back site" });
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe("conflict");
    expect(seenKey).toMatch(new RegExp(`^orgs/${owner.organizationId}/tests/`));
    expect(await listKeys(`orgs/${owner.organizationId}/`)).toEqual([]);
    expect(await countRows(owner.organizationId)).toEqual(empty);
  });

  it("works again once both stores are back (the seams leave no state behind)", async () => {
    const r = await post(owner, { body: sampleText(SAMPLE), name: SAMPLE });
    expect(r.status).toBe(201);
    expect(await listKeys(`orgs/${owner.organizationId}/`)).toHaveLength(1);
    expect((await countRows(owner.organizationId)).tests).toBe(1);
  });
});
