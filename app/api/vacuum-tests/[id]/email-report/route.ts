import { db } from "@/db/client";
import { insertTestEvent } from "@/db/queries/review";
import { route, uuidParam } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { reportMail } from "@/lib/notify/messages";
import { queueMail } from "@/lib/notify/outbox";
import { buildReportModel } from "@/lib/reports/model";
import { requireVisibleTest } from "@/lib/vacuum-tests/read";
import { emailReportSchema } from "@/lib/review/schemas";

/** E-mail the report (PDF attached, built at send time) to a customer address; the message quotes the report's own words. */
export const POST = route({ policy: "vacuumTest.share", params: uuidParam, body: emailReportSchema }, async ({ actor, params, body }) => {
  await requireVisibleTest(db(), actor, params.id);
  const model = await buildReportModel(db(), { organizationId: actor.organizationId, testId: params.id });
  if (!model) throw new AppError("not_found", "No such test.");
  const mail = reportMail(
    body.to,
    {
      id: params.id, title: model.title, verdict: model.verdict, meetsProfile: model.meetsProfile, technicianName: model.technicianName,
      siteName: model.siteName, organizationName: model.organizationName || actor.organizationName, testedOn: model.testedOn,
    },
    { message: body.message, hold: model.story?.holdSentence ?? null, customerNote: model.customerNote },
  );
  const ids = await db().transaction(async (tx) => {
    const queued = await queueMail(tx, [{ ...mail, organizationId: actor.organizationId, testId: params.id, attachment: "report_pdf" }]);
    await insertTestEvent(tx, { organizationId: actor.organizationId, testId: params.id, actorId: actor.userId, kind: "report_emailed", note: `To ${body.to}.` });
    return queued;
  });
  return Response.json({ outboxId: ids[0] }, { status: 202 });
});
