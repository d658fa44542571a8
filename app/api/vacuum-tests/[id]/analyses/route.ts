import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { reanalyseTest } from "@/lib/vacuum-tests/analyse";
import { idempotencyKeySchema, parseInput, reanalysisSchema } from "@/lib/vacuum-tests/schemas";

export const dynamic = "force-dynamic";

/**
 * POST /api/vacuum-tests/:id/analyses — re-run with overrides; 201 { analysis, version, analysisId };
 * 200 with the same version for a retried Idempotency-Key (422 if the key came with other overrides).
 */
export const POST = route({ policy: "vacuumTest.reanalyse", params: uuidParam, body: reanalysisSchema }, async ({ req, actor, params, body }) => {
  const rawKey = req.headers.get("idempotency-key");
  const key = rawKey === null ? undefined : parseInput(idempotencyKeySchema, rawKey, "Idempotency-Key");
  const { created, ...out } = await reanalyseTest(db(), actor, params.id, body, key);
  return Response.json(out, { status: created ? 201 : 200 });
});
