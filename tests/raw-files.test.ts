/**
 * Raw logs are harmless whoever serves them (OWASP ASVS 4.0.3 V12.5.2: untrusted files are served
 * as attachments with a safe Content-Type; V12.3.1: the user's file name never builds a path):
 * stored and served as text/csv with Content-Disposition: attachment and an RFC 6266 file name in
 * its RFC 5987 UTF-8 form, whatever the uploader's browser claimed — also when the S3 store is
 * asked without the link's signature or parameters (a fake store ignores signatures).
 */
import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { GET as rawGet } from "@/app/api/vacuum-tests/[id]/raw/route";
import { POST as testsPost } from "@/app/api/vacuum-tests/route";
import { db } from "@/db/client";
import { uploads } from "@/db/schema";
import { attachmentDisposition, rfc5987Value, safeFilename } from "@/lib/http/content-disposition";
import { rawLogKey } from "@/lib/storage";
import { crewForFile } from "./helpers/crew";
import { appRequest, routeParams } from "./helpers/members";
import { sampleText, sha256, uploadRequest } from "./helpers/uploads";

const crew = crewForFile();
const SAMPLE = "sample-1-iso-microns.csv";

/** The file name a browser reads from Content-Disposition: filename* (RFC 5987) over filename (RFC 6266 §4.3). */
function filenameFrom(disposition: string): string | null {
  const ext = /filename\*\s*=\s*([^']*)'[^']*'([^;]+)/i.exec(disposition);
  if (ext) return decodeURIComponent(ext[2].trim());
  const plain = /filename\s*=\s*"([^"]*)"/i.exec(disposition);
  return plain ? plain[1] : null;
}

async function upload(name: string, type: string, body = sampleText(SAMPLE)) {
  const res = await testsPost(uploadRequest("/api/vacuum-tests", { as: crew.technician, file: { body, name, type } }));
  expect(res.status, await res.clone().text()).toBe(201);
  return (await res.json()).test.id as string;
}

async function rawLink(testId: string): Promise<string> {
  const res = await rawGet(appRequest(`/api/vacuum-tests/${testId}/raw`, { as: crew.technician }), routeParams({ id: testId }));
  expect(res.status).toBe(200);
  return (await res.json()).url;
}

describe("Content-Disposition file names (RFC 6266, RFC 5987)", () => {
  it("encodes the RFC 6266 §5 example name (€ rates) as RFC 5987 UTF-8 octets with an ASCII fallback", () => {
    expect(rfc5987Value("€ rates")).toBe("UTF-8''%E2%82%AC%20rates");
    expect(attachmentDisposition("€ rates")).toBe(`attachment; filename="_ rates"; filename*=UTF-8''%E2%82%AC%20rates`);
  });

  it.each(["ログ.csv", "Prüfung.csv", "Ølkjøler 3 (hold).csv", "quote\"and\\slash.csv"])("round-trips %s through the header, which stays printable ASCII", (name) => {
    const header = attachmentDisposition(name);
    expect(header).toMatch(/^[\x20-\x7e]+$/);
    expect(filenameFrom(header)).toBe(safeFilename(name));
  });

  it("drops directories and control characters from a name (RFC 6266 §4.3), and never uses it for the storage key's type", () => {
    expect(safeFilename("../../etc/passwd")).toBe("passwd");
    expect(safeFilename("C:\\logs\\a\u0007b.csv")).toBe("ab.csv");
    expect(rawLogKey("org", "t1", "page.html")).toBe("orgs/org/tests/t1/raw/page.csv");
    expect(rawLogKey("org", "t1", "ログ.csv")).toBe("orgs/org/tests/t1/raw/log.csv");
  });
});

describe("raw logs stored and served as text/csv attachments", () => {
  it.each([
    ["ログ.csv", "text/csv"],
    ["Prüfung.csv", "text/html"],
  ])("%s claimed as %s: the signed link and the bare object both answer text/csv, attachment, with the name intact and the exact bytes", async (name, claimed) => {
    const id = await upload(name, claimed);
    const [row] = await db().select().from(uploads).where(eq(uploads.testId, id));
    expect(row.contentType).toBe("text/csv");
    expect(row.filename).toBe(name);

    const signed = await fetch(await rawLink(id));
    expect(signed.status).toBe(200);
    expect(signed.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(signed.headers.get("content-disposition")).toMatch(/^attachment;/);
    expect(filenameFrom(signed.headers.get("content-disposition")!)).toBe(name);
    expect(sha256(new Uint8Array(await signed.arrayBuffer()))).toBe(sha256(sampleText(SAMPLE)));

    // The same object without the signature or the response-* parameters: the store's own metadata.
    const bare = new URL(await rawLink(id));
    bare.search = "";
    const unsigned = await fetch(bare);
    expect(unsigned.status).toBe(200);
    expect(unsigned.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(unsigned.headers.get("content-disposition")).toMatch(/^attachment;/);
    expect(filenameFrom(unsigned.headers.get("content-disposition")!)).toBe(name);
  });

  it("serves a log whose text is an HTML page as a text/csv attachment, never as a page", async () => {
    const html = `<html><body><script>fetch("/api/members/invitations",{method:"POST"})</script></body></html>\n${sampleText(SAMPLE)}`;
    const res = await testsPost(uploadRequest("/api/vacuum-tests", { as: crew.technician, file: { body: html, name: "evil.html", type: "text/html" } }));
    if (res.status !== 201) {
      expect(res.status).toBe(422); // refused as a log is as good: nothing stored
      return;
    }
    const id = (await res.json()).test.id;
    const bare = new URL(await rawLink(id));
    expect(bare.pathname).toMatch(/\/raw\/evil\.csv$/);
    bare.search = "";
    const got = await fetch(bare);
    expect(got.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(got.headers.get("content-disposition")).toMatch(/^attachment;/);
  });
});
