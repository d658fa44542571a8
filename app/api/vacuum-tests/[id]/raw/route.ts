import { db } from "@/db/client";
import { getUploadByTest } from "@/db/queries/vacuum-tests";
import { route, uuidParam } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { presignedGetUrl } from "@/lib/storage";
import { requireVisibleTest } from "@/lib/vacuum-tests/read";

export const dynamic = "force-dynamic";

const EXPIRES_IN_SECONDS = 300;

/** GET /api/vacuum-tests/:id/raw — a 5-minute link to the file exactly as uploaded. */
export const GET = route({ policy: "vacuumTest.read", params: uuidParam }, async ({ actor, params }) => {
  await requireVisibleTest(db(), actor, params.id);
  const upload = await getUploadByTest(db(), { organizationId: actor.organizationId, testId: params.id });
  if (!upload) throw new AppError("not_found", "This test has no raw file.");
  const url = await presignedGetUrl(upload.objectKey, upload.filename, EXPIRES_IN_SECONDS);
  return { url, expiresInSeconds: EXPIRES_IN_SECONDS };
});
