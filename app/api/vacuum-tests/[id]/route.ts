import { z } from "zod";
import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { loadTestDetail, loadTestDetailAtAnalysis } from "@/lib/vacuum-tests/read";
import { setCustomerNote } from "@/lib/vacuum-tests/customer-note";
import { testNoteSchema } from "@/lib/vacuum-tests/schemas";

export const dynamic = "force-dynamic";

const query = z.object({
  analysisId: z.preprocess((v) => (v === "" ? undefined : v), z.string().uuid("not an analysis id (a UUID)").optional()),
});

/**
 * GET /api/vacuum-tests/:id — { test, analysis, series, history, upload }; 404 unless visible.
 * With ?analysisId= the analysis and series are that earlier version's, plus
 * `shown: { analysisId, version, versionCount, isCurrent }`; an analysis not of this test is a 404.
 */
export const GET = route({ policy: "vacuumTest.read", params: uuidParam, query }, async ({ actor, params, query }) =>
  query.analysisId ? loadTestDetailAtAnalysis(db(), actor, params.id, query.analysisId) : loadTestDetail(db(), actor, params.id),
);

/** PATCH /api/vacuum-tests/:id — { customerNote }: the note on the customer's copy of the report. */
export const PATCH = route({ policy: "vacuumTest.writeCustomerNote", params: uuidParam, body: testNoteSchema }, async ({ actor, params, body }) =>
  setCustomerNote(db(), actor, params.id, body.customerNote),
);
