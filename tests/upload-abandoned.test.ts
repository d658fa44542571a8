/**
 * An upload nobody waits for any more is never committed: when the request's signal aborts (the
 * client disconnected; Next.js aborts `request.signal` then) before the commit, the transaction
 * is rolled back and the stored file deleted, so a later retry with the same Idempotency-Key makes
 * the test exactly once. (IETF Idempotency-Key draft §2.6; OWASP ASVS 4.0.3 V11.1.7.)
 */
import { randomUUID } from "node:crypto";
import { afterEach, describe, expect, it } from "vitest";
import { POST as testsPost } from "@/app/api/vacuum-tests/route";
import { setUploadFaultForTests } from "@/lib/vacuum-tests/upload";
import { crewForFile } from "./helpers/crew";
import { countRows, listKeys, sampleText, uploadRequest } from "./helpers/uploads";

const crew = crewForFile();
const SAMPLE = "sample-1-iso-microns.csv";

afterEach(() => setUploadFaultForTests(null));

function request(key: string, signal?: AbortSignal) {
  const base = uploadRequest("/api/vacuum-tests", { as: crew.technician, file: { body: sampleText(SAMPLE), name: SAMPLE }, headers: { "idempotency-key": key } });
  return signal ? new Request(base, { signal }) : base;
}

describe("an upload whose client goes away", () => {
  it("gone during the transaction: nothing committed, the file deleted; the retry makes the test once", async () => {
    const org = crew.technician.organizationId;
    const before = await countRows(org);
    const keysBefore = await listKeys(`orgs/${org}/`);
    const client = new AbortController();
    let reachedCommit = false;
    setUploadFaultForTests(async () => {
      reachedCommit = true;
      client.abort(); // the phone lost its signal just before the commit
    });
    await testsPost(request(randomUUID(), client.signal)).catch(() => null);
    expect(reachedCommit).toBe(true);
    expect(await countRows(org)).toEqual(before);
    expect(await listKeys(`orgs/${org}/`)).toEqual(keysBefore);
  });

  it("gone before the file was stored: nothing stored at all", async () => {
    const org = crew.technician.organizationId;
    const before = await countRows(org);
    const client = new AbortController();
    client.abort();
    const res = await testsPost(request(randomUUID(), client.signal)).catch(() => null);
    expect(res === null || res.status >= 400).toBe(true);
    expect(await countRows(org)).toEqual(before);
  });

  it("the same key sent again afterwards: 201 once, then 200 with the same test", async () => {
    const key = randomUUID();
    const client = new AbortController();
    setUploadFaultForTests(async () => client.abort());
    await testsPost(request(key, client.signal)).catch(() => null);
    setUploadFaultForTests(null);
    const first = await testsPost(request(key));
    const again = await testsPost(request(key));
    expect([first.status, again.status]).toEqual([201, 200]);
    expect((await again.json()).test.id).toBe((await first.json()).test.id);
  });
});
