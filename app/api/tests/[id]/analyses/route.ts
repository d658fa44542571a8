import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { reanalyseTest } from "@/lib/tests/analyse";
import { reanalysisSchema } from "@/lib/tests/schemas";

export const dynamic = "force-dynamic";

/** POST /api/tests/:id/analyses — re-run with overrides; 201 { analysis, version, analysisId }. */
export const POST = route({ permission: "tests.reanalyse", params: uuidParam, body: reanalysisSchema }, async ({ actor, params, body }) =>
  Response.json(await reanalyseTest(db(), actor, params.id, body), { status: 201 }),
);
