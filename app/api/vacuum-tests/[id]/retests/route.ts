import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { uploadRetest } from "@/lib/review/retest";
import { retestFieldsSchema } from "@/lib/review/schemas";
import { loadTestDetail } from "@/lib/vacuum-tests/read";
import { readPreviewFile } from "@/lib/vacuum-tests/request";
import { idempotencyKeySchema, parseInput } from "@/lib/vacuum-tests/schemas";

export const dynamic = "force-dynamic";

/**
 * POST /api/vacuum-tests/:id/retests — the re-test log of a sent-back test (multipart `file`, optional
 * `note`; Idempotency-Key honoured). Stores the file, makes a new current analysis and resubmits
 * the test for review. 201 { test, analysis, analysisId, version, status }; 200 with the same
 * analysis for a retried key (the same person, the same file and note); 422 for an unreadable log
 * or a key already used for a different request (nothing changed); 409 unless sent back.
 */
export const POST = route({ policy: "vacuumTest.retest", params: uuidParam, accepts: ["multipart"] }, async ({ req, actor, params, form }) => {
  const rawKey = req.headers.get("idempotency-key");
  const idempotencyKey = rawKey === null ? undefined : parseInput(idempotencyKeySchema, rawKey, "Idempotency-Key");
  const { file, fields } = await readPreviewFile({ form }); // the file under the upload cap, refused unless a text log
  const { note } = parseInput(retestFieldsSchema, fields, "form");
  const out = await uploadRetest(db(), actor, params.id, { file, note, idempotencyKey, signal: req.signal });
  const detail = await loadTestDetail(db(), actor, params.id);
  return Response.json(
    { test: detail.test, analysis: out.analysis, analysisId: out.analysisId, version: out.version, status: out.status },
    { status: out.created ? 201 : 200 },
  );
});
