import {
  S3Client, PutObjectCommand, GetObjectCommand, DeleteObjectCommand, HeadBucketCommand, ListObjectsV2Command,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { env } from "@/lib/env";

const g = globalThis as unknown as { rlS3?: S3Client };

function client(): S3Client {
  if (!g.rlS3) {
    const e = env();
    g.rlS3 = new S3Client({
      region: e.S3_REGION,
      endpoint: e.S3_ENDPOINT,
      forcePathStyle: true,
      credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
      // With the default checksum settings a streamed body is stored with chunk framing inside it.
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
      maxAttempts: 2,
    });
  }
  return g.rlS3;
}

/** Test seam: swap the S3 client (e.g. one pointed at a dead port); null restores the configured one. */
export function setStorageClientForTests(replacement: S3Client | null): void {
  g.rlS3 = replacement ?? undefined;
}

/** Organization-scoped key for a raw gauge log; the test id keeps it unique. */
export function rawLogKey(organizationId: string, testId: string, filename: string): string {
  const safe = filename.replace(/[^A-Za-z0-9._-]+/g, "_").slice(-80) || "log.csv";
  return `orgs/${organizationId}/tests/${testId}/raw/${safe}`;
}

export async function putObject(key: string, body: Uint8Array, contentType: string, sha256Hex: string): Promise<void> {
  await client().send(
    new PutObjectCommand({
      Bucket: env().S3_BUCKET,
      Key: key,
      Body: body,
      ContentType: contentType,
      Metadata: { sha256: sha256Hex },
    }),
  );
}

export async function getObjectBytes(key: string): Promise<Uint8Array> {
  const out = await client().send(new GetObjectCommand({ Bucket: env().S3_BUCKET, Key: key }));
  if (!out.Body) throw new Error(`object ${key} has no body`);
  return out.Body.transformToByteArray();
}

export async function deleteObject(key: string): Promise<void> {
  await client().send(new DeleteObjectCommand({ Bucket: env().S3_BUCKET, Key: key }));
}

/** A short-lived download link (default 5 minutes). */
export async function presignedGetUrl(key: string, filename: string, seconds = 300): Promise<string> {
  return getSignedUrl(
    client(),
    new GetObjectCommand({
      Bucket: env().S3_BUCKET,
      Key: key,
      ResponseContentDisposition: `attachment; filename="${filename.replace(/"/g, "")}"`,
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

export async function bucketReachable(): Promise<boolean> {
  try {
    await client().send(new HeadBucketCommand({ Bucket: env().S3_BUCKET }));
    return true;
  } catch {
    return false;
  }
}
