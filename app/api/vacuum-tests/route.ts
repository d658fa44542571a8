import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { listTests, loadTestSummary } from "@/lib/vacuum-tests/read";
import { readUploadRequest } from "@/lib/vacuum-tests/request";
import { idempotencyKeySchema, listTestsQuerySchema, parseInput } from "@/lib/vacuum-tests/schemas";
import { createTestFromUpload } from "@/lib/vacuum-tests/upload";
import { taskDto } from "@/lib/jobs/tasks";

export const dynamic = "force-dynamic";

/**
 * POST /api/vacuum-tests — upload a gauge log (multipart `file` + metadata) or typed readings (JSON).
 * 201 { test, analysis } for a new test; 200 with the first test for a retried Idempotency-Key
 * (the same person, the same request; a different request with the key is a 422).
 * An apprentice's practice test is saved and answered 201 with `analysis: null` and
 * `practiceCallUrl`: the verdict shows once they have made their call there.
 * A large log (over ANALYSIS_JOB_MIN_KB) is queued: 202 { task } to follow at /api/tasks/:id
 * (a retry of it answers 202 with the same task, or 200 with the test once it is made).
 */
export const POST = route({ policy: "vacuumTest.upload", accepts: ["json", "multipart"] }, async ({ req, actor, form, json }) => {
  const rawKey = req.headers.get("idempotency-key");
  const idempotencyKey = rawKey === null ? undefined : parseInput(idempotencyKeySchema, rawKey, "Idempotency-Key");
  const input = await readUploadRequest(req, { form, json });
  const outcome = await createTestFromUpload(db(), actor, { ...input, idempotencyKey, signal: req.signal });
  if (outcome.task && !(outcome.task.state === "done" && outcome.task.testId)) return Response.json({ task: taskDto(outcome.task) }, { status: 202 });
  const summary = await loadTestSummary(db(), actor, outcome.testId, outcome);
  return Response.json(summary, { status: outcome.created ? 201 : 200 });
});

/** GET /api/vacuum-tests — the tests the caller may see, newest first, cursor-paginated. */
export const GET = route({ policy: "vacuumTest.list", query: listTestsQuerySchema }, async ({ actor, query }) => listTests(db(), actor, query));
