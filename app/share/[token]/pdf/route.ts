import { z } from "zod";
import { db } from "@/db/client";
import { publicRoute } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { buildReportModel } from "@/lib/reports/model";
import { pdfResponse } from "@/lib/reports/respond";
import { resolveShareToken } from "@/lib/reports/share";

/** The shared report as a PDF; an expired, revoked or unknown link is 404 (no hint which). */
export const GET = publicRoute({ params: z.object({ token: z.string().max(100) }) }, async ({ params }) => {
  const link = await resolveShareToken(db(), { token: params.token });
  if (link.status !== "ok") throw new AppError("not_found", "This link has expired or was revoked.");
  const model = await buildReportModel(db(), { organizationId: link.organizationId, testId: link.testId });
  if (!model) throw new AppError("not_found", "This link has expired or was revoked.");
  return pdfResponse(model, true);
});
