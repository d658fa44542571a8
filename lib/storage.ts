/**
 * Raw gauge logs in S3 (s3rver locally). Every call is bounded in time, and every failure to reach
 * the store becomes a 503 storage_unavailable.
 *
 * A raw log is stored as `text/csv` with `Content-Disposition: attachment` whatever the uploader's
 * browser claimed, so the stored object is harmless whoever serves it: the store itself answers an
 * unsigned or re-signed GET with those same headers (a fake store ignores signatures), so a log that
 * is really an HTML page is downloaded, never rendered (OWASP ASVS 4.0.3 V12.5.2, V14.4.1).
 */
import {
  S3Client, PutObjectCommand, GetObjectCommand, DeleteObjectCommand, HeadBucketCommand, ListObjectsV2Command,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { describeError, log } from "@/lib/log";
import { attachmentDisposition } from "@/lib/http/content-disposition";

/** The one type a raw log is stored and served as. */
export const RAW_LOG_CONTENT_TYPE = "text/csv";

const g = globalThis as unknown as { rlS3?: S3Client };

/**
 * An S3 client with Riseline's settings. Timeouts: connecting within S3_CONNECT_TIMEOUT_MS, the
 * whole request within S3_REQUEST_TIMEOUT_MS (thrown as an error, not only warned about), and a
 * socket silent for that long is closed — so a frozen store fails the call instead of holding it.
 */
export function createStorageClient(endpoint = env().S3_ENDPOINT): S3Client {
  const e = env();
  return new S3Client({
    region: e.S3_REGION,
    endpoint,
    forcePathStyle: true,
    credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
    // With the default checksum settings a streamed body is stored with chunk framing inside it.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    maxAttempts: 2,
    requestHandler: {
      connectionTimeout: e.S3_CONNECT_TIMEOUT_MS,
      requestTimeout: e.S3_REQUEST_TIMEOUT_MS,
      socketTimeout: e.S3_REQUEST_TIMEOUT_MS,
      throwOnRequestTimeout: true,
    },
  });
}

function client(): S3Client {
  g.rlS3 ??= createStorageClient();
  return g.rlS3;
}

/** Test seam: swap the S3 client (e.g. one pointed at a dead port); null restores the configured one. */
export function setStorageClientForTests(replacement: S3Client | null): void {
  g.rlS3 = replacement ?? undefined;
}

/**
 * Organization-scoped key for a raw gauge log; the test id keeps it unique. Only safe ASCII from
 * the uploader's name survives, and the key always ends in .csv, so no store guesses another type.
 */
export function rawLogKey(organizationId: string, testId: string, filename: string): string {
  const stem = filename.replace(/\.[A-Za-z0-9]{1,5}$/, "").replace(/[^A-Za-z0-9._-]+/g, "_").replace(/^[._]+/, "").slice(-76);
  return `orgs/${organizationId}/tests/${testId}/raw/${stem || "log"}.csv`;
}

/** Runs one call to the store; a failure to reach it (refused, timed out, 5xx) is a 503. */
async function call<T>(what: string, key: string, run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (err) {
    if ((err as Error)?.name === "AbortError") throw err;
    log.error(`storage: ${what} failed`, { objectKey: key, err: describeError(err) });
    throw new AppError("storage_unavailable");
  }
}

/**
 * Stores a raw log as text/csv, attachment, under its original file name (RFC 6266 with the
 * RFC 5987 UTF-8 form). `signal` aborts the upload when the request that carries it goes away.
 */
export async function putRawLog(key: string, body: Uint8Array, filename: string, sha256Hex: string, signal?: AbortSignal): Promise<void> {
  await call("store", key, () =>
    client().send(
      new PutObjectCommand({
        Bucket: env().S3_BUCKET,
        Key: key,
        Body: body,
        ContentType: RAW_LOG_CONTENT_TYPE,
        ContentDisposition: attachmentDisposition(filename),
        Metadata: { sha256: sha256Hex },
      }),
      { abortSignal: signal },
    ),
  );
}

export async function getObjectBytes(key: string): Promise<Uint8Array> {
  return call("read", key, async () => {
    const out = await client().send(new GetObjectCommand({ Bucket: env().S3_BUCKET, Key: key }));
    if (!out.Body) throw new Error(`object ${key} has no body`);
    return out.Body.transformToByteArray();
  });
}

export async function deleteObject(key: string): Promise<void> {
  await call("delete", key, () => client().send(new DeleteObjectCommand({ Bucket: env().S3_BUCKET, Key: key })));
}

/**
 * A short-lived download link (default 5 minutes). The link itself asks for text/csv and an
 * attachment with the file's own name; the stored object carries the same, should the link's
 * signature or parameters be stripped.
 */
export async function presignedGetUrl(key: string, filename: string, seconds = 300): Promise<string> {
  return getSignedUrl(
    client(),
    new GetObjectCommand({
      Bucket: env().S3_BUCKET,
      Key: key,
      ResponseContentType: RAW_LOG_CONTENT_TYPE,
      ResponseContentDisposition: attachmentDisposition(filename),
    }),
    { expiresIn: seconds },
  );
}

/** Every stored object under a prefix with its last-modified time, a page (up to 1,000) at a time. */
export async function* listStoredObjects(prefix: string): AsyncGenerator<{ key: string; lastModified: Date }[]> {
  let token: string | undefined;
  do {
    const out = await client().send(new ListObjectsV2Command({ Bucket: env().S3_BUCKET, Prefix: prefix, ContinuationToken: token }));
    yield (out.Contents ?? []).filter((c) => c.Key && c.LastModified).map((c) => ({ key: c.Key!, lastModified: c.LastModified! }));
    token = out.IsTruncated ? out.NextContinuationToken : undefined;
  } while (token);
}

/** Whether the bucket answers within `timeoutMs` (health checks must answer fast). */
export async function bucketReachable(timeoutMs = 2000): Promise<boolean> {
  try {
    await client().send(new HeadBucketCommand({ Bucket: env().S3_BUCKET }), { abortSignal: AbortSignal.timeout(timeoutMs) });
    return true;
  } catch {
    return false;
  }
}
