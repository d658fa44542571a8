import { db } from "@/db/client";
import { getOrganizationNameById, insertTestEvent } from "@/db/queries/review";
import { route, uuidParam } from "@/lib/api/handler";
import { reportMail } from "@/lib/notify/messages";
import { queueMail } from "@/lib/notify/outbox";
import { requireVisibleTest } from "@/lib/tests/read";
import { emailReportSchema } from "@/lib/review/schemas";

/** E-mail the report (PDF attached, built at send time) to a customer address. */
export const POST = route({ permission: "reports.share", params: uuidParam, body: emailReportSchema }, async ({ actor, params, body }) => {
  const row = await requireVisibleTest(db(), actor, params.id);
  const orgName = (await getOrganizationNameById(db(), { organizationId: actor.organizationId })) ?? actor.organizationName;
  const mail = reportMail(
    body.to,
    { id: params.id, title: row.test.title, verdict: row.test.verdict, technicianName: row.createdByName, siteName: row.siteName, organizationName: orgName, testedAt: row.test.testedAt },
    { message: body.message },
  );
  const ids = await db().transaction(async (tx) => {
    const queued = await queueMail(tx, [{ ...mail, organizationId: actor.organizationId, testId: params.id, attachment: "report_pdf" }]);
    await insertTestEvent(tx, { organizationId: actor.organizationId, testId: params.id, actorId: actor.userId, kind: "report_emailed", note: `To ${body.to}.` });
    return queued;
  });
  return Response.json({ outboxId: ids[0] }, { status: 202 });
});
