import { z } from "zod";
import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { requireRevealedTest } from "@/lib/vacuum-tests/read";
import { buildReportModel } from "@/lib/reports/model";
import { pdfResponse } from "@/lib/reports/respond";

/** The test's report as a PDF, for any member who can see the test. */
export const GET = route(
  { policy: "vacuumTest.read", params: z.object({ id: z.string().uuid("not a valid id") }), query: z.object({ download: z.enum(["1", "0"]).optional() }) },
  async ({ actor, params, query }) => {
    await requireRevealedTest(db(), actor, params.id);
    const model = await buildReportModel(db(), { organizationId: actor.organizationId, testId: params.id });
    if (!model) throw new AppError("not_found", "No such test.");
    return pdfResponse(model, query.download !== "1");
  },
);
